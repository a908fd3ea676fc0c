// Nominal pipe sizes as the trade writes them: "1/2", "1-1/4", "2-1/2", "24".
// The list is the IPS size list of ASTM D1785's table [pub]; no other size is accepted.

import { show } from './result';

export const NOMINAL_SIZES = [
  '1/2', '3/4', '1', '1-1/4', '1-1/2', '2', '2-1/2', '3', '3-1/2', '4',
  '5', '6', '8', '10', '12', '14', '16', '18', '20', '24',
] as const;

export type NominalSize = (typeof NOMINAL_SIZES)[number];

/** Parses "1-1/4", "1 1/4", "3/4", "2.5", "1/2 in", '2"' into inches; null for anything else. */
export function parseInchFraction(input: string): number | null {
  const s = input.trim();
  const mixed = /^(\d+)(?:[-\s]+(\d+)\/(\d+))?$/.exec(s);
  if (mixed) {
    const whole = Number(mixed[1]);
    if (mixed[2] === undefined || mixed[3] === undefined) return whole;
    const den = Number(mixed[3]);
    return den === 0 ? null : whole + Number(mixed[2]) / den;
  }
  const frac = /^(\d+)\/(\d+)$/.exec(s);
  if (frac) {
    const den = Number(frac[2]);
    return den === 0 ? null : Number(frac[1]) / den;
  }
  return /^(\d+\.?\d*|\.\d+)$/.test(s) ? Number(s) : null;
}

const SIZE_VALUES: ReadonlyMap<NominalSize, number> = new Map(
  NOMINAL_SIZES.map((size) => [size, parseInchFraction(size) ?? Number.NaN]),
);

function stripUnit(s: string): string {
  return s
    .trim()
    .replace(/^(nps|dn)\s*/i, '')
    .replace(/\s*("|''|in\.?|inch|inches)$/i, '')
    .trim();
}

/** The inches of a listed nominal size, or null when the string is not one of NOMINAL_SIZES. */
export function parseNominalSize(input: unknown): number | null {
  if (typeof input !== 'string' && typeof input !== 'number') return null;
  const value = parseInchFraction(stripUnit(String(input)));
  if (value === null) return null;
  for (const v of SIZE_VALUES.values()) if (Math.abs(v - value) < 1e-9) return v;
  return null;
}

/** The trade's label for a listed size in inches ("1-1/4"), or null. */
export function nominalSizeLabel(inches: number): NominalSize | null {
  for (const [size, v] of SIZE_VALUES) if (Math.abs(v - inches) < 1e-9) return size;
  return null;
}

export function unknownSizeReason(input: unknown): string {
  return `"${show(input)}" is not a listed nominal pipe size (listed: ${NOMINAL_SIZES.join(', ')}).`;
}
