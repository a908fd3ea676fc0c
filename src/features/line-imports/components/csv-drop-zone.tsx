import { useId, useState, type DragEvent } from 'react';

/**
 * A large target for choosing a CSV file: tap to open the file chooser, or drop a file on it.
 * The real input stays in the page (visually hidden) so keyboards and tests reach it.
 */
export function CsvDropZone({ onFile, busy }: { onFile: (file: File) => void; busy?: boolean }) {
  const id = useId();
  const [over, setOver] = useState(false);
  const drop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    const file = e.dataTransfer.files[0];
    if (file && !busy) onFile(file);
  };
  return (
    <label
      htmlFor={id}
      onDragOver={(e) => (e.preventDefault(), setOver(true))}
      onDragLeave={() => setOver(false)}
      onDrop={drop}
      className={`flex min-h-44 cursor-pointer flex-col items-center justify-center gap-2 rounded-xl border-2 border-dashed px-6 py-8 text-center transition-colors focus-within:outline focus-within:outline-3 focus-within:outline-tide ${
        over ? 'border-tide bg-tide-light/50' : 'border-ink/25 bg-paper-raised hover:border-tide/60 hover:bg-tide-light/20'
      } ${busy ? 'pointer-events-none opacity-70' : ''}`}
    >
      <svg aria-hidden width="40" height="40" viewBox="0 0 40 40" className="text-tide">
        <path d="M10 4h14l8 8v24H10z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
        <path d="M24 4v8h8M21 30V18m-5 5 5-5 5 5" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
      <span className="text-lg font-semibold">{busy ? 'Reading the file…' : 'Choose a CSV file'}</span>
      <span className="text-sm text-ink-soft">{busy ? 'Every row is checked against the register.' : 'or drop it here. Nothing is written until you confirm the preview.'}</span>
      <input
        id={id}
        type="file"
        accept=".csv,text/csv"
        disabled={busy}
        className="sr-only"
        onChange={(e) => {
          const file = e.target.files?.[0];
          e.target.value = ''; // choosing the same file again after a fix must fire again
          if (file) onFile(file);
        }}
      />
    </label>
  );
}
