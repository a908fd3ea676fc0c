// How Linewright writes numbers and dates: pressures, temperatures, lengths, durations, dates.
// US units first (the engine's: psi, °F, inches), metric beside. The register's numbers and dates
// are written out by hand rather than by Intl: a page load's first Intl formatter costs 0.1–0.3 s
// on a tablet's CPU (the locale data), and the register is the first screen. format.test.ts checks
// them against Intl; anything out of the ordinary (NaN, huge numbers, odd years) still goes to Intl,
// whose formatters are made on first use and kept.

import { fToC, inToMm, psiToBar, psiToKpa, type Container } from '@shared/trade';
import type { LineDto } from '@shared/schemas/lines';

export const PRESSURE_UNITS = ['psi', 'bar', 'kPa'] as const;
export const TEMPERATURE_UNITS = ['F', 'C'] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];

export const PRESSURE_UNIT_LABEL: Record<PressureUnit, string> = { psi: 'psi', bar: 'bar', kPa: 'kPa' };
export const TEMPERATURE_UNIT_LABEL: Record<TemperatureUnit, string> = { F: '°F', C: '°C' };

const ML_PER_QUART = 946.352946;

/** An Intl formatter made on its first use, then kept. */
const lazily = <T,>(make: () => T) => {
  let made: T | undefined;
  return () => (made ??= make());
};
const INTL_GROUPED = [0, 1].map((digits) => lazily(() => new Intl.NumberFormat('en-US', { maximumFractionDigits: digits })));
const INTL_DATE = lazily(() => new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric' }));
const DATE_TIME = lazily(() => new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' }));

/**
 * With thousands separators, for values only read (the register): what Intl.NumberFormat('en-US',
 * { maximumFractionDigits: digits }) writes. Like it, this rounds the number as written (its shortest
 * decimal: 0.15 → 0.2, where toFixed gives 0.1), half away from zero, and keeps the sign of a
 * negative that rounds to zero ("-0").
 */
function grouped(x: number, digits: 0 | 1 = 0): string {
  const written = String(Math.abs(x));
  if (!/^\d{1,15}(\.\d+)?$/.test(written)) return INTL_GROUPED[digits]!().format(x); // NaN, ∞, exponents
  const rounded = (Math.round(Number(`${written}e${digits}`)) / 10 ** digits).toFixed(digits).replace(/\.0$/, '');
  const [whole, decimals] = rounded.split('.');
  const sign = x < 0 || Object.is(x, -0) ? '-' : '';
  return `${sign}${whole!.replace(/\B(?=(\d{3})+$)/g, ',')}${decimals ? `.${decimals}` : ''}`;
}
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

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "Apr 5, 2026": Intl's en-US medium date, written out (an invalid date or an odd year goes to Intl). */
export function formatDate(iso: string): string {
  const d = new Date(iso);
  const year = d.getFullYear();
  if (!(year >= 1000 && year <= 9999)) return INTL_DATE().format(d);
  return `${MONTHS[d.getMonth()]} ${d.getDate()}, ${year}`;
}
/** "Apr 5, 2026, 2:07 PM" */
export const formatDateTime = (iso: string) => DATE_TIME().format(new Date(iso));
