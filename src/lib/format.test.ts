import { describe, expect, it } from 'vitest';
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
});

describe('dates, in the browser time zone', () => {
  // Noon UTC is the same calendar day in every time zone from UTC−11 to UTC+11.
  it('a date alone, and a date with its time', () => {
    expect(formatDate('2026-04-05T12:00:00Z')).toBe('Apr 5, 2026');
    expect(formatDateTime('2026-04-05T12:00:00Z')).toMatch(/^Apr 5, 2026, \d{1,2}:00\s?[AP]M$/);
  });
});
