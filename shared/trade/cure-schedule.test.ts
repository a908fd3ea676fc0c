import { describe, expect, it } from 'vitest';
import { cureSchedule, listCureSchedules, type CureScheduleInput } from './cure-schedule';
import {
  A_CURE, A_CURE_COLUMNS, A_SET, A_SET_SIZES, B_CURE, B_CURE_COLUMNS, B_SET, B_SET_SIZES, BAND_TEMPERATURE,
} from './cure-reference.fixture';

const base: CureScheduleInput = { material: 'PVC', nominalSize: '2', temperatureF: 75, relativeHumidity: 40, pressurePsi: 100 };
const run = (over: Partial<CureScheduleInput>) => cureSchedule({ ...base, ...over });
const setOf = (over: Partial<CureScheduleInput>) => { const r = run(over); return r.ok ? r.setMinutes : Number.NaN; };

describe("Schedule A, a manufacturer's installation manual", () => {
  for (const row of A_SET) {
    row.cells.forEach((want, i) => {
      const size = A_SET_SIZES[i] as string;
      it(`Schedule A set table [mfr]: ${size}" at ${row.band} sets in ${want} min`, () => {
        expect(setOf({ nominalSize: size, temperatureF: BAND_TEMPERATURE[row.band], pressurePsi: 50 })).toBe(want);
      });
    });
  }
  for (const row of A_CURE) {
    row.cells.forEach((want, i) => {
      const col = A_CURE_COLUMNS[i]!;
      it(`Schedule A cure table [mfr]: ${col.label} at ${row.band} cures in ${want} min`, () => {
        const r = run({ nominalSize: col.size, pressurePsi: col.psi, temperatureF: BAND_TEMPERATURE[row.band] });
        expect(r).toMatchObject({ ok: true, cureMinutes: want, schedule: 'A', temperatureBand: row.band });
        expect(r.ok && r.source).toContain("a manufacturer's installation manual");
      });
    });
  }
});

describe('Schedule B, a plastics piping technical manual', () => {
  for (const row of B_SET) {
    row.cells.forEach((want, i) => {
      const size = B_SET_SIZES[i] as string;
      it(`Schedule B set table [pub]: ${size}" at ${row.band} sets in ${want} min`, () => {
        expect(setOf({ schedule: 'B', nominalSize: size, temperatureF: BAND_TEMPERATURE[row.band], pressurePsi: 50 })).toBe(want);
      });
    });
  }
  for (const row of B_CURE) {
    row.cells.forEach((want, i) => {
      const col = B_CURE_COLUMNS[i]!;
      it(`Schedule B cure table [pub]: ${col.size}" ${col.label} at ${row.band} cures in ${want} min`, () => {
        const r = run({ schedule: 'B', nominalSize: col.size, pressurePsi: col.psi, temperatureF: BAND_TEMPERATURE[row.band] });
        expect(r).toMatchObject({ ok: true, cureMinutes: want, schedule: 'B' });
        expect(r.ok && r.source).toContain('a plastics piping technical manual');
      });
    });
  }

  it('Schedule B: 18" is beyond its largest band (10"–16") and is refused', () => {
    const r = run({ schedule: 'B', nominalSize: '18', pressurePsi: 50 });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.reason).toMatch(/supervisor may enter an engineering cure time/i);
  });

  it('common practice: 3-1/2" and 2-1/2" fall in the band that contains them (4"–8" and 1-1/2"–3")', () => {
    expect(run({ schedule: 'B', nominalSize: '3-1/2' })).toMatchObject({ ok: true, sizeBand: '4"–8"' });
    expect(run({ schedule: 'B', nominalSize: '2-1/2' })).toMatchObject({ ok: true, sizeBand: '1-1/2"–3"' });
  });

  it('common practice: exactly 180 psi takes the >180 column of schedule B (the longer)', () => {
    expect(run({ schedule: 'B', nominalSize: '1', pressurePsi: 180 })).toMatchObject({ ok: true, pressureBand: '>180–370 psi', cureMinutes: 360 });
  });
});

