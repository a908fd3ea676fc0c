// When is a joint's cure (or set) complete, given a temperature log recorded during it?
// Choices, all on the side of a longer hold:
// - the log is a step series: between two readings the LOWER of the two counts (the temperature
//   in between is unknown, and the lowest temperature during the cure is the one that counts);
//   humidity likewise takes the HIGHER of the two;
// - from the cure start to the first reading, the first reading's temperature counts;
//   readings before the start are dropped except the last one, which stands at the start;
// - each interval accumulates duration / (cure time at that interval's band) of the cure; the
//   cure is complete when the fractions add up to 1; past the last reading the last reading's
//   temperature is projected forward (result says `projected`);
// - the result is never earlier than the planned end (start + cure at the planned temperature,
//   or a planned end given outright): a log can only lengthen a hold, never shorten it;
// - an interval whose temperature is outside the schedule's bands cannot be counted: refused,
//   engineering judgement needed. Readings after the cure is complete are not looked at.

import { cureSchedule, type CureScheduleInput } from './cure-schedule';
import { isFiniteNumber, refuse, type Refusal } from './result';

export type Instant = Date | number;

export interface CureReading {
  at: Instant;
  temperatureF: number;
  relativeHumidity?: number;
}

export interface CureLogInput extends Omit<CureScheduleInput, 'temperatureF'> {
  cureStart: Instant;
  /** Temperature the hold was planned at; planned end = start + cure at this temperature. */
  plannedTemperatureF?: number;
  /** Or the planned end itself; where both are given the later one counts. */
  plannedEnd?: Instant;
  readings: readonly CureReading[];
  now?: Instant;
  /** 'cure' (default): no pressure until then; 'set': do not handle until then. */
  phase?: 'set' | 'cure';
}

export interface CureInterval {
  from: Date;
  /** null for the projection past the last reading. */
  to: Date | null;
  temperatureF: number;
  temperatureBand: string;
  minutesAtBand: number;
  fraction: number;
}

export interface CureLogResult {
  ok: true;
  completeAt: Date;
  plannedEnd: Date;
  logCompleteAt: Date | null;
  basis: 'planned' | 'log';
  lengthenedMinutes: number;
  projected: boolean;
  complete?: boolean;
  remainingMinutes?: number;
  intervals: CureInterval[];
  notes: string[];
  source: string;
}

const MINUTE = 60_000;

function ms(x: Instant | undefined): number {
  return x instanceof Date ? x.getTime() : typeof x === 'number' ? x : Number.NaN;
}

type Point = { at: number; temperatureF: number; rh: number };

function minutesAt(input: CureLogInput, temperatureF: number, rh: number) {
  const r = cureSchedule({ ...input, temperatureF, relativeHumidity: rh });
  if (!r.ok) return r;
  return { ok: true as const, minutes: input.phase === 'set' ? r.setMinutes : r.cureMinutes, band: r.temperatureBand, source: r.source };
}

function plannedEndMs(input: CureLogInput, start: number): number | Refusal {
  const ends: number[] = [];
  if (input.plannedEnd !== undefined) {
    const end = ms(input.plannedEnd);
    if (!Number.isFinite(end)) return refuse('Planned end must be a date.');
    ends.push(end);
  }
  if (input.plannedTemperatureF !== undefined) {
    const at = minutesAt(input, input.plannedTemperatureF, input.relativeHumidity);
    if (!at.ok) return refuse(`Planned cure: ${at.reason}`);
    ends.push(start + at.minutes * MINUTE);
  }
  if (ends.length === 0) return refuse('Give the planned cure temperature or the planned end: a log can only lengthen a planned hold.');
  return Math.max(...ends);
}

