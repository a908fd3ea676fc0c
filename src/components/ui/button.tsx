import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';
const STYLES: Record<Variant, string> = {
  primary: 'bg-tide text-white hover:bg-tide-dark disabled:bg-ink-faint',
  secondary: 'border border-ink/20 bg-paper-raised text-ink hover:bg-paper-sunk disabled:text-ink-faint',
  danger: 'bg-refuse text-white hover:brightness-95 disabled:bg-ink-faint',
  ghost: 'text-tide hover:bg-tide-light/50',
};

/** Touch-sized (at least 44 px high) so a gloved hand can hit it. */
export function Button({ variant = 'primary', className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      {...props}
      className={`inline-flex min-h-11 items-center justify-center gap-2 rounded-lg px-4 py-2 text-sm font-semibold disabled:cursor-not-allowed ${STYLES[variant]} ${className}`}
    />
  );
}
