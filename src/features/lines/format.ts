import { fToC, psiToBar } from '@shared/trade/index';
import type { LineDto } from '@shared/schemas/lines';

const num = (v: number, digits = 0) => v.toLocaleString('en-US', { maximumFractionDigits: digits });

export const formatSize = (nominalSize: string) => `${nominalSize}"`;
export const formatPressure = (psi: number) => `${num(psi)} psi`;
export const formatPressureBar = (psi: number) => `${num(psiToBar(psi), 1)} bar`;
export const formatTemperature = (f: number) => `${num(f)} °F`;
export const formatTemperatureC = (f: number) => `${num(fToC(f), 1)} °C`;

/** "Sch 80", "SDR 21", or both when a line carries both. */
export function formatWall(line: Pick<LineDto, 'schedule' | 'sdr'>): string {
  const parts = [line.schedule ? `Sch ${line.schedule.replace(/^sch(edule)?\s*/i, '')}` : null, line.sdr ? `SDR ${num(line.sdr, 1)}` : null];
  return parts.filter(Boolean).join(' · ') || '—';
}

export const formatDate = (iso: string) => new Date(iso).toLocaleDateString('en-US', { year: 'numeric', month: 'short', day: 'numeric' });

/**
 * Whether a service name reads like a chemical rather than water or air: a deliberately wide net,
 * because showing the chemical caution on a water line costs less than missing it on an acid line.
 */
const NOT_CHEMICAL = /^(?:(?:potable|process|service|cooling|chilled|fire|raw|city|soft(?:ened)?|filtered|hot|cold|ro|di|deionized|demin(?:eralized)?|ultrapure|upw)\s+)*(?:water|air|drain|vent|permeate|condensate)s?$/i;
export const looksChemical = (service: string) => !NOT_CHEMICAL.test(service.trim());
