import { describe, expect, it } from 'vitest';
import * as trade from './index';

describe('the public face of the trade rules', () => {
  it.each([
    'pipeRating', 'isoRating', 'sdrRating', 'cureSchedule', 'listCureSchedules', 'cureCompleteAt', 'testPressure',
    'socketMarks', 'dryFitCheck', 'chamferGuidance', 'cementCheck', 'cementBody', 'cementQuantities', 'applicatorSize',
    'crewAndTools', 'assemblyHoldSeconds', 'cementShelfLife', 'inToMm', 'mmToIn', 'psiToBar', 'barToPsi', 'psiToKpa',
    'kpaToPsi', 'fToC', 'cToF', 'parsePressure', 'parseLength', 'parseTemperature', 'cautionsFor', 'parseNominalSize',
    'jointPicture', 'maxServiceTemperatureF', 'parsePipeMaterial', 'unknownSizeReason',
  ])('exports %s', (name) => {
    expect(typeof (trade as Record<string, unknown>)[name]).toBe('function');
  });

  it('exports NOMINAL_SIZES, the material and test-cap lists, and jointSpecSchema', () => {
    expect(trade.NOMINAL_SIZES).toHaveLength(20);
    expect(trade.PIPE_MATERIALS).toEqual(['PVC', 'CPVC', 'ABS']);
    expect(trade.TEST_CAPS).toEqual(['rating', 'one-and-a-half-rating']);
    expect(typeof trade.jointSpecSchema.safeParse).toBe('function');
  });

  it('names no maker or brand: every source string is generic', () => {
    for (const s of Object.values(trade.SOURCES)) expect(s).toMatch(/ASTM|ASME|OSHA|ISO|manual|practice|association|memory|pub|mfr/);
  });
});
