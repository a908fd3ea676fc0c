import type { ReactNode } from 'react';

/** A checkbox with its words as one large target (48 px), for a gloved hand on a tablet. */
export function CheckRow({ checked, onChange, children, error, name }: { checked: boolean; onChange: (checked: boolean) => void; children: ReactNode; error?: string; name?: string }) {
  return (
    <div>
      <label className="flex min-h-12 cursor-pointer items-center gap-3 rounded-lg border border-ink/15 bg-paper-raised px-3 py-2 text-sm has-[:checked]:border-tide has-[:checked]:bg-tide-light/40">
        <input type="checkbox" name={name} className="h-6 w-6 shrink-0 accent-tide" checked={checked} onChange={(e) => onChange(e.target.checked)} aria-invalid={error ? true : undefined} />
        <span>{children}</span>
      </label>
      {error && <p className="mt-1 text-sm text-refuse">{error}</p>}
    </div>
  );
}
