import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cureSchedule, type CureScheduleInput } from './cure-schedule';
import { CURE_SCHEDULES } from './cure-tables';
import { NOMINAL_SIZES, parseNominalSize } from './nominal-size';

const input = fc.record({
  material: fc.constantFrom('PVC', 'CPVC'),
  nominalSize: fc.constantFrom(...NOMINAL_SIZES),
  temperatureF: fc.double({ min: -20, max: 120, noNaN: true }),
  relativeHumidity: fc.double({ min: 0, max: 100, noNaN: true }),
  pressurePsi: fc.double({ min: 0, max: 400, noNaN: true }),
  schedule: fc.constantFrom('A', 'B'),
});

type Times = { set: number; cure: number } | null;
const times = (i: CureScheduleInput): Times => {
  const r = cureSchedule(i);
  return r.ok ? { set: r.setMinutes, cure: r.cureMinutes } : null;
};

/** When both give a time, the second never gives less. */
function neverShorter(a: Times, b: Times) {
  if (a && b) {
    expect(b.set).toBeGreaterThanOrEqual(a.set);
    expect(b.cure).toBeGreaterThanOrEqual(a.cure);
  }
}

describe('cure schedule properties (either schedule)', () => {
  it('colder never shortens a set or a cure', () => {
    fc.assert(fc.property(input, fc.double({ min: 0, max: 60, noNaN: true }), (i, drop) => {
      neverShorter(times(i), times({ ...i, temperatureF: i.temperatureF - drop }));
    }));
  });

  it('a larger size never shortens a set or a cure', () => {
    fc.assert(fc.property(input, fc.constantFrom(...NOMINAL_SIZES), (i, other) => {
      const [small, large] = [i.nominalSize, other].sort((a, b) => (parseNominalSize(a) ?? 0) - (parseNominalSize(b) ?? 0));
      neverShorter(times({ ...i, nominalSize: small as string }), times({ ...i, nominalSize: large as string }));
    }));
  });

  it('a higher pressure never shortens a cure', () => {
    fc.assert(fc.property(input, fc.double({ min: 0, max: 200, noNaN: true }), (i, more) => {
      neverShorter(times(i), times({ ...i, pressurePsi: i.pressurePsi + more }));
    }));
  });

  it('humidity above 60% never shortens a set or a cure', () => {
    fc.assert(fc.property(input, fc.double({ min: 60.001, max: 100, noNaN: true }), (i, rh) => {
      neverShorter(times({ ...i, relativeHumidity: Math.min(i.relativeHumidity, 60) }), times({ ...i, relativeHumidity: rh }));
    }));
  });

  it("no input yields a time outside the tables' range without ok:false", () => {
    const all = CURE_SCHEDULES.flatMap((s) => [...Object.values(s.set), ...s.cure.map((c) => c.minutes)].flatMap((m) => Object.values(m)));
    const lo = Math.min(...all);
    const hi = Math.ceil(Math.max(...all) * 1.5);
    fc.assert(fc.property(input, (i) => {
      const r = cureSchedule(i);
      if (!r.ok) {
        expect(r.reason.length).toBeGreaterThan(0);
        return;
      }
      for (const v of [r.setMinutes, r.cureMinutes]) {
        expect(Number.isInteger(v)).toBe(true);
        expect(v).toBeGreaterThanOrEqual(lo);
        expect(v).toBeLessThanOrEqual(hi);
      }
      expect(i.temperatureF).toBeGreaterThanOrEqual(0);
      expect(i.temperatureF).toBeLessThanOrEqual(100);
    }));
  });

  it('never throws, whatever it is given', () => {
    const any = fc.oneof(fc.anything(), fc.constantFrom('PVC', 'CPVC', '2', 'A', 50, -1, Number.NaN));
    fc.assert(fc.property(fc.tuple(any, any, any, any, any, any), ([material, nominalSize, temperatureF, relativeHumidity, pressurePsi, schedule]) => {
      const r = cureSchedule({ material, nominalSize, temperatureF, relativeHumidity, pressurePsi, schedule } as never);
      expect(typeof r.ok).toBe('boolean');
    }));
  });
});