function points(input: CureLogInput, start: number): Point[] | Refusal {
  const all: Point[] = [];
  for (const r of input.readings) {
    const at = ms(r.at);
    const rh = r.relativeHumidity ?? input.relativeHumidity;
    if (!Number.isFinite(at) || !isFiniteNumber(r.temperatureF) || !isFiniteNumber(rh)) {
      return refuse('Every reading needs a time and a temperature (°F).');
    }
    all.push({ at, temperatureF: r.temperatureF, rh });
  }
  all.sort((a, b) => a.at - b.at);
  const before = all.filter((p) => p.at < start);
  const after = all.filter((p) => p.at >= start);
  const last = before[before.length - 1];
  return last ? [{ ...last, at: start }, ...after] : after;
}

type Span = { from: number; to: number | null; temperatureF: number; rh: number };

function spans(pts: Point[], start: number): Span[] {
  const first = pts[0];
  if (!first) return [];
  const out: Span[] = [];
  if (first.at > start) out.push({ from: start, to: first.at, temperatureF: first.temperatureF, rh: first.rh });
  for (let i = 0; i + 1 < pts.length; i++) {
    const a = pts[i] as Point;
    const b = pts[i + 1] as Point;
    if (b.at > a.at) out.push({ from: a.at, to: b.at, temperatureF: Math.min(a.temperatureF, b.temperatureF), rh: Math.max(a.rh, b.rh) });
  }
  const last = pts[pts.length - 1] as Point;
  out.push({ from: last.at, to: null, temperatureF: last.temperatureF, rh: last.rh });
  return out;
}

function accumulate(input: CureLogInput, list: Span[]) {
  const intervals: CureInterval[] = [];
  let done = 0;
  for (const s of list) {
    const at = minutesAt(input, s.temperatureF, s.rh);
    if (!at.ok) {
      return refuse(`Cannot compute the cure from the log at ${new Date(s.from).toISOString()}: ${at.reason} Engineering judgement needed.`);
    }
    const need = (1 - done) * at.minutes * MINUTE;
    const end = s.to === null || s.to - s.from >= need ? s.from + need : null;
    const to = end ?? (s.to as number);
    const fraction = (to - s.from) / (at.minutes * MINUTE);
    intervals.push({ from: new Date(s.from), to: s.to === null ? null : new Date(to), temperatureF: s.temperatureF, temperatureBand: at.band, minutesAtBand: at.minutes, fraction });
    done += fraction;
    if (end !== null) return { ok: true as const, end, projected: s.to === null, intervals, source: at.source };
  }
  return refuse('The log has no readings.');
}

export function cureCompleteAt(input: CureLogInput): CureLogResult | Refusal {
  const start = ms(input.cureStart);
  if (!Number.isFinite(start)) return refuse('Cure start must be a date.');
  const planned = plannedEndMs(input, start);
  if (typeof planned !== 'number') return planned;
  const pts = points(input, start);
  if (!Array.isArray(pts)) return pts;
  const notes: string[] = [];
  let log: ReturnType<typeof accumulate> | null = null;
  if (pts.length === 0) notes.push('No readings: the planned end stands.');
  else {
    log = accumulate(input, spans(pts, start));
    if (!log.ok) return log;
    if (log.projected) notes.push("The log ends before the cure completes: the rest is projected at the last reading's temperature.");
  }
  const logEnd = log && log.ok ? log.end : null;
  const completeAt = Math.max(planned, logEnd ?? planned);
  return {
    ok: true,
    completeAt: new Date(completeAt),
    plannedEnd: new Date(planned),
    logCompleteAt: logEnd === null ? null : new Date(logEnd),
    basis: completeAt > planned ? 'log' : 'planned',
    lengthenedMinutes: Math.ceil((completeAt - planned) / MINUTE),
    projected: log?.ok === true && log.projected,
    ...nowFields(input.now, completeAt),
    intervals: log && log.ok ? log.intervals : [],
    notes,
    source: `${log && log.ok ? log.source : 'planned hold'}; log counted interval by interval, never shortening the planned hold [practice]`,
  };
}

function nowFields(now: Instant | undefined, completeAt: number): { complete?: boolean; remainingMinutes?: number } {
  const n = ms(now);
  if (!Number.isFinite(n)) return {};
  return { complete: n >= completeAt, remainingMinutes: Math.max(0, Math.ceil((completeAt - n) / MINUTE)) };
}
