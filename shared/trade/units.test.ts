import { describe, expect, it } from 'vitest';
import {
  ABSOLUTE_ZERO_F, barToPsi, BELOW_ABSOLUTE_ZERO, cToF, fToC, inToMm, isBelowAbsoluteZero, kpaToPsi, mmToIn, parseLength, parsePressure,
  parseTemperature, psiToBar, psiToKpa,
} from './units';

describe('unit conversions', () => {
  it('inch, psi and °F convert to mm, bar, kPa and °C and back', () => {
    expect(inToMm(1)).toBe(25.4);
    expect(mmToIn(50.8)).toBe(2);
    expect(psiToBar(145.0377)).toBeCloseTo(10, 4);
    expect(barToPsi(10)).toBeCloseTo(145.0377, 3);
    expect(psiToKpa(1)).toBeCloseTo(6.894757, 6);
    expect(kpaToPsi(psiToKpa(123))).toBeCloseTo(123, 9);
    expect(fToC(212)).toBe(100);
    expect(cToF(-40)).toBe(-40);
  });
});

describe('parsing a value with its unit', () => {
  it("parsePressure('10 bar'), '150 psi', '690 kPa', '1 MPa'", () => {
    expect(parsePressure('10 bar')).toMatchObject({ ok: true, value: 10, unit: 'bar' });
    const bar = parsePressure('10 bar');
    expect(bar.ok && bar.psi).toBeCloseTo(145.04, 2);
    expect(parsePressure('150 psi')).toMatchObject({ ok: true, psi: 150 });
    expect(parsePressure('150psig')).toMatchObject({ ok: true, psi: 150 });
    const kpa = parsePressure('690 kPa');
    expect(kpa.ok && kpa.psi).toBeCloseTo(100.08, 2);
    const mpa = parsePressure('1 MPa');
    expect(mpa.ok && mpa.psi).toBeCloseTo(145.04, 2);
  });

  it('a bare number is refused unless the caller names the unit it means', () => {
    expect(parsePressure('10').ok).toBe(false);
    expect(parsePressure('10', 'bar')).toMatchObject({ ok: true, unit: 'bar' });
    expect(parsePressure(150, 'psi')).toMatchObject({ ok: true, psi: 150 });
  });

  it('unknown units, junk and negative pressures are refused', () => {
    expect(parsePressure('10 atm').ok).toBe(false);
    expect(parsePressure('lots').ok).toBe(false);
    expect(parsePressure('-5 psi').ok).toBe(false);
  });

  it('parseLength: inches with fractions, mm, cm, ft', () => {
    expect(parseLength('1-1/4 in')).toMatchObject({ ok: true, inches: 1.25 });
    expect(parseLength('3/32"')).toMatchObject({ ok: true, inches: 3 / 32 });
    expect(parseLength('50.8 mm')).toMatchObject({ ok: true, inches: 2 });
    expect(parseLength('2 ft')).toMatchObject({ ok: true, inches: 24 });
    expect(parseLength('2 parsecs').ok).toBe(false);
  });

  it('parseTemperature: °F or °C, negative allowed, not below absolute zero', () => {
    expect(parseTemperature('70 °F')).toMatchObject({ ok: true, temperatureF: 70, unit: '°F' });
    expect(parseTemperature('-40C')).toMatchObject({ ok: true, temperatureF: -40, unit: '°C' });
    expect(parseTemperature('21 °C')).toMatchObject({ ok: true, unit: '°C' });
    expect(parseTemperature('-300 C').ok).toBe(false);
  });
});

describe('absolute zero, one rule for the importer and the calculator', () => {
  it('−459.67 °F and −273.15 °C are the coldest temperatures taken; a hair colder is refused, in °F or °C', () => {
    expect(isBelowAbsoluteZero(ABSOLUTE_ZERO_F)).toBe(false);
    expect(isBelowAbsoluteZero(-459.68)).toBe(true);
    expect(isBelowAbsoluteZero(cToF(-273.15))).toBe(false);
    expect(parseTemperature('-459.67 F')).toMatchObject({ ok: true });
    expect(parseTemperature('-273.15 C')).toMatchObject({ ok: true });
    expect(parseTemperature('-459.7 F')).toEqual({ ok: false, reason: BELOW_ABSOLUTE_ZERO });
    expect(parseTemperature('-273.2', 'C')).toEqual({ ok: false, reason: BELOW_ABSOLUTE_ZERO });
  });
});
