// Applicator, crew and hold for making a joint by hand. All common practice [practice]; the size
// thresholds are this engine's choice where the trade gives none, and say so.

import { pipeRow } from './pipe-dimensions';
import { parseNominalSize, unknownSizeReason } from './nominal-size';
import { isFiniteNumber, refuse, type Refusal } from './result';
import { SOURCES } from './sources';

export type ApplicatorKind = 'dauber' | 'swab' | 'swab-or-roller';

/** Applicator about half the pipe diameter; daubers small, swabs or rollers large [practice]. */
export function applicatorSize(nominalSize: string) {
  const row = pipeRow(nominalSize);
  const inches = parseNominalSize(nominalSize);
  if (!row || inches === null) return refuse(unknownSizeReason(nominalSize));
  // engine's thresholds: dauber to 2" (regular-body sizes), swab to 6", swab or roller beyond
  const kind: ApplicatorKind = inches <= 2 ? 'dauber' : inches <= 6 ? 'swab' : 'swab-or-roller';
  return {
    ok: true as const,
    widthIn: Math.round((row.odIn / 2) * 100) / 100,
    kind,
    note: inches > 6 ? 'No paint brushes with synthetic bristles: the solvent attacks them.' : undefined,
    source: SOURCES.applicator,
  };
}

/** Large diameters need a crew and a mechanical joining device to bottom the pipe evenly. */
export const JOINING_DEVICE_FROM_IN = 6;

export function crewAndTools(nominalSize: string) {
  const inches = parseNominalSize(nominalSize);
  if (inches === null) return refuse(unknownSizeReason(nominalSize));
  // engine's choice: one fitter to 4", two to 8", three beyond; a device from 6"
  const crew = inches <= 4 ? 1 : inches <= 8 ? 2 : 3;
  const device = inches >= JOINING_DEVICE_FROM_IN;
  return {
    ok: true as const,
    crew,
    mechanicalJoiningDevice: device,
    text: device
      ? `A crew of ${crew} and a mechanical joining device (pipe puller or come-along with straps) to bottom the pipe evenly while the cement is wet.`
      : crew === 1
        ? 'One fitter can make this joint; a helper speeds priming and cementing.'
        : 'Two people: one primes and cements the socket while the other does the pipe, then assemble together.',
    source: SOURCES.crew,
  };
}

/** Hold the assembled joint ≥ about 30 s, longer in the cold [practice]; bands as the cure table's. */
export function assemblyHoldSeconds(temperatureF: number): { ok: true; seconds: number; source: string } | Refusal {
  if (!isFiniteNumber(temperatureF)) return refuse('Temperature must be a number (°F).');
  // engine's choice: 30 s above 60 °F, 60 s at 40–60 °F, 120 s at 40 °F or colder (edges colder)
  const seconds = temperatureF > 60 ? 30 : temperatureF > 40 ? 60 : 120;
  return { ok: true, seconds, source: SOURCES.assemblyHold };
}
