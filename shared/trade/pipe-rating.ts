// Pressure rating of PVC / CPVC pipe at a service temperature; ABS has no table here and is refused.
// 73 °F rating: ASTM D1785 / F441 table lookup [pub]. The ISO equation is used only where the
// table has no value (an SDR input), and the result says so.
// Rounding: the de-rated psi is rounded to the NEAREST whole psi, because that is what the
// published worked example does (6" Sch 80 PVC at 140 °F: 280 × 0.22 = 61.6, printed 62 [mfr]);
// an exact half rounds DOWN (250 × 0.65 = 162.5 → 162), the conservative side of a tie.
// A result can still sit up to 0.5 psi above the exact product; `psiUnrounded` carries it.
// Equation ratings have no printed value to follow, so they are rounded DOWN (conservative).

import { deratingFactor, type DeratingMaker } from './derating';
import { pipeRow, wallAndRating } from './pipe-dimensions';
import { unknownSizeReason } from './nominal-size';
import { parseTabledMaterial, type Material, type TabledMaterial } from './pipe-materials';
import { isFiniteNumber, parseSchedule, refuse, show, type PipeSchedule, type Refusal } from './result';
import { SOURCES } from './sources';

/** Hydrostatic design stress for PVC 12454 (1120) and CPVC 23447, psi [pub]. */
export const HDS_PSI = 2000;

export interface EquationRating {
  ok: true;
  psi: number;
  psiExact: number;
  fromEquation: true;
  source: string;
}

export function isoRating(input: { odIn: number; wallIn: number; hdsPsi?: number }): EquationRating | Refusal {
  const { odIn, wallIn, hdsPsi = HDS_PSI } = input;
  if (![odIn, wallIn, hdsPsi].every(isFiniteNumber) || odIn <= 0 || wallIn <= 0 || hdsPsi <= 0) {
    return refuse('OD, wall and design stress must be positive numbers.');
  }
  if (wallIn * 2 >= odIn) return refuse('The wall must be less than half the outside diameter.');
  const psiExact = (2 * hdsPsi * wallIn) / (odIn - wallIn);
  return { ok: true, psi: Math.floor(psiExact + 1e-9), psiExact, fromEquation: true, source: `${SOURCES.isoEquation}, S = ${hdsPsi} psi; rounded down` };
}

/** SDR = OD / minimum wall, so P = 2·S / (SDR − 1). */
export function sdrRating(sdr: number, hdsPsi: number = HDS_PSI): EquationRating | Refusal {
  if (!isFiniteNumber(sdr) || sdr <= 2) return refuse('SDR must be a number greater than 2.');
  return isoRating({ odIn: sdr, wallIn: 1, hdsPsi });
}

export interface PipeRatingInput {
  material: Material;
  schedule?: PipeSchedule;
  /** Give an SDR instead of a schedule: rated by the equation, not the table. */
  sdr?: number;
  nominalSize: string;
  temperatureF: number;
  deratingMaker?: DeratingMaker;
}

export interface PipeRating {
  ok: true;
  psi: number;
  psiUnrounded: number;
  ratedPsiAt73: number;
  factor: number;
  factorRowF: number;
  odIn: number;
  wallIn: number;
  source: string;
  fromEquation?: boolean;
}

type Base = { ok: true; ratedPsiAt73: number; odIn: number; wallIn: number; source: string; fromEquation?: boolean };

function baseRating(material: TabledMaterial, input: PipeRatingInput): Base | Refusal {
  const row = pipeRow(input.nominalSize);
  if (!row) return refuse(unknownSizeReason(input.nominalSize));
  if (input.sdr !== undefined) {
    const eq = sdrRating(input.sdr);
    if (!eq.ok) return eq;
    return { ok: true, ratedPsiAt73: eq.psi, odIn: row.odIn, wallIn: row.odIn / input.sdr, source: `SDR ${input.sdr}: ${eq.source}`, fromEquation: true };
  }
  const schedule = parseSchedule(input.schedule);
  if (!schedule) return refuse('Schedule must be 40 or 80 (or give an SDR).');
  const { wallIn, psi } = wallAndRating(row, schedule);
  const table = material === 'PVC' ? SOURCES.d1785 : `${SOURCES.f441}; ${SOURCES.d1785}`;
  return { ok: true, ratedPsiAt73: psi, odIn: row.odIn, wallIn, source: table };
}

export function pipeRating(input: PipeRatingInput): PipeRating | Refusal {
  const material = parseTabledMaterial(input.material);
  if (!material) return refuse(`No pressure rating for "${show(input.material)}": PVC and CPVC only.`);
  if (!isFiniteNumber(input.temperatureF)) return refuse('Service temperature must be a number (°F).');
  const b = baseRating(material, input);
  if (!b.ok) return b;
  const lookup = deratingFactor(material, input.temperatureF, input.deratingMaker);
  if (!lookup.ok) return refuse(lookup.reason);
  // factor in hundredths keeps the product exact, so x.5 rounds the way it is printed
  const hundredths = Math.round(lookup.factor * 100);
  const psiUnrounded = (b.ratedPsiAt73 * hundredths) / 100;
  const derating = input.deratingMaker === 'second' ? SOURCES.deratingSecond : SOURCES.derating;
  return {
    ok: true,
    psi: Math.ceil(psiUnrounded - 0.5), // nearest, ties down
    psiUnrounded,
    ratedPsiAt73: b.ratedPsiAt73,
    factor: lookup.factor,
    factorRowF: lookup.rowTemperatureF,
    odIn: b.odIn,
    wallIn: b.wallIn,
    source: `${b.source}; ${derating}; ${SOURCES.nextHigherRow}; rounded to nearest psi (ties down) as the worked example prints`,
    ...(b.fromEquation ? { fromEquation: true } : {}),
  };
}
