import { usePopover } from '@/components/ui/use-popover';

export interface CheckOption {
  value: string;
  label: string;
}

/**
 * A button that opens a list of check boxes: a multi-choice filter that a gloved finger can use
 * (every row is 44 px high), unlike a native multiple select. Closes on Escape or a tap outside.
 */
export function CheckMenu({ label, options, selected, onChange }: { label: string; options: CheckOption[]; selected: string[]; onChange: (next: string[]) => void }) {
  const { open, setOpen, root, panelId } = usePopover();

  const toggle = (value: string) => onChange(selected.includes(value) ? selected.filter((v) => v !== value) : [...selected, value]);
  const count = selected.length;

  return (
    <div ref={root} className="relative">
      <button
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((o) => !o)}
        className={`inline-flex min-h-11 items-center gap-2 rounded-lg border px-3 py-2 text-sm font-medium ${
          count ? 'border-tide bg-tide-light/60 text-ink' : 'border-ink/20 bg-paper-raised text-ink hover:bg-paper-sunk'
        }`}
      >
        {label}
        {count > 0 && <span className="rounded-full bg-tide px-2 text-xs font-semibold text-white">{count}</span>}
        <svg aria-hidden width="12" height="12" viewBox="0 0 12 12" className={open ? 'rotate-180' : ''}>
          <path d="M2 4l4 4 4-4" fill="none" stroke="currentColor" strokeWidth="1.8" />
        </svg>
      </button>
      {open && (
        <div id={panelId} role="group" aria-label={label} className="absolute left-0 z-30 mt-1 max-h-80 min-w-56 overflow-y-auto rounded-lg border border-ink/15 bg-paper-raised p-1 shadow-lg">
          {options.length === 0 && <p className="px-3 py-2 text-sm text-ink-faint">Nothing to choose yet</p>}
          {options.map((o) => (
            <label key={o.value} className="flex min-h-11 cursor-pointer items-center gap-3 rounded-md px-3 text-sm hover:bg-paper-sunk">
              <input type="checkbox" className="h-5 w-5 accent-tide" checked={selected.includes(o.value)} onChange={() => toggle(o.value)} />
              {o.label}
            </label>
          ))}
          {count > 0 && (
            <button type="button" onClick={() => onChange([])} className="mt-1 min-h-11 w-full rounded-md px-3 text-left text-sm font-medium text-tide hover:bg-tide-light/50">
              Clear {label.toLowerCase()}
            </button>
          )}
        </div>
      )}
    </div>
  );
}
