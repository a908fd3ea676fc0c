import { describe, expect, it } from 'vitest';
import { CAUTION_STEPS, cautionsFor, DEFERENCE } from './cautions';

describe('cautions', () => {
  it.each(CAUTION_STEPS)('every %s caution ends in deference to local codes, plant procedures and licensed engineering judgement', (step) => {
    const list = cautionsFor(step);
    expect(list.length).toBeGreaterThan(0);
    for (const c of list) {
      expect(c.text.endsWith(DEFERENCE)).toBe(true);
      expect(c.id).toBeTruthy();
      expect(c.title).toBeTruthy();
    }
  });

  it('ASTM F402: priming and cementing warn of flammable solvents, ventilation and ignition, eyes and gloves', () => {
    for (const step of ['prime', 'cement'] as const) {
      const text = cautionsFor(step).map((c) => c.text).join(' ');
      expect(text).toMatch(/flammable/);
      expect(text).toMatch(/ASTM F402/);
      expect(text).toMatch(/Ventilate/);
      expect(text).toMatch(/ignition|flame|sparks/);
      expect(text).toMatch(/eye protection and impervious gloves/);
    }
  });

  it('the pressure test warns of stored pressure and refuses gas; chemical service has its own caution', () => {
    const ids = cautionsFor('pressure-test').map((c) => c.id);
    expect(ids).toEqual(expect.arrayContaining(['no-gas', 'stored-pressure']));
    expect(cautionsFor('chemical-service').map((c) => c.id)).toContain('chemical');
  });

  it('joint aggregates prep, prime, cement and cure without repeats', () => {
    const ids = cautionsFor('joint').map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids).toEqual(expect.arrayContaining(['residual', 'flammable', 'cure-first', 'cement-condition']));
  });

  it('an unknown step shows every caution rather than none', () => {
    expect(cautionsFor('toString').length).toBeGreaterThan(5);
  });
});
