import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cureCompleteAt, type CureLogInput } from './cure-log';

const H = 3_600_000;
const start = Date.UTC(2025, 0, 6, 8, 0);
// 2" PVC at ≤160 psi, schedule A [mfr]: 30 min at 60–100 °F, 45 min at 40–60 °F, 1 h at 0–40 °F
const base: CureLogInput = {
  material: 'PVC', nominalSize: '2', relativeHumidity: 40, pressurePsi: 100,
  cureStart: start, plannedTemperatureF: 70, readings: [],
};
const at = (hours: number) => start + hours * H;

describe('cure complete from a temperature log', () => {
  it('with no readings the planned end stands (start + cure at the planned temperature)', () => {
    const r = cureCompleteAt(base);
    expect(r).toMatchObject({ ok: true, basis: 'planned', lengthenedMinutes: 0 });
    expect(r.ok && r.completeAt.getTime()).toBe(start + 30 * 60_000);
  });

  it('a cold interval lengthens the cure: 45 °F throughout takes the 40–60 °F time, 45 min', () => {
    const r = cureCompleteAt({ ...base, readings: [{ at: start, temperatureF: 45 }, { at: at(2), temperatureF: 45 }] });
    expect(r).toMatchObject({ ok: true, basis: 'log', lengthenedMinutes: 15, projected: false });
    expect(r.ok && r.completeAt.getTime()).toBe(start + 45 * 60_000);
  });

  it('each interval counts at its own band: 15 min warm (1/2 done) then cold at 1 h a cure → 30 min more', () => {
    const r = cureCompleteAt({
      ...base,
      readings: [{ at: start, temperatureF: 70 }, { at: start + 15 * 60_000, temperatureF: 70 }, { at: start + 15 * 60_000 + 1, temperatureF: 30 }, { at: at(3), temperatureF: 30 }],
    });
    expect(r.ok && Math.round((r.completeAt.getTime() - start) / 60_000)).toBe(45);
  });

  it('between two readings the lower temperature counts', () => {
    const r = cureCompleteAt({ ...base, readings: [{ at: start, temperatureF: 70 }, { at: at(1), temperatureF: 35 }] });
    expect(r.ok && r.intervals[0]).toMatchObject({ temperatureF: 35, temperatureBand: '0–40 °F', minutesAtBand: 60 });
    expect(r.ok && r.completeAt.getTime()).toBe(at(1));
  });

  it('a warm log never ends the cure before the planned end', () => {
    const r = cureCompleteAt({ ...base, plannedTemperatureF: 50, readings: [{ at: start, temperatureF: 90 }, { at: at(5), temperatureF: 95 }] });
    expect(r).toMatchObject({ ok: true, basis: 'planned', lengthenedMinutes: 0 });
    expect(r.ok && r.completeAt.getTime()).toBe(start + 45 * 60_000);
    expect(r.ok && r.logCompleteAt?.getTime()).toBe(start + 30 * 60_000);
  });

  it('a log that ends early is projected at its last reading and says so', () => {
    const r = cureCompleteAt({ ...base, readings: [{ at: start, temperatureF: 30 }] });
    expect(r).toMatchObject({ ok: true, projected: true });
    expect(r.ok && r.completeAt.getTime()).toBe(at(1));
    expect(r.ok && r.notes.join(' ')).toMatch(/projected/);
  });

  it("humidity above 60% in a reading adds 50% to that interval's cure", () => {
    const r = cureCompleteAt({ ...base, readings: [{ at: start, temperatureF: 70, relativeHumidity: 80 }, { at: at(2), temperatureF: 70, relativeHumidity: 80 }] });
    expect(r.ok && r.completeAt.getTime()).toBe(start + 45 * 60_000);
  });

  it('a reading outside the table cannot be counted: refused, engineering judgement needed', () => {
    const r = cureCompleteAt({ ...base, readings: [{ at: start, temperatureF: -5 }, { at: at(1), temperatureF: -5 }] });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.reason).toMatch(/engineering judgement needed/i);
  });

  it('without a planned temperature or planned end it refuses: a log only lengthens a planned hold', () => {
    const { plannedTemperatureF: _drop, ...rest } = base;
    expect(cureCompleteAt(rest).ok).toBe(false);
    expect(cureCompleteAt({ ...rest, plannedEnd: at(2) })).toMatchObject({ ok: true, completeAt: new Date(at(2)) });
  });

  it('now tells whether the cure is complete and how many minutes remain', () => {
    expect(cureCompleteAt({ ...base, now: start + 10 * 60_000 })).toMatchObject({ ok: true, complete: false, remainingMinutes: 20 });
    expect(cureCompleteAt({ ...base, now: at(1) })).toMatchObject({ ok: true, complete: true, remainingMinutes: 0 });
  });

  it('the set phase uses the set times: 2" at 45 °F sets in 10 min', () => {
    const r = cureCompleteAt({ ...base, phase: 'set', plannedTemperatureF: 45, readings: [] });
    expect(r.ok && r.completeAt.getTime()).toBe(start + 10 * 60_000);
  });

  it('property: a log never gives a completion earlier than the planned end', () => {
    const reading = fc.record({ at: fc.integer({ min: start - H, max: at(48) }), temperatureF: fc.double({ min: 0, max: 100, noNaN: true }) });
    fc.assert(fc.property(fc.array(reading, { maxLength: 20 }), fc.double({ min: 0, max: 100, noNaN: true }), (readings, planned) => {
      const r = cureCompleteAt({ ...base, plannedTemperatureF: planned, readings });
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.completeAt.getTime()).toBeGreaterThanOrEqual(r.plannedEnd.getTime());
    }));
  });

  it('property: cooling any reading never brings completion earlier', () => {
    const reading = fc.record({ at: fc.integer({ min: start, max: at(24) }), temperatureF: fc.double({ min: 20, max: 100, noNaN: true }) });
    fc.assert(fc.property(fc.array(reading, { minLength: 1, maxLength: 10 }), fc.nat(9), fc.double({ min: 0, max: 20, noNaN: true }), (readings, i, drop) => {
      const k = i % readings.length;
      const colder = readings.map((x, j) => (j === k ? { ...x, temperatureF: x.temperatureF - drop } : x));
      const a = cureCompleteAt({ ...base, readings });
      const b = cureCompleteAt({ ...base, readings: colder });
      if (a.ok && b.ok) expect(b.completeAt.getTime()).toBeGreaterThanOrEqual(a.completeAt.getTime() - 1);
    }));
  });
});
