// The thermoplastic pipe materials Linewright knows, and the hottest service each is used for.
// This is the one list: the trade rules use it, and shared/schemas (the register, the joint
// specification) take it from here, so shared/trade stays self-contained and imports nothing else.
// Maximum service temperature, °F:
// - PVC 140, CPVC 200: the de-rating reference, a manufacturer's installation manual [mfr];
// - ABS 180: the commonly quoted limit, recalled [memory]; the reference gives none for ABS.

import { SOURCES } from './sources';

export const PIPE_MATERIALS = ['PVC', 'CPVC', 'ABS'] as const;
export type Material = (typeof PIPE_MATERIALS)[number];

/** The materials the reference has pressure-rating, de-rating and cure tables for; ABS has none here. */
export const TABLED_MATERIALS = ['PVC', 'CPVC'] as const satisfies readonly Material[];
export type TabledMaterial = (typeof TABLED_MATERIALS)[number];

export const MAX_SERVICE_TEMPERATURE_F: Readonly<Record<Material, number>> = { PVC: 140, CPVC: 200, ABS: 180 };

export const MAX_SERVICE_TEMPERATURE_SOURCE: Readonly<Record<Material, string>> = {
  PVC: SOURCES.maxServiceTemperature,
  CPVC: SOURCES.maxServiceTemperature,
  ABS: SOURCES.maxServiceTemperatureAbs,
};

/** The hottest service the material is used for, °F; above it there is no rating and the register refuses the line. */
export function maxServiceTemperatureF(material: Material): number {
  return MAX_SERVICE_TEMPERATURE_F[material];
}

const upper = (m: unknown) => (typeof m === 'string' ? m.trim().toUpperCase() : '');

/** "pvc", " ABS " → the material; null when it is none of PVC, CPVC or ABS. */
export function parsePipeMaterial(m: unknown): Material | null {
  const s = upper(m);
  return (PIPE_MATERIALS as readonly string[]).includes(s) ? (s as Material) : null;
}

/** PVC and CPVC only: the reference has no ABS pressure, de-rating or cure table. */
export function parseTabledMaterial(m: unknown): TabledMaterial | null {
  const s = upper(m);
  return (TABLED_MATERIALS as readonly string[]).includes(s) ? (s as TabledMaterial) : null;
}