describe('band edges take the longer time (common practice)', () => {
  it('60 °F is in the 40–60 °F band, 40 °F in 0–40 °F, 100 °F in 60–100 °F, 0 °F in 0–40 °F', () => {
    expect(run({ temperatureF: 60 })).toMatchObject({ ok: true, temperatureBand: '40–60 °F' });
    expect(run({ temperatureF: 40 })).toMatchObject({ ok: true, temperatureBand: '0–40 °F' });
    expect(run({ temperatureF: 100 })).toMatchObject({ ok: true, temperatureBand: '60–100 °F' });
    expect(run({ temperatureF: 0 })).toMatchObject({ ok: true, temperatureBand: '0–40 °F' });
  });

  it('exactly 160 psi takes the 160–370 / 160–315 column', () => {
    expect(run({ nominalSize: '1', pressurePsi: 160 })).toMatchObject({ ok: true, pressureBand: '160–370 psi', cureMinutes: 360 });
    expect(run({ nominalSize: '2', pressurePsi: 160 })).toMatchObject({ ok: true, pressureBand: '160–315 psi' });
    expect(run({ nominalSize: '2', pressurePsi: 159.9 })).toMatchObject({ ok: true, pressureBand: '≤160 psi' });
  });

  it("the top of the highest column is inside it: 370 psi on 1\", 315 psi on 2\", 100 psi on 12\"", () => {
    expect(run({ nominalSize: '1', pressurePsi: 370 }).ok).toBe(true);
    expect(run({ nominalSize: '2', pressurePsi: 315 }).ok).toBe(true);
    expect(run({ nominalSize: '12', pressurePsi: 100 }).ok).toBe(true);
  });

  it('15" is the edge of 10"–15" and 15"+: 14" is in 10"–15", 16" and 24" in 15"+', () => {
    expect(run({ nominalSize: '14', pressurePsi: 50 })).toMatchObject({ ok: true, sizeBand: '10"–15"' });
    expect(run({ nominalSize: '16', pressurePsi: 50 })).toMatchObject({ ok: true, sizeBand: '15"+' });
    expect(run({ nominalSize: '24', pressurePsi: 50 })).toMatchObject({ ok: true, sizeBand: '15"+' });
  });

  it('sizes between listed ones fall in the containing band: 3-1/2" and 5" in 2-1/2"–8"', () => {
    expect(run({ nominalSize: '3-1/2' })).toMatchObject({ ok: true, sizeBand: '2-1/2"–8"' });
    expect(run({ nominalSize: '5' })).toMatchObject({ ok: true, sizeBand: '2-1/2"–8"' });
  });
});

describe("humidity, a manufacturer's installation manual", () => {
  it('above 60% RH adds 50% to set and cure, rounded up to whole minutes; 60% itself does not', () => {
    expect(run({ nominalSize: '1', temperatureF: 75, pressurePsi: 100, relativeHumidity: 61 })).toMatchObject({
      ok: true, setMinutes: 3, cureMinutes: 23, humidityAdjusted: true,
    });
    expect(run({ nominalSize: '1', relativeHumidity: 60 })).toMatchObject({ ok: true, setMinutes: 2, cureMinutes: 15, humidityAdjusted: false });
  });
});

describe('refusals: no published value, a supervisor may enter an engineering cure time', () => {
  it.each([
    ['pressure above the table\'s columns (1" at 371 psi)', { nominalSize: '1', pressurePsi: 371 }, /371 psi is above the highest column/],
    ['pressure above the table\'s columns (2" at 316 psi)', { nominalSize: '2', pressurePsi: 316 }, /above the highest column \(315 psi\)/],
    ['pressure above 100 psi on 10"', { nominalSize: '10', pressurePsi: 101 }, /above the highest column \(100 psi\)/],
    ['temperature below the lowest band', { temperatureF: -1 }, /below the coldest band/],
    ['temperature above 100 °F', { temperatureF: 101 }, /above the warmest band/],
    ['a size outside the nominal list', { nominalSize: '7' }, /not a listed nominal pipe size/],
    ['ABS (no published schedule here)', { material: 'ABS' }, /PVC and CPVC only/],
  ] as const)('%s', (_what, over, reason) => {
    const r = run(over as Partial<CureScheduleInput>);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.reason).toMatch(reason);
  });

  it('refusals for the table say a supervisor may enter an engineering cure time with a reason', () => {
    for (const over of [{ pressurePsi: 400 }, { temperatureF: -10 }, { temperatureF: 120 }]) {
      const r = run(over);
      expect(!r.ok && r.reason).toMatch(/supervisor may enter an engineering cure time with a reason/);
    }
  });

  it('an unknown schedule, negative pressure or humidity outside 0–100 is refused', () => {
    expect(run({ schedule: 'Z' }).ok).toBe(false);
    expect(run({ pressurePsi: -1 }).ok).toBe(false);
    expect(run({ relativeHumidity: 101 }).ok).toBe(false);
  });
});

describe('listCureSchedules', () => {
  it('offers schedules A and B with their sources for the plant setting', () => {
    const list = listCureSchedules();
    expect(list.map((s) => s.id)).toEqual(['A', 'B']);
    expect(list[0]?.source).toContain("a manufacturer's installation manual [mfr]");
    expect(list[1]?.source).toContain('a plastics piping technical manual [pub]');
  });

  it('schedule ids are matched without regard to case; no id means schedule A', () => {
    expect(run({ schedule: 'b' })).toMatchObject({ ok: true, schedule: 'B' });
    expect(run({})).toMatchObject({ ok: true, schedule: 'A' });
  });
});
