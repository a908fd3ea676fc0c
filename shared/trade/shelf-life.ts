// Cement shelf life: about two years from the date stamped on the can [mfr]. Discard cement that
// has gelled or thickened, and never thin it. A 29 February stamp expires on 28 February
// (the earlier date) two years on.

import { refuse, type Refusal } from './result';
import { SOURCES } from './sources';

export const SHELF_LIFE_YEARS = 2;
const DAY = 86_400_000;

function toDate(x: Date | number | string): Date {
  return x instanceof Date ? new Date(x.getTime()) : new Date(x);
}

export function addYearsUtc(d: Date, years: number): Date {
  const out = new Date(d.getTime());
  out.setUTCFullYear(d.getUTCFullYear() + years);
  if (out.getUTCMonth() !== d.getUTCMonth()) out.setUTCDate(0); // rolled into March: back to the last day of February
  return out;
}

export function cementShelfLife(input: { manufacturedOn: Date | number | string; now: Date | number }):
  | { ok: true; expiresAt: Date; expired: boolean; daysLeft: number; text: string; source: string }
  | Refusal {
  const made = toDate(input.manufacturedOn);
  const now = toDate(input.now);
  if (Number.isNaN(made.getTime()) || Number.isNaN(now.getTime())) return refuse('Manufacture date and now must be dates.');
  if (made.getTime() > now.getTime() + DAY) return refuse('The manufacture date is in the future: check the stamp.');
  const expiresAt = addYearsUtc(made, SHELF_LIFE_YEARS);
  const expired = now.getTime() >= expiresAt.getTime();
  const daysLeft = expired ? 0 : Math.floor((expiresAt.getTime() - now.getTime()) / DAY);
  return {
    ok: true,
    expiresAt,
    expired,
    daysLeft,
    text: expired
      ? 'Past its shelf life: do not use.'
      : 'In date. Discard it anyway if it has gelled or thickened; never thin cement.',
    source: SOURCES.shelfLife,
  };
}
