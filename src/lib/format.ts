// How Linewright writes numbers and dates: pressures, temperatures, lengths, durations, dates.
// US units first (the engine's: psi, °F, inches), metric beside. The Intl formatters are made
// once, here; a call only formats.

import { fToC, inToMm, psiToBar, psiToKpa, type Container } from '@shared/trade';
import type { LineDto } from '@shared/schemas/lines';

export const PRESSURE_UNITS = ['psi', 'bar', 'kPa'] as const;
export const TEMPERATURE_UNITS = ['F', 'C'] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];

export const PRESSURE_UNIT_LABEL: Record<PressureUnit, string> = { psi: 'psi', bar: 'bar', kPa: 'kPa' };
export const TEMPERATURE_UNIT_LABEL: Record<TemperatureUnit, string> = { F: '°F', C: '°C' };

const ML_PER_QUART = 946.352946;

/** With thousands separators, for values only read (the register). */
const upTo = (digits: 0 | 1) => new Intl.NumberFormat('en-US', { maximumFractionDigits: digits });
const GROUPED = [upTo(0), upTo(1)] as const;
const DATE = new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric' });
const DATE_TIME = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

const grouped = (x: number, digits: 0 | 1 = 0) => GROUPED[digits].format(x);
/**
 * At most `digits` decimals, trailing zeros dropped ("1.50" → "1.5"), no separators, so a value
 * written into a field reads back as the same number. toFixed rather than Intl, which rounds the
 * shortest decimal (1.005 → "1.01" where toFixed gives "1.00"): the calculator has always shown toFixed's.
 */
const fixed = (x: number, digits: number) => x.toFixed(digits).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');

// ---- the calculator: to 0.1 psi / 0.1 °F / 0.001 in, metric beside

/** Metric pressure in the unit the person works in (kPa if they chose it, else bar). */
export function metricPressure(psiValue: number, unit: PressureUnit): string {
  if (unit === 'kPa') return `${fixed(psiToKpa(psiValue), 0)} kPa`;
  const bar = psiToBar(psiValue);
  return `${fixed(bar, bar < 10 ? 2 : 1)} bar`;
}

export const psi = (x: number) => `${fixed(x, 1)} psi`;
export const degF = (f: number) => `${fixed(f, 1)} °F`;
export const degC = (f: number) => `${fixed(fToC(f), 1)} °C`;
export const inches = (x: number) => `${fixed(x, 3)} in`;
export const mm = (x: number) => `${fixed(inToMm(x), 1)} mm`;

/** A number typed in one unit, written in another (enough decimals to come back to the same 0.1 psi / °F). */
export function pressureIn(psiValue: number, unit: PressureUnit): string {
  if (unit === 'psi') return fixed(psiValue, 1);
  return unit === 'bar' ? fixed(psiToBar(psiValue), 3) : fixed(psiToKpa(psiValue), 1);
}

export function temperatureIn(f: number, unit: TemperatureUnit): string {
  return unit === 'F' ? fixed(f, 1) : fixed(fToC(f), 2);
}

/** 30 → "30 min", 90 → "1 h 30 min", 2880 → "2 days (48 h)". */
export function duration(minutes: number): string {
  if (minutes < 60) return `${minutes} min`;
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (minutes < 48 * 60) return m ? `${h} h ${m} min` : `${h} h`;
  const d = Math.floor(h / 24);
  const rest = h % 24;
  const days = `${d} days${rest ? ` ${rest} h` : ''}${m ? ` ${m} min` : ''}`;
  return `${days} (${h} h)`;
}

export function containers(list: readonly { container: Container; count: number }[]): string {
  if (list.length === 0) return 'none';
  return list.map(({ container, count }) => `${count} ${container}${count === 1 ? '' : 's'}`).join(' + ');
}

export function volume(quarts: number): string {
  const ml = quarts * ML_PER_QUART;
  return `${fixed(quarts, quarts < 0.1 ? 3 : 2)} qt · ${Math.round(ml)} mL`;
}

// ---- the register: whole psi and °F as the plant's line list has them, thousands separated

export const formatSize = (nominalSize: string) => `${nominalSize}"`;
export const formatPressure = (psiValue: number) => `${grouped(psiValue)} psi`;
export const formatPressureBar = (psiValue: number) => `${grouped(psiToBar(psiValue), 1)} bar`;
export const formatTemperature = (f: number) => `${grouped(f)} °F`;
export const formatTemperatureC = (f: number) => `${grouped(fToC(f), 1)} °C`;

/** "Sch 80", "SDR 21", or both when a line carries both. */
export function formatWall(line: Pick<LineDto, 'schedule' | 'sdr'>): string {
  const parts = [line.schedule ? `Sch ${line.schedule.replace(/^sch(edule)?\s*/i, '')}` : null, line.sdr ? `SDR ${grouped(line.sdr, 1)}` : null];
  return parts.filter(Boolean).join(' · ') || '—';
}

// ---- dates, in the browser's time zone

/** "Apr 5, 2026" */
export const formatDate = (iso: string) => DATE.format(new Date(iso));
/** "Apr 5, 2026, 2:07 PM" */
export const formatDateTime = (iso: string) => DATE_TIME.format(new Date(iso));
