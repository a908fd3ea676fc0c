import { forwardRef, type InputHTMLAttributes } from 'react';

const control = 'min-h-12 w-full rounded-lg border bg-paper-raised py-2 pl-3 pr-14 text-lg tabular-nums focus:border-tide';

/** A large text input with its unit written inside on the right. */
export const UnitInput = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement> & { unit: string; invalid?: boolean }>(
  function UnitInput({ unit, invalid, className = '', ...props }, ref) {
    return (
      <span className="relative block">
        <input
          ref={ref}
          autoComplete="off"
          aria-invalid={invalid || undefined}
          {...props}
          className={`${control} ${invalid ? 'border-refuse' : 'border-ink/25'} ${className}`}
        />
        <span aria-hidden className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-sm font-semibold text-ink-soft">
          {unit}
        </span>
      </span>
    );
  },
);
