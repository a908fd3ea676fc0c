import { assemblyHoldSeconds, cToF, inToMm, mmToIn } from '@shared/trade';

export type LengthUnit = 'in' | 'mm';
export type TemperatureUnit = 'F' | 'C';

/** A length in the unit the fitter reads their rule in: inches to 0.001, millimetres to 0.1. */
export function lengthText(inches: number, unit: LengthUnit): string {
  return unit === 'in' ? `${round(inches, 3)} in` : `${round(inToMm(inches), 1)} mm`;
}

const round = (x: number, digits: number) => String(Number(x.toFixed(digits)));

/** The engine's dry-fit window (inches) in the fitter's unit, or null where the engine has none. */
export function dryFitWindow(minIn: number | null, maxIn: number | null, unit: LengthUnit): { min: number; max: number; text: string } | null {
  if (minIn === null || maxIn === null) return null;
  const conv = unit === 'in' ? (x: number) => x : inToMm;
  return { min: conv(minIn), max: conv(maxIn), text: `${lengthText(minIn, unit).replace(/ (in|mm)$/, '')}–${lengthText(maxIn, unit)}` };
}

/**
 * Where a measured dry insertion falls against the window, for the live warning only: the server
 * decides. Compared in inches at the engine's 0.001 in, so a value typed in mm at the edge is not
 * warned about for a rounding hair.
 */
export function dryFitVerdict(value: number, unit: LengthUnit, minIn: number | null, maxIn: number | null): 'short' | 'ok' | 'deep' | null {
  if (!Number.isFinite(value) || minIn === null || maxIn === null) return null;
  const inches = Math.round((unit === 'mm' ? mmToIn(value) : value) * 1000) / 1000;
  if (inches < minIn) return 'short';
  if (inches > maxIn) return 'deep';
  return 'ok';
}

export const toFahrenheit = (value: number, unit: TemperatureUnit) => (unit === 'C' ? cToF(value) : value);

/**
 * The hold after assembly to count down: the engine's (at the forecast low), or longer where the
 * temperature recorded with the cement calls for it, which is what the server checks the hold against.
 */
export function assemblyHoldFor(engineSeconds: number, cementTemperatureF: number | null): number {
  if (cementTemperatureF === null || !Number.isFinite(cementTemperatureF)) return engineSeconds;
  const recorded = assemblyHoldSeconds(cementTemperatureF);
  return recorded.ok ? Math.max(engineSeconds, recorded.seconds) : engineSeconds;
}
