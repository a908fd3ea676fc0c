import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  containers, degC, degF, duration, formatDate, formatDateTime, formatPressure, formatPressureBar, formatSize, formatTemperature,
  formatTemperatureC, formatWall, inches, metricPressure, mm, pressureIn, psi, temperatureIn, volume,
} from './format';

describe('the calculator writes values to a tenth, dropping trailing zeros', () => {
  it('pressure in psi, and metric in the unit the person works in (bar unless they chose kPa)', () => {
    expect(psi(150)).toBe('150 psi');
    expect(psi(112.46)).toBe('112.5 psi');
    expect(metricPressure(100, 'psi')).toBe('6.89 bar');
    expect(metricPressure(200, 'bar')).toBe('13.8 bar');
    expect(metricPressure(100, 'kPa')).toBe('689 kPa');
  });

  it('temperature in °F with °C beside, lengths in inches with mm beside', () => {
    expect(degF(73)).toBe('73 °F');
    expect(degC(73)).toBe('22.8 °C');
    expect(degC(32)).toBe('0 °C');
    expect(inches(1.5)).toBe('1.5 in');
    expect(inches(0.0625)).toBe('0.063 in');
    expect(mm(1)).toBe('25.4 mm');
  });

  it('a value rewritten for another unit keeps enough decimals to come back to the same 0.1 psi or °F', () => {
    expect(pressureIn(100, 'psi')).toBe('100');
    expect(pressureIn(100, 'bar')).toBe('6.895');
    expect(pressureIn(100, 'kPa')).toBe('689.5');
    expect(temperatureIn(70, 'F')).toBe('70');
    expect(temperatureIn(70, 'C')).toBe('21.11');
    expect(pressureIn(1234.5, 'psi')).toBe('1234.5'); // no thousands separator: it goes back into a field
  });

  it('durations in minutes, hours, then days with the hours beside', () => {
    expect(duration(30)).toBe('30 min');
    expect(duration(60)).toBe('1 h');
    expect(duration(90)).toBe('1 h 30 min');
    expect(duration(47 * 60)).toBe('47 h');
    expect(duration(2880)).toBe('2 days (48 h)');
    expect(duration(3 * 1440 + 5 * 60 + 15)).toBe('3 days 5 h 15 min (77 h)');
  });

  it('cement: containers counted, volume in quarts and millilitres', () => {
    expect(containers([])).toBe('none');
    expect(containers([{ container: 'quart', count: 1 }, { container: 'pint', count: 2 }])).toBe('1 quart + 2 pints');
    expect(volume(0.5)).toBe('0.5 qt · 473 mL');
    expect(volume(0.0625)).toBe('0.063 qt · 59 mL');
  });
});

describe('the register writes whole psi and °F, thousands separated, metric to a tenth', () => {
  it('sizes, pressures and temperatures', () => {
    expect(formatSize('1-1/2')).toBe('1-1/2"');
    expect(formatPressure(150)).toBe('150 psi');
    expect(formatPressure(1500.4)).toBe('1,500 psi');
    expect(formatPressureBar(150)).toBe('10.3 bar');
    expect(formatTemperature(73)).toBe('73 °F');
    expect(formatTemperatureC(100)).toBe('37.8 °C');
  });

  it('the wall: schedule, SDR, both, or a dash', () => {
    expect(formatWall({ schedule: '80', sdr: null })).toBe('Sch 80');
    expect(formatWall({ schedule: 'Schedule 40', sdr: null })).toBe('Sch 40');
    expect(formatWall({ schedule: null, sdr: 13.5 })).toBe('SDR 13.5');
    expect(formatWall({ schedule: '80', sdr: 21 })).toBe('Sch 80 · SDR 21');
    expect(formatWall({ schedule: null, sdr: null })).toBe('—');
  });

  // The register's numbers are written without Intl (its start-up cost on the first screen): they must read as Intl writes them.
  it('writes every number as Intl en-US does, to a whole unit or a tenth', () => {
    const intl = [0, 1].map((digits) => new Intl.NumberFormat('en-US', { maximumFractionDigits: digits }));
    const check = (x: number) => {
      expect(formatPressure(x)).toBe(`${intl[0]!.format(x)} psi`);
      expect(formatTemperatureC(x)).toBe(`${intl[1]!.format(((x - 32) * 5) / 9)} °C`);
      expect(formatWall({ schedule: null, sdr: x })).toBe(x ? `SDR ${intl[1]!.format(x)}` : '—');
    };
    for (const x of [0, -0, 0.05, 0.15, 0.25, -0.04, -0.05, -0.5, 0.5, 1.5, 2.5, 999.5, 999.95, 1234.45, 1e6, 123456789.05, -1234567.5, 1e-7, 1e21, NaN, Infinity, -Infinity]) check(x);
    fc.assert(fc.property(fc.double({ min: -1e9, max: 1e9 }), check), { numRuns: 3000 });
    fc.assert(fc.property(fc.integer({ min: -200000, max: 200000 }), (n) => check(n / 20)), { numRuns: 2000 });
  });
});

describe('dates, in the browser time zone', () => {
  // Noon UTC is the same calendar day in every time zone from UTC−11 to UTC+11.
  it('a date alone, and a date with its time', () => {
    expect(formatDate('2026-04-05T12:00:00Z')).toBe('Apr 5, 2026');
    expect(formatDateTime('2026-04-05T12:00:00Z')).toMatch(/^Apr 5, 2026, \d{1,2}:00\s?[AP]M$/);
  });

  it('writes every date as Intl en-US does (the register writes them without Intl)', () => {
    const intl = new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric' });
    const check = (d: Date) => {
      expect(formatDate(d.toISOString())).toBe(intl.format(d));
    };
    for (const iso of ['2026-01-01T00:00:00Z', '2025-12-31T23:59:59Z', '2024-02-29T12:00:00Z', '2026-09-15T12:00:00Z', '1000-01-01T12:00:00Z']) check(new Date(iso));
    fc.assert(fc.property(fc.date({ min: new Date('0001-01-01T00:00:00Z'), max: new Date('9999-12-30T00:00:00Z'), noInvalidDate: true }), check), { numRuns: 3000 });
    expect(() => formatDate('not a date')).toThrow(RangeError);
  });
});
