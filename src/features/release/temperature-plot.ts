// The scale maths of a temperature log's plot (plain SVG): time → x, °F → y, and their ticks.
// Pure, so the card only draws.

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;
/** Steps a time axis may take, shortest first. */
const TIME_STEPS = [15 * MINUTE, 30 * MINUTE, HOUR, 2 * HOUR, 3 * HOUR, 6 * HOUR, 12 * HOUR, DAY, 2 * DAY, 7 * DAY];
/** Steps a temperature axis may take, °F. */
const TEMPERATURE_STEPS = [1, 2, 5, 10, 20, 50];

export interface PlotSize {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
}

export interface PlotFrame extends PlotSize {
  /** Epoch ms shown, left to right. */
  tMin: number;
  tMax: number;
  /** °F shown, bottom to top. */
  fMin: number;
  fMax: number;
  x: (ms: number) => number;
  y: (f: number) => number;
  timeTicks: number[];
  temperatureTicks: number[];
}

/** A straight map of [d0, d1] onto [r0, r1]; an empty domain maps to the middle of the range. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (v: number) => number {
  if (d1 === d0) return () => (r0 + r1) / 2;
  const k = (r1 - r0) / (d1 - d0);
  return (v) => r0 + (v - d0) * k;
}

/** Round °F ticks from fMin to fMax (both included when they fall on the step), at most `most` of them. */
export function temperatureTicks(fMin: number, fMax: number, most = 6): number[] {
  const step = TEMPERATURE_STEPS.find((s) => Math.floor(fMax / s) - Math.ceil(fMin / s) + 1 <= most) ?? 100;
  const ticks: number[] = [];
  for (let f = Math.ceil(fMin / step) * step; f <= fMax; f += step) ticks.push(f);
  return ticks;
}

/**
 * Time ticks on a whole step (15 min … 7 days) between t0 and t1, at most `most` of them.
 * `offsetMs` is the local zone's offset from UTC, so an hour or day step lands on local hours and midnights.
 */
export function timeTicks(t0: number, t1: number, most = 6, offsetMs = 0): number[] {
  if (!(t1 > t0)) return [t0];
  const step = TIME_STEPS.find((s) => (t1 - t0) / s < most) ?? Math.ceil((t1 - t0) / (most * DAY)) * DAY;
  const ticks: number[] = [];
  for (let t = Math.ceil((t0 + offsetMs) / step) * step - offsetMs; t <= t1; t += step) ticks.push(t);
  return ticks;
}

/**
 * The frame of the plot: the time span covers the readings and every marker; the °F span covers the
 * readings with 5 °F either side, rounded out to 10 °F (30–80 °F with no readings).
 */
export function plotFrame(readings: readonly { at: string; temperatureF: number }[], markerTimes: readonly number[], size: PlotSize, offsetMs = 0): PlotFrame {
  const times = [...readings.map((r) => Date.parse(r.at)), ...markerTimes].filter(Number.isFinite);
  const temps = readings.map((r) => r.temperatureF);
  const tMin = times.length ? Math.min(...times) : 0;
  const tMax = times.length ? Math.max(...times) : 0;
  const fMin = temps.length ? Math.floor((Math.min(...temps) - 5) / 10) * 10 : 30;
  const fMax = temps.length ? Math.ceil((Math.max(...temps) + 5) / 10) * 10 : 80;
  const { width, height, margin } = size;
  return {
    ...size,
    tMin, tMax, fMin, fMax,
    x: linearScale(tMin, tMax, margin.left, width - margin.right),
    y: linearScale(fMin, fMax, height - margin.bottom, margin.top),
    timeTicks: timeTicks(tMin, tMax, 6, offsetMs),
    temperatureTicks: temperatureTicks(fMin, fMax),
  };
}

/** The readings as an SVG polyline's `points`. */
export function polylinePoints(readings: readonly { at: string; temperatureF: number }[], frame: Pick<PlotFrame, 'x' | 'y'>): string {
  return readings.map((r) => `${frame.x(Date.parse(r.at)).toFixed(1)},${frame.y(r.temperatureF).toFixed(1)}`).join(' ');
}

/** A band's top and bottom on the plot, cut to the °F shown; null when none of it is shown. */
export function bandSpan(band: { minF: number; maxF: number }, frame: Pick<PlotFrame, 'fMin' | 'fMax' | 'y'>): { y: number; height: number } | null {
  const lo = Math.max(band.minF, frame.fMin);
  const hi = Math.min(band.maxF, frame.fMax);
  if (hi <= lo) return null;
  return { y: frame.y(hi), height: frame.y(lo) - frame.y(hi) };
}
