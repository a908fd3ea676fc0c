import { describe, expect, it } from 'vitest';
import { assemblyHoldFor, dryFitVerdict, dryFitWindow, lengthText, toFahrenheit } from './units';
import { fitWithin } from './photo';

describe('the dry-fit window in the unit the fitter measures in', () => {
  it('is the engine’s inches as they are, or millimetres to a tenth', () => {
    expect(dryFitWindow(0.5, 1, 'in')).toEqual({ min: 0.5, max: 1, text: '0.5–1 in' });
    const mm = dryFitWindow(0.5, 1, 'mm')!;
    expect(mm.text).toBe('12.7–25.4 mm');
    expect(mm.min).toBeCloseTo(12.7);
  });

  it('is absent where the engine has no window', () => {
    expect(dryFitWindow(null, 1, 'in')).toBeNull();
  });

  it('warns of a dry insertion short of or beyond the window, in either unit', () => {
    expect(dryFitVerdict(0.4, 'in', 0.5, 1)).toBe('short');
    expect(dryFitVerdict(0.75, 'in', 0.5, 1)).toBe('ok');
    expect(dryFitVerdict(1.1, 'in', 0.5, 1)).toBe('deep');
    expect(dryFitVerdict(19, 'mm', 0.5, 1)).toBe('ok');
    expect(dryFitVerdict(26, 'mm', 0.5, 1)).toBe('deep');
  });

  it('does not warn at the edge for a rounding hair of a value typed in mm', () => {
    expect(dryFitVerdict(12.7, 'mm', 0.5, 1)).toBe('ok');
    expect(dryFitVerdict(25.4, 'mm', 0.5, 1)).toBe('ok');
  });

  it('says nothing until a number is typed', () => {
    expect(dryFitVerdict(Number.NaN, 'in', 0.5, 1)).toBeNull();
  });

  it('writes lengths to 0.001 in or 0.1 mm', () => {
    expect(lengthText(1.0625, 'in')).toBe('1.063 in');
    expect(lengthText(1.0625, 'mm')).toBe('27 mm');
    expect(lengthText(1.5, 'mm')).toBe('38.1 mm');
  });
});

describe('the hold after assembly', () => {
  it('is the engine’s, or longer when the temperature recorded with the cement is colder', () => {
    expect(assemblyHoldFor(30, null)).toBe(30);
    expect(assemblyHoldFor(30, 75)).toBe(30);
    expect(assemblyHoldFor(30, 50)).toBe(60);
    expect(assemblyHoldFor(60, 35)).toBe(120);
    expect(assemblyHoldFor(120, 75)).toBe(120);
  });

  it('takes a temperature in °C as °F', () => {
    expect(toFahrenheit(10, 'C')).toBe(50);
    expect(toFahrenheit(50, 'F')).toBe(50);
  });
});

describe('a photo is scaled to 2048 px on its long side', () => {
  it('keeps the aspect and never enlarges', () => {
    expect(fitWithin(4032, 3024)).toEqual({ width: 2048, height: 1536 });
    expect(fitWithin(3024, 4032)).toEqual({ width: 1536, height: 2048 });
    expect(fitWithin(800, 600)).toEqual({ width: 800, height: 600 });
  });
});
