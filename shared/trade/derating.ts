// Temperature de-rating factors, multiplying the 73 °F rating [mfr]: the first maker's values,
// with a second maker's where the reference brackets them. Where the reference shows no
// bracket we take the second maker to agree with the first (an assumption, noted).
// Between rows the factor of the NEXT HIGHER listed temperature applies [practice];
// at or below 73 °F the factor is 1.00; above the maximum service temperature (pipe-materials.ts),
// none. ABS has no de-rating table here: it is refused, not guessed.

import { MAX_SERVICE_TEMPERATURE_F, parseTabledMaterial, type Material, type TabledMaterial } from './pipe-materials';
import { show } from './result';

export interface DeratingRow {
  temperatureF: number;
  factor: number;
  secondMaker?: number;
}

// a manufacturer's installation manual, PVC [mfr]; maximum service temperature 140 °F
const PVC: readonly DeratingRow[] = [
  { temperatureF: 73, factor: 1.0 },
  { temperatureF: 80, factor: 0.88 },
  { temperatureF: 90, factor: 0.75 },
  { temperatureF: 100, factor: 0.62 },
  { temperatureF: 110, factor: 0.51, secondMaker: 0.5 },
  { temperatureF: 120, factor: 0.4 },
  { temperatureF: 130, factor: 0.31, secondMaker: 0.3 },
  { temperatureF: 140, factor: 0.22 },
];

// a manufacturer's installation manual, CPVC [mfr]; maximum service temperature 200 °F
const CPVC: readonly DeratingRow[] = [
  { temperatureF: 73, factor: 1.0 },
  { temperatureF: 80, factor: 1.0 },
  { temperatureF: 90, factor: 0.91 },
  { temperatureF: 100, factor: 0.82 },
  { temperatureF: 110, factor: 0.72, secondMaker: 0.77 },
  { temperatureF: 120, factor: 0.65 },
  { temperatureF: 130, factor: 0.57, secondMaker: 0.62 },
  { temperatureF: 140, factor: 0.5 },
  { temperatureF: 150, factor: 0.42, secondMaker: 0.47 },
  { temperatureF: 160, factor: 0.4 },
  { temperatureF: 170, factor: 0.29, secondMaker: 0.32 },
  { temperatureF: 180, factor: 0.25 },
  { temperatureF: 200, factor: 0.2 },
];

export const DERATING_TABLE: Readonly<Record<TabledMaterial, readonly DeratingRow[]>> = { PVC, CPVC };

export type DeratingMaker = 'first' | 'second';

export type DeratingLookup =
  | { ok: true; factor: number; rowTemperatureF: number }
  | { ok: false; reason: string };

export function deratingFactor(
  material: Material,
  temperatureF: number,
  maker: DeratingMaker = 'first',
): DeratingLookup {
  const tabled = parseTabledMaterial(material);
  if (!tabled) return { ok: false, reason: `No de-rating table for "${show(material)}" here: PVC and CPVC only.` };
  const max = MAX_SERVICE_TEMPERATURE_F[tabled];
  if (!Number.isFinite(temperatureF)) return { ok: false, reason: 'Temperature must be a number.' };
  if (temperatureF > max) {
    return {
      ok: false,
      reason: `${temperatureF} °F is above the ${tabled} maximum service temperature of ${max} °F; no rating.`,
    };
  }
  const row = DERATING_TABLE[tabled].find((r) => temperatureF <= r.temperatureF);
  if (!row) return { ok: false, reason: `No de-rating row for ${temperatureF} °F.` };
  const factor = maker === 'second' ? (row.secondMaker ?? row.factor) : row.factor;
  return { ok: true, factor, rowTemperatureF: row.temperatureF };
}
