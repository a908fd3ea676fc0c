import { useId, useState } from 'react';
import { prepareJointPhoto } from '../photo';
import { LocalThumb } from './photo-thumbs';

/**
 * Takes photos with the tablet's rear camera (or picks them), makes each upright and at most
 * 2048 px as JPEG, and hands the list up; each can be removed before the step is recorded.
 */
export function PhotoCapture({ label, photos, onChange, error }: { label: string; photos: Blob[]; onChange: (photos: Blob[]) => void; error?: string }) {
  const id = useId();
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function take(files: FileList | null) {
    if (!files?.length) return;
    setBusy(true);
    setProblem(null);
    const made: Blob[] = [];
    for (const file of Array.from(files)) {
      try {
        made.push(await prepareJointPhoto(file));
      } catch {
        setProblem(`${file.name || 'A photo'} could not be read as an image. Take it again with the camera, as a JPEG.`);
      }
    }
    setBusy(false);
    onChange([...photos, ...made]);
  }

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <label
          htmlFor={id}
          className="inline-flex min-h-12 cursor-pointer items-center gap-2 rounded-lg border-2 border-tide bg-paper-raised px-5 text-lg font-semibold text-tide hover:bg-tide-light/50 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-tide"
        >
          <svg aria-hidden width="24" height="24" viewBox="0 0 24 24">
            <path d="M4 7h3l2-3h6l2 3h3v13H4z" fill="none" stroke="currentColor" strokeWidth="2" />
            <circle cx="12" cy="13" r="4" fill="none" stroke="currentColor" strokeWidth="2" />
          </svg>
          {label}
          <input
            id={id}
            type="file"
            accept="image/*"
            capture="environment"
            multiple
            className="sr-only"
            disabled={busy}
            onChange={(e) => {
              void take(e.target.files);
              e.target.value = '';
            }}
          />
        </label>
        <span className="text-ink-soft" aria-live="polite">
          {busy ? 'Preparing the photo…' : photos.length === 1 ? '1 photo taken' : `${photos.length} photos taken`}
        </span>
      </div>
      {photos.length > 0 && (
        <ul className="flex flex-wrap gap-2">
          {photos.map((p, i) => (
            <li key={i} className="flex flex-col items-center gap-1">
              <LocalThumb blob={p} alt={`Photo ${i + 1}, not yet recorded`} />
              <button type="button" className="min-h-12 rounded-lg px-3 text-sm font-semibold text-refuse hover:bg-refuse-light" onClick={() => onChange(photos.filter((_, j) => j !== i))}>
                Remove {i + 1}
              </button>
            </li>
          ))}
        </ul>
      )}
      {problem && <p className="text-sm font-medium text-refuse">{problem}</p>}
      {error && <p className="text-sm font-medium text-refuse">{error}</p>}
    </div>
  );
}
