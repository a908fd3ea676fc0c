// Socket geometry for solvent-cemented joints: depth marks, dry fit, chamfer.

import { nominalSizeLabel, parseNominalSize, unknownSizeReason, type NominalSize } from './nominal-size';
import { isFiniteNumber, parseSchedule, refuse, type PipeSchedule, type Refusal } from './result';
import { SOURCES } from './sources';

// Minimum socket depth, inches: ASTM D2466 (Sch 40) and D2467 (Sch 80), from a manufacturer's
// installation manual cross-checked against ASTM D2468's table [mfr]. Sizes not listed
// (3-1/2", 5", 14" and up) have no depth here and are refused.
export const SOCKET_DEPTH_IN: Readonly<Partial<Record<NominalSize, Readonly<Record<PipeSchedule, number>>>>> = {
  '1/2': { 40: 0.688, 80: 0.875 },
  '3/4': { 40: 0.719, 80: 1.0 },
  '1': { 40: 0.875, 80: 1.125 },
  '1-1/4': { 40: 0.938, 80: 1.25 },
  '1-1/2': { 40: 1.094, 80: 1.375 },
  '2': { 40: 1.156, 80: 1.5 },
  '2-1/2': { 40: 1.75, 80: 1.75 },
  '3': { 40: 1.875, 80: 1.875 },
  '4': { 40: 2.0, 80: 2.25 },
  '6': { 40: 3.0, 80: 3.0 },
  '8': { 40: 4.0, 80: 4.0 },
  '10': { 40: 5.0, 80: 5.0 },
  '12': { 40: 6.0, 80: 6.0 },
};

/** Second mark beyond the insertion mark, since primer and cement wipe the first [practice]. */
export const CHECK_MARK_OFFSET_IN = 2;

export function socketDepth(nominalSize: unknown, schedule: unknown): { ok: true; depthIn: number; size: NominalSize } | Refusal {
  const inches = parseNominalSize(nominalSize);
  const size = inches === null ? null : nominalSizeLabel(inches);
  if (!size) return refuse(unknownSizeReason(nominalSize));
  const sch = parseSchedule(schedule);
  if (!sch) return refuse('Schedule must be 40 or 80.');
  const depth = SOCKET_DEPTH_IN[size]?.[sch];
  if (depth === undefined) {
    return refuse(`No published socket depth for ${size}" Sch ${sch}: measure the fitting's socket and follow its maker's literature.`);
  }
  return { ok: true, depthIn: depth, size };
}

export function socketMarks(input: { nominalSize: string; schedule: PipeSchedule }) {
  const d = socketDepth(input.nominalSize, input.schedule);
  if (!d.ok) return d;
  return {
    ok: true as const,
    socketDepthIn: d.depthIn,
    insertionMarkIn: d.depthIn,
    checkMarkIn: d.depthIn + CHECK_MARK_OFFSET_IN,
    source: `${SOURCES.socketDepth}; ${SOURCES.checkMark}`,
  };
}

export type DryFit = 'ok' | 'too-loose' | 'too-tight';

/** The dry pipe should enter between 1/3 and 2/3 of the socket depth, edges included [pub]. */
export function dryFitCheck(input: { nominalSize: string; schedule: PipeSchedule; dryInsertionIn: number }) {
  const d = socketDepth(input.nominalSize, input.schedule);
  if (!d.ok) return d;
  const x = input.dryInsertionIn;
  if (!isFiniteNumber(x) || x < 0) return refuse('Dry insertion must be a length in inches, 0 or more.');
  const minIn = d.depthIn / 3;
  const maxIn = (d.depthIn * 2) / 3;
  const fit: DryFit = x > maxIn + 1e-9 ? 'too-loose' : x < minIn - 1e-9 ? 'too-tight' : 'ok';
  const inches = parseNominalSize(d.size) ?? 0;
  const messages: Record<DryFit, string> = {
    ok: 'Dry fit is within 1/3 to 2/3 of the socket depth.',
    'too-loose': 'The dry pipe enters deeper than 2/3 of the socket: too loose for a sound joint; try another fitting or pipe.',
    'too-tight': 'The dry pipe enters less than 1/3 of the socket: too tight; check the pipe end for out-of-round, burrs or a missing chamfer.',
  };
  return {
    ok: true as const,
    fit,
    message: messages[fit],
    socketDepthIn: d.depthIn,
    minIn,
    maxIn,
    // one maker asks 1/2 to 2/3 for 1/2"–4" [mfr]: shown, not enforced
    makerMinIn: inches <= 4 ? d.depthIn / 2 : undefined,
    source: inches <= 4 ? `${SOURCES.dryFit}; ${SOURCES.dryFitMaker}` : SOURCES.dryFit,
  };
}

// Chamfer: 10°–15° [mfr] (some literature allows about 22°). Length about 1/16"–3/32" on small
// sizes, more on large [memory]. The reference gives no number for large sizes, so none is
// invented: sizes above 2" (where regular-body cement stops) get "more than 3/32"".
export const SMALL_CHAMFER_MAX_SIZE_IN = 2;

export function chamferGuidance(nominalSize: string) {
  const inches = parseNominalSize(nominalSize);
  if (inches === null) return refuse(unknownSizeReason(nominalSize));
  const small = inches <= SMALL_CHAMFER_MAX_SIZE_IN;
  return {
    ok: true as const,
    angleMinDeg: 10,
    angleMaxDeg: 15,
    lengthMinIn: small ? 1 / 16 : 3 / 32,
    lengthMaxIn: small ? 3 / 32 : null,
    text: small
      ? 'Bevel the pipe end 10°–15°, about 1/16"–3/32" long.'
      : 'Bevel the pipe end 10°–15°, longer than on small sizes (more than 3/32"); follow the fitting maker\'s literature for the length.',
    note: 'Some literature allows a bevel up to about 22°.',
    source: `${SOURCES.chamferAngle}; ${SOURCES.chamferLength}`,
  };
}
