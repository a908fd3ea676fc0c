// The viewer's time zone: a `datetime-local` or `date` field holds a wall-clock time with no zone;
// the browser reads it as local time, and the API gets an ISO instant.

const pad = (n: number) => String(n).padStart(2, '0');

/** "2027-03-01T06:00" (local) → "2027-03-01T12:00:00.000Z"; empty → null. */
export function localInputToIso(value: string): string | null {
  if (!value) return null;
  const d = new Date(value); // a date-time without an offset is local time
  return Number.isNaN(d.getTime()) ? null : d.toISOString();
}

/** An instant → the `datetime-local` value of the same moment in the viewer's zone. */
export function isoToLocalInput(iso: string | null | undefined): string {
  if (!iso) return '';
  const d = new Date(iso);
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** A day picked in a `date` field → its first (or, for an end, its last) instant in the viewer's zone. */
export function dayInputToIso(value: string, endOfDay = false): string | undefined {
  if (!value) return undefined;
  const [y, m, d] = value.split('-').map(Number);
  const at = endOfDay ? new Date(y!, m! - 1, d! + 1) : new Date(y!, m! - 1, d!);
  return at.toISOString();
}

export function isoToDayInput(iso: string | undefined, endOfDay = false): string {
  if (!iso) return '';
  const d = new Date(Date.parse(iso) - (endOfDay ? 1 : 0));
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/** Monday 00:00 local of the week holding `day`. */
export function weekStart(day: Date): Date {
  const d = new Date(day.getFullYear(), day.getMonth(), day.getDate());
  d.setDate(d.getDate() - ((d.getDay() + 6) % 7));
  return d;
}

export const addDays = (d: Date, n: number) => new Date(d.getFullYear(), d.getMonth(), d.getDate() + n);
export const dayKey = (d: Date) => `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
