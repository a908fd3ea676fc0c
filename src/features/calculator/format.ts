// How the calculator writes numbers: US first (the engine's units), metric beside.

import { fToC, inToMm, psiToBar, psiToKpa, type Container } from '@shared/trade';
import type { PressureUnit, TemperatureUnit } from './form';

const ML_PER_QUART = 946.352946;

const trim = (s: string) => s.replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
const fixed = (x: number, digits: number) => trim(x.toFixed(digits));

/** Metric pressure in the unit the person works in (kPa if they chose it, else bar). */
export function metricPressure(psi: number, unit: PressureUnit): string {
  if (unit === 'kPa') return `${fixed(psiToKpa(psi), 0)} kPa`;
  const bar = psiToBar(psi);
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

export const PRESSURE_UNIT_LABEL: Record<PressureUnit, string> = { psi: 'psi', bar: 'bar', kPa: 'kPa' };
export const TEMPERATURE_UNIT_LABEL: Record<TemperatureUnit, string> = { F: '°F', C: '°C' };

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
