import { describe, expect, it } from 'vitest';
import { CAUTION_STEPS, cautionsFor, DEFERENCE, needsChemicalCaution } from './cautions';

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

describe('which services get the chemical caution', () => {
  it.each(['Sulphuric acid 93%', 'Hydrochloric acid 32%', 'Caustic soda 25%', 'Brine', 'Sodium hypochlorite 12.5%', 'Ferric chloride'])(
    'common practice: "%s" gets the chemical caution',
    (service) => {
      expect(needsChemicalCaution(service)).toBe(true);
    },
  );

  it.each(['Potable water', 'RO permeate', 'Process water', 'Chilled water', 'Hot DI water', 'Demineralized water', 'Service air', 'Drain', 'Vents', 'Condensate', 'water', '  Cooling water  '])(
    'common practice: plain water, air, drain, vent, permeate or condensate ("%s") does not',
    (service) => {
      expect(needsChemicalCaution(service)).toBe(false);
    },
  );

  it('common practice: a chemical with water in its name still gets the caution', () => {
    expect(needsChemicalCaution('Water with 10% caustic')).toBe(true);
    expect(needsChemicalCaution('Ammonia water')).toBe(true);
  });

  it('common practice: the net is wide, so a service the list does not name (instrument air, seawater) gets the caution too', () => {
    expect(needsChemicalCaution('Instrument air')).toBe(true);
    expect(needsChemicalCaution('Seawater')).toBe(true);
    expect(needsChemicalCaution('')).toBe(true);
  });
});
