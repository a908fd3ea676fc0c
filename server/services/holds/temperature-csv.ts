// Reading a data logger's CSV: the common layouts put a line or two of metadata (logger name,
// serial, "Interval: 5 min") before the header; the header names a time column (or a date and a
// time column), a temperature column whose name says °F or °C, and perhaps a humidity column.
// Times are ISO (with an offset: exact) or local wall-clock times ("2026-12-02 14:05",
// "12/02/2026 2:05 PM"), read in the plant's time zone. Pure: text in, readings and problems out.

import Papa from 'papaparse';
import { cToF } from '@shared/trade';

export interface LoggedReading {
  at: Date;
  temperatureF: number;
  relativeHumidity?: number;
}

export interface TemperatureLogRead {
  readings: LoggedReading[];
  unit: 'F' | 'C' | null;
  /** Row problems and layout problems, as sentences; a log with no readings has at least one. */
  problems: string[];
}

const norm = (s: string) => s.trim().toLowerCase();
const isTime = (h: string) => /\b(time|timestamp|date ?time)\b/.test(norm(h));
const isDate = (h: string) => /^date\b/.test(norm(h));
const isTemp = (h: string) => /temp|°[fc]|\bdeg/.test(norm(h));
const isRh = (h: string) => /\brh\b|humid/.test(norm(h));

function unitOf(h: string): 'F' | 'C' | null {
  const s = norm(h);
  if (/°c|\(c\)|\[c\]|_c\b|\bc\b|celsius|degc/.test(s)) return 'C';
  if (/°f|\(f\)|\[f\]|_f\b|\bf\b|fahrenheit|degf/.test(s)) return 'F';
  return null;
}

/** The UTC offset of `timeZone` at instant `ms`, in minutes. */
function offsetMinutes(ms: number, timeZone: string): number {
  const name = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' }).formatToParts(ms).find((p) => p.type === 'timeZoneName')?.value ?? 'GMT';
  const m = /GMT([+-])(\d{2}):?(\d{2})?/.exec(name);
  return m ? (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3] ?? 0)) : 0;
}

/** A wall-clock time in `timeZone` as an instant (a time a clock change skips is read as the later hour). */
export function wallClockToInstant(y: number, mo: number, d: number, h: number, mi: number, s: number, timeZone: string): Date {
  const guess = Date.UTC(y, mo - 1, d, h, mi, s);
  const first = guess - offsetMinutes(guess, timeZone) * 60_000;
  return new Date(guess - offsetMinutes(first, timeZone) * 60_000);
}

/** An instant from a logger's time text, or null. */
export function parseLoggedTime(text: string, timeZone: string): Date | null {
  const t = text.trim();
  if (/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})$/.test(t)) {
    const d = new Date(t);
    return Number.isNaN(d.getTime()) ? null : d;
  }
  let m = /^(\d{4})-(\d{1,2})-(\d{1,2})[ T](\d{1,2}):(\d{2})(?::(\d{2}))?$/.exec(t);
  if (m) return wallClockToInstant(+m[1]!, +m[2]!, +m[3]!, +m[4]!, +m[5]!, +(m[6] ?? 0), timeZone);
  m = /^(\d{1,2})\/(\d{1,2})\/(\d{4}),? (\d{1,2}):(\d{2})(?::(\d{2}))?\s*([ap]\.?m\.?)?$/i.exec(t);
  if (m) {
    let h = +m[4]!;
    const ampm = m[7]?.toLowerCase().replace(/\./g, '');
    if (ampm === 'pm' && h < 12) h += 12;
    if (ampm === 'am' && h === 12) h = 0;
    return wallClockToInstant(+m[3]!, +m[1]!, +m[2]!, h, +m[5]!, +(m[6] ?? 0), timeZone);
  }
  return null;
}

export function readTemperatureLog(text: string, timeZone: string): TemperatureLogRead {
  const rows = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { delimiter: ',', skipEmptyLines: 'greedy' }).data;
  const headerAt = rows.findIndex((r) => r.some(isTemp) && r.some((h) => isTime(h) || isDate(h)));
  if (headerAt < 0) return { readings: [], unit: null, problems: ['No header line names a time (or date) column and a temperature column.'] };
  const header = rows[headerAt]!;
  const tempCol = header.findIndex(isTemp);
  const unit = unitOf(header[tempCol]!);
  if (!unit) return { readings: [], unit: null, problems: [`The temperature column "${header[tempCol]!.trim()}" does not say °F or °C; name the unit in its header, e.g. "Temperature (°C)".`] };
  const timeCol = header.findIndex(isTime);
  const dateCol = header.findIndex((h, i) => isDate(h) && i !== timeCol);
  const rhCol = header.findIndex(isRh);
  const problems: string[] = [];
  const readings: LoggedReading[] = [];
  rows.slice(headerAt + 1).forEach((r, i) => {
    const line = headerAt + i + 2;
    const timeText = dateCol >= 0 && timeCol >= 0 && !/\d{4}/.test(r[timeCol] ?? '') ? `${r[dateCol] ?? ''} ${r[timeCol] ?? ''}` : (r[timeCol >= 0 ? timeCol : dateCol] ?? '');
    const at = parseLoggedTime(timeText, timeZone);
    const t = Number((r[tempCol] ?? '').trim());
    if (!at) return void problems.push(`Line ${line}: "${timeText.trim()}" is not a time this reader knows (ISO, "2026-12-02 14:05" or "12/02/2026 2:05 PM").`);
    if ((r[tempCol] ?? '').trim() === '' || !Number.isFinite(t)) return void problems.push(`Line ${line}: "${(r[tempCol] ?? '').trim()}" is not a temperature.`);
    const rh = rhCol >= 0 ? Number((r[rhCol] ?? '').trim()) : Number.NaN;
    readings.push({ at, temperatureF: Math.round((unit === 'C' ? cToF(t) : t) * 10) / 10, ...(Number.isFinite(rh) && (r[rhCol] ?? '').trim() !== '' ? { relativeHumidity: rh } : {}) });
  });
  readings.sort((a, b) => a.at.getTime() - b.at.getTime());
  if (!readings.length && !problems.length) problems.push('The log has a header but no readings.');
  return { readings, unit, problems };
}
