import type { ComponentProps, ReactNode } from 'react';

/** A confirmation a gloved finger can hit: the whole row (56 px) toggles it. Spread react-hook-form's `register()` into it. */
export function BigCheck({ label, hint, error, ...input }: ComponentProps<'input'> & { label: ReactNode; hint?: ReactNode; error?: string }) {
  return (
    <div>
      <label className="flex min-h-14 cursor-pointer items-center gap-4 rounded-lg border-2 border-ink/20 bg-paper-raised px-4 py-2 has-[:checked]:border-tide has-[:checked]:bg-tide-light/50 has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-tide">
        <input type="checkbox" className="h-7 w-7 shrink-0 accent-tide" {...input} />
        <span className="min-w-0">
          <span className="block text-lg font-medium">{label}</span>
          {hint && <span className="block text-sm text-ink-soft">{hint}</span>}
        </span>
      </label>
      {error && <p className="mt-1 text-sm font-medium text-refuse">{error}</p>}
    </div>
  );
}
