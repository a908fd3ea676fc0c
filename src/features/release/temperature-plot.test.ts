import { describe, expect, it } from 'vitest';
import { bandSpan, linearScale, plotFrame, temperatureTicks, timeTicks } from './temperature-plot';

const HOUR = 3_600_000;
const size = { width: 600, height: 240, margin: { top: 10, right: 10, bottom: 30, left: 40 } };

describe('the temperature plot', () => {
  it('maps time left to right and °F bottom to top, the span rounded out to 10 °F', () => {
    const readings = [
      { at: '2027-03-01T08:00:00Z', temperatureF: 45 },
      { at: '2027-03-01T12:00:00Z', temperatureF: 62 },
    ];
    const f = plotFrame(readings, [Date.parse('2027-03-01T16:00:00Z')], size);
    expect([f.fMin, f.fMax]).toEqual([40, 70]);
    expect(f.x(Date.parse('2027-03-01T08:00:00Z'))).toBe(40);
    expect(f.x(Date.parse('2027-03-01T16:00:00Z'))).toBe(590); // the marker widens the span
    expect(f.x(Date.parse('2027-03-01T12:00:00Z'))).toBe(315);
    expect(f.y(40)).toBe(210);
    expect(f.y(70)).toBe(10);
  });

  it('picks round ticks, at most six', () => {
    expect(temperatureTicks(40, 70)).toEqual([40, 50, 60, 70]);
    expect(temperatureTicks(40, 50)).toEqual([40, 42, 44, 46, 48, 50]);
    expect(temperatureTicks(30, 80)).toEqual([30, 40, 50, 60, 70, 80]);
    const t0 = Date.parse('2027-03-01T08:10:00Z');
    expect(timeTicks(t0, t0 + 8 * HOUR).map((t) => new Date(t).toISOString().slice(11, 16))).toEqual(['10:00', '12:00', '14:00', '16:00']);
    // UTC−5: the local even hours are the odd hours in UTC.
    expect(timeTicks(t0, t0 + 8 * HOUR, 6, -5 * HOUR).map((t) => new Date(t).toISOString().slice(11, 16))).toEqual(['09:00', '11:00', '13:00', '15:00']);
    expect(timeTicks(t0, t0 + 8 * HOUR, 6, 30 * 60_000).map((t) => new Date(t).toISOString().slice(11, 16))).toEqual(['09:30', '11:30', '13:30', '15:30']);
  });

  it('cuts a band to the °F shown, and drops one outside it', () => {
    const f = { fMin: 40, fMax: 70, y: linearScale(40, 70, 210, 10) };
    const warm = bandSpan({ minF: 60, maxF: 100 }, f)!;
    expect(warm.y).toBe(10);
    expect(warm.height).toBeCloseTo(200 / 3);
    expect(bandSpan({ minF: 0, maxF: 40 }, f)).toBeNull();
  });

  it('survives an empty log and a single reading', () => {
    const empty = plotFrame([], [], size);
    expect([empty.fMin, empty.fMax]).toEqual([30, 80]);
    const one = plotFrame([{ at: '2027-03-01T08:00:00Z', temperatureF: 50 }], [], size);
    expect(one.x(Date.parse('2027-03-01T08:00:00Z'))).toBe(315);
    expect(one.timeTicks).toHaveLength(1);
  });
});
