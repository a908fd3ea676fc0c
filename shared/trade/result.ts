// The one result shape every trade rule returns: a value, or a refusal that says why.
// Rules never throw for bad input; a person can read `reason` on the screen.

export interface Refusal {
  ok: false;
  reason: string;
}

export function refuse(reason: string): Refusal {
  return { ok: false, reason };
}

/** Said wherever a table has no published value, so the hold can still be set by a person. */
export const SUPERVISOR_MAY_ENTER =
  'A supervisor may enter an engineering cure time with a reason.';

export function isFiniteNumber(v: unknown): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}

export type PipeSchedule = 40 | 80;

export function parseSchedule(s: unknown): PipeSchedule | null {
  const n = typeof s === 'string' ? Number(s.replace(/^sch(edule)?\s*/i, '')) : s;
  return n === 40 || n === 80 ? n : null;
}

/** A value as text for a reason string; never throws, even for odd objects. */
export function show(v: unknown): string {
  try {
    return typeof v === 'string' ? v : JSON.stringify(v) ?? String(v);
  } catch {
    return typeof v;
  }
}
