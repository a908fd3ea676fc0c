// Units. Inside the engine: inches, psi, °F. People may type metric (mm, bar, kPa, °C).
// A bare number with no unit is refused unless the caller names the unit it means, so "10"
// typed by someone thinking in bar never becomes 10 psi.

import { parseInchFraction } from './nominal-size';
import { refuse, show, type Refusal } from './result';

export const MM_PER_IN = 25.4;
export const KPA_PER_PSI = 6.894757293168361;
export const PSI_PER_BAR = 100 / KPA_PER_PSI;

export const inToMm = (inches: number): number => inches * MM_PER_IN;
export const mmToIn = (mm: number): number => mm / MM_PER_IN;
export const psiToKpa = (psi: number): number => psi * KPA_PER_PSI;
export const kpaToPsi = (kpa: number): number => kpa / KPA_PER_PSI;
export const psiToBar = (psi: number): number => psiToKpa(psi) / 100;
export const barToPsi = (bar: number): number => kpaToPsi(bar * 100);
export const fToC = (f: number): number => ((f - 32) * 5) / 9;
export const cToF = (c: number): number => (c * 9) / 5 + 32;

type Parsed<K extends string> = { ok: true; value: number; unit: string } & Record<K, number>;

function split(input: unknown): { num: string; unit: string } | null {
  if (typeof input === 'number') return Number.isFinite(input) ? { num: String(input), unit: '' } : null;
  if (typeof input !== 'string') return null;
  const m = /^\s*([-+]?(?:\d+[-\s]+\d+\/\d+|\d+\/\d+|\d*\.\d+|\d+\.?))\s*(.*?)\s*$/.exec(input);
  return m && m[1] !== undefined ? { num: m[1], unit: (m[2] ?? '').toLowerCase().replace(/\s+/g, '') } : null;
}

function number(num: string): number | null {
  const neg = num.startsWith('-');
  const v = parseInchFraction(num.replace(/^[-+]/, ''));
  return v === null ? null : neg ? -v : v;
}

const PRESSURE: Record<string, [string, (v: number) => number]> = {
  psi: ['psi', (v) => v], psig: ['psi', (v) => v],
  bar: ['bar', barToPsi], barg: ['bar', barToPsi],
  kpa: ['kPa', kpaToPsi], kpag: ['kPa', kpaToPsi],
  mpa: ['MPa', (v) => kpaToPsi(v * 1000)],
};

const LENGTH: Record<string, [string, (v: number) => number]> = {
  in: ['in', (v) => v], 'in.': ['in', (v) => v], inch: ['in', (v) => v], inches: ['in', (v) => v], '"': ['in', (v) => v],
  mm: ['mm', mmToIn], cm: ['cm', (v) => mmToIn(v * 10)], m: ['m', (v) => mmToIn(v * 1000)],
  ft: ['ft', (v) => v * 12], "'": ['ft', (v) => v * 12],
};

const TEMPERATURE: Record<string, [string, (v: number) => number]> = {
  f: ['°F', (v) => v], '°f': ['°F', (v) => v], degf: ['°F', (v) => v], fahrenheit: ['°F', (v) => v],
  c: ['°C', cToF], '°c': ['°C', cToF], degc: ['°C', cToF], celsius: ['°C', cToF],
};

function parseWith<K extends string>(
  input: unknown, table: Record<string, [string, (v: number) => number]>, key: K, what: string, defaultUnit?: string,
): Parsed<K> | Refusal {
  const parts = split(input);
  const value = parts ? number(parts.num) : null;
  if (!parts || value === null) return refuse(`"${show(input)}" is not a ${what}.`);
  const unitKey = parts.unit || (defaultUnit ?? '').toLowerCase();
  const unit = table[unitKey];
  if (!unit) {
    const known = [...new Set(Object.values(table).map(([u]) => u))].join(', ');
    return refuse(parts.unit ? `Unknown ${what} unit "${parts.unit}" (use ${known}).` : `Give a unit with the ${what} (${known}).`);
  }
  return { ok: true, value, unit: unit[0], [key]: unit[1](value) } as Parsed<K>;
}

/** "10 bar", "150 psi", "690 kPa" → psi. Negative (vacuum) is refused. */
export function parsePressure(input: string | number, defaultUnit?: 'psi' | 'bar' | 'kPa' | 'MPa'): Parsed<'psi'> | Refusal {
  const r = parseWith(input, PRESSURE, 'psi', 'pressure', defaultUnit);
  return r.ok && r.psi < 0 ? refuse('Pressure must be 0 or more (gauge).') : r;
}

/** '1-1/4 in', '3/32"', '50 mm' → inches. */
export function parseLength(input: string | number, defaultUnit?: 'in' | 'mm' | 'cm' | 'm' | 'ft'): Parsed<'inches'> | Refusal {
  const r = parseWith(input, LENGTH, 'inches', 'length', defaultUnit);
  return r.ok && r.inches < 0 ? refuse('Length must be 0 or more.') : r;
}

/** Absolute zero, °F (−273.15 °C): no temperature is colder. */
export const ABSOLUTE_ZERO_F = -459.67;
export const BELOW_ABSOLUTE_ZERO = 'That is below absolute zero (−459.67 °F, −273.15 °C).';

/**
 * The one rule both the importer (parseTemperature) and the calculator's schema (joint-spec.ts)
 * apply to a temperature in °F. A hair of rounding is allowed, so −273.15 °C (converted) is not
 * refused as colder than itself.
 */
export function isBelowAbsoluteZero(temperatureF: number): boolean {
  return temperatureF < ABSOLUTE_ZERO_F - 1e-9;
}

/** "70 °F", "21 C", "-5°C" → °F. */
export function parseTemperature(input: string | number, defaultUnit?: 'F' | 'C'): Parsed<'temperatureF'> | Refusal {
  const r = parseWith(input, TEMPERATURE, 'temperatureF', 'temperature', defaultUnit);
  return r.ok && isBelowAbsoluteZero(r.temperatureF) ? refuse(BELOW_ABSOLUTE_ZERO) : r;
}
