import { describe, expect, it } from 'vitest';
import { deratingFactor } from './derating';
import { MAX_SERVICE_TEMPERATURE_SOURCE, maxServiceTemperatureF, parsePipeMaterial, parseTabledMaterial, PIPE_MATERIALS } from './pipe-materials';
import { pipeRating } from './pipe-rating';

describe('the pipe materials and their maximum service temperature', () => {
  it('the one list is PVC, CPVC and ABS', () => {
    expect(PIPE_MATERIALS).toEqual(['PVC', 'CPVC', 'ABS']);
  });

  it("a manufacturer's installation manual (the de-rating reference): PVC 140 °F, CPVC 200 °F", () => {
    expect(maxServiceTemperatureF('PVC')).toBe(140);
    expect(maxServiceTemperatureF('CPVC')).toBe(200);
    expect(MAX_SERVICE_TEMPERATURE_SOURCE.PVC).toMatch(/manufacturer's installation manual \[mfr\]/);
  });

  it('from memory, the commonly quoted limit (not in the reference): ABS 180 °F', () => {
    expect(maxServiceTemperatureF('ABS')).toBe(180);
    expect(MAX_SERVICE_TEMPERATURE_SOURCE.ABS).toMatch(/\[memory\]/);
  });

  it('the limits agree with the de-rating tables: the last row of each is its maximum', () => {
    expect(deratingFactor('PVC', 140).ok).toBe(true);
    expect(deratingFactor('PVC', 140.1).ok).toBe(false);
    expect(deratingFactor('CPVC', 200).ok).toBe(true);
    expect(deratingFactor('CPVC', 200.1).ok).toBe(false);
  });

  it('reads a material as a planner writes it, and nothing else', () => {
    expect(parsePipeMaterial(' abs ')).toBe('ABS');
    expect(parsePipeMaterial('steel')).toBeNull();
    expect(parsePipeMaterial(42)).toBeNull();
    expect(parseTabledMaterial('ABS')).toBeNull();
    expect(parseTabledMaterial('cpvc')).toBe('CPVC');
  });

  it('ABS has no de-rating or pressure table here: it is refused with a reason, never guessed or thrown', () => {
    expect(deratingFactor('ABS', 73)).toEqual({ ok: false, reason: 'No de-rating table for "ABS" here: PVC and CPVC only.' });
    expect(pipeRating({ material: 'ABS', schedule: 40, nominalSize: '2', temperatureF: 73 })).toEqual({
      ok: false, reason: 'No pressure rating for "ABS": PVC and CPVC only.',
    });
  });
});
