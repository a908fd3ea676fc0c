import type { ButtonHTMLAttributes } from 'react';
import { Link, type LinkProps } from 'react-router-dom';

type Variant = 'primary' | 'secondary' | 'danger' | 'ghost';
/** `md` for most; `lg` on the shift tablet (48 px, gloved hands); `wide` for a page's single call to action (fills its column, larger type). */
type Size = 'md' | 'lg' | 'wide';

// A disabled button fades to half-strength ink: it is not text to read, and must not look pressable.
const STYLES: Record<Variant, string> = {
  primary: 'bg-tide text-white hover:bg-tide-dark disabled:bg-ink/50',
  secondary: 'border border-ink/20 bg-paper-raised text-ink hover:bg-paper-sunk disabled:text-ink/50 disabled:hover:bg-paper-raised',
  danger: 'bg-refuse text-white hover:brightness-95 disabled:bg-ink/50',
  ghost: 'text-tide hover:bg-tide-light/50',
};
const SIZES: Record<Size, string> = {
  md: 'inline-flex min-h-11 text-sm',
  lg: 'inline-flex min-h-12 text-base',
  wide: 'flex min-h-12 w-full text-lg',
};

/**
 * The classes of a button, for anything that must look like one (a link that downloads, a link to
 * another page). Touch-sized (at least 44 px high) so a gloved hand can hit it.
 */
export function buttonClass(variant: Variant = 'primary', { size = 'md', className = '' }: { size?: Size; className?: string } = {}): string {
  return `${SIZES[size]} items-center justify-center gap-2 rounded-lg px-4 py-2 font-semibold disabled:cursor-not-allowed ${STYLES[variant]} ${className}`.trim();
}

export function Button({ variant = 'primary', size, className = '', ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: Size }) {
  return <button {...props} className={buttonClass(variant, { size, className })} />;
}

/** A link to another page of the app that looks like a button. */
export function ButtonLink({ variant = 'primary', size, className, ...props }: LinkProps & { variant?: Variant; size?: Size }) {
  return <Link {...props} className={buttonClass(variant, { size, className })} />;
}
