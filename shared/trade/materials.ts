// Cement and primer for a set of joints, rounded up to containers.
// Average joints per quart of cement — a plastics piping technical manual [pub].
// Where the table prints a range (10": 2–3) the LOWER number is used; a size not listed takes
// the next LARGER listed size's value (1-1/4" → 1-1/2"'s 90): both mean more cement, never less.
// Above 18" there is no value and nothing is extrapolated. Primer: about twice the joints per
// quart of cement [pub].
// Containers: the least volume, in whole pints, that covers the need, then the fewest containers
// for that volume (gallon = 4 qt, quart, pint = 1/2 qt). This reads plainly on a pick list.

import { cementBody, type CementBody } from './cement';
import { parseNominalSize, unknownSizeReason } from './nominal-size';
import { refuse, type Refusal } from './result';
import { SOURCES } from './sources';

export interface JointsPerQuartRow {
  sizeIn: number;
  printed: string;
  jointsPerQuart: number;
}

export const JOINTS_PER_QUART: readonly JointsPerQuartRow[] = [
  { sizeIn: 0.5, printed: '300', jointsPerQuart: 300 },
  { sizeIn: 0.75, printed: '200', jointsPerQuart: 200 },
  { sizeIn: 1, printed: '125', jointsPerQuart: 125 },
  { sizeIn: 1.5, printed: '90', jointsPerQuart: 90 },
  { sizeIn: 2, printed: '60', jointsPerQuart: 60 },
  { sizeIn: 3, printed: '40', jointsPerQuart: 40 },
  { sizeIn: 4, printed: '30', jointsPerQuart: 30 },
  { sizeIn: 6, printed: '10', jointsPerQuart: 10 },
  { sizeIn: 8, printed: '5', jointsPerQuart: 5 },
  { sizeIn: 10, printed: '2–3', jointsPerQuart: 2 },
  { sizeIn: 12, printed: '1–2', jointsPerQuart: 1 },
  { sizeIn: 15, printed: '3/4', jointsPerQuart: 0.75 },
  { sizeIn: 18, printed: '1/2', jointsPerQuart: 0.5 },
];

export const PRIMER_JOINTS_FACTOR = 2;

export function jointsPerQuart(nominalSize: string): { ok: true; jointsPerQuart: number; rowSizeIn: number } | Refusal {
  const inches = parseNominalSize(nominalSize);
  if (inches === null) return refuse(unknownSizeReason(nominalSize));
  const row = JOINTS_PER_QUART.find((r) => r.sizeIn >= inches);
  if (!row) return refuse(`No published joints-per-quart for ${nominalSize}" (the table ends at 18"): estimate from the cement maker's literature.`);
  return { ok: true, jointsPerQuart: row.jointsPerQuart, rowSizeIn: row.sizeIn };
}

export type Container = 'gallon' | 'quart' | 'pint';

export function containersFor(quarts: number): { container: Container; count: number }[] {
  let pints = Math.max(0, Math.ceil(quarts * 2 - 1e-9));
  const out: { container: Container; count: number }[] = [];
  for (const [container, size] of [['gallon', 8], ['quart', 2], ['pint', 1]] as const) {
    const count = Math.floor(pints / size);
    if (count > 0) out.push({ container, count });
    pints -= count * size;
  }
  return out;
}

export interface CementQuantities {
  ok: true;
  cementQuarts: number;
  primerQuarts: number;
  cementContainers: { container: Container; count: number }[];
  primerContainers: { container: Container; count: number }[];
  body: CementBody | null;
  source: string;
}

export function cementQuantities(joints: readonly { nominalSize: string; count: number }[]): CementQuantities | Refusal {
  let cement = 0;
  let largest = 0;
  for (const j of joints) {
    if (!Number.isInteger(j.count) || j.count < 0) return refuse(`Joint count for ${j.nominalSize}" must be a whole number, 0 or more.`);
    const row = jointsPerQuart(j.nominalSize);
    if (!row.ok) return row;
    cement += j.count / row.jointsPerQuart;
    if (j.count > 0) largest = Math.max(largest, parseNominalSize(j.nominalSize) ?? 0);
  }
  const primer = cement / PRIMER_JOINTS_FACTOR;
  const body = largest > 0 ? cementBody(String(largest)) : null;
  return {
    ok: true,
    cementQuarts: cement,
    primerQuarts: primer,
    cementContainers: containersFor(cement),
    primerContainers: containersFor(primer),
    body: body && body.ok ? body.body : null,
    source: `${SOURCES.jointsPerQuart}; ${SOURCES.primerRatio}; ${SOURCES.cementBody}`,
  };
}
