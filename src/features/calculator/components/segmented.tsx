import type { ReactNode } from 'react';

export interface SegmentOption<T extends string> {
  value: T;
  label: ReactNode;
}

/**
 * A row of large radio buttons (each at least 44 px high) for a choice of two to four:
 * one touch on a tablet, in gloves, instead of opening a list.
 */
export function Segmented<T extends string>({ legend, name, options, value, onChange, tone }: {
  legend: ReactNode;
  name: string;
  options: readonly SegmentOption<T>[];
  value: T;
  onChange: (value: T) => void;
  /** Mark a chosen value as a problem (for example a gas test medium). */
  tone?: (value: T) => 'refuse' | undefined;
}) {
  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 block text-sm font-medium text-ink-soft">{legend}</legend>
      <div className="flex rounded-lg border border-ink/25 bg-paper-sunk p-0.5">
        {options.map((o) => {
          const checked = o.value === value;
          const refused = checked && tone?.(o.value) === 'refuse';
          return (
            <label
              key={o.value}
              className={`relative flex min-h-11 flex-1 cursor-pointer items-center justify-center rounded-md px-2 text-center text-base font-semibold has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-tide ${
                refused ? 'bg-refuse text-white' : checked ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-raised'
              }`}
            >
              <input type="radio" className="absolute inset-0 h-full w-full cursor-pointer opacity-0" name={name} value={o.value} checked={checked} onChange={() => onChange(o.value)} />
              {o.label}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}
