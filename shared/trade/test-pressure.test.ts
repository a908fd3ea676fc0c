import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { testPressure } from './test-pressure';

describe('hydrostatic test pressure', () => {
  it('from memory, ASME B31.3 A345.4.2: 1.5 × design, rounded up; from memory, 345.2.2(a): hold 10 min', () => {
    expect(testPressure({ designPressurePsi: 100, lowestComponentRatingPsi: 280, medium: 'water' })).toMatchObject({
      ok: true, testPsi: 150, minHoldMinutes: 10, capPsi: 280, cap: 'rating',
    });
    expect(testPressure({ designPressurePsi: 101, lowestComponentRatingPsi: 280, medium: 'water' })).toMatchObject({ ok: true, testPsi: 152 });
    expect(testPressure({ designPressurePsi: 100.1, lowestComponentRatingPsi: 280, medium: 'Water ' })).toMatchObject({ ok: true, testPsi: 151 });
  });

  it('the default cap is the lowest component rating (the stricter); above it the test is refused', () => {
    const r = testPressure({ designPressurePsi: 200, lowestComponentRatingPsi: 280, medium: 'water' });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.reason).toMatch(/300 psi .* above the lowest component rating, 280 psi/);
  });

  it('from memory, ASME B31.3 A345.4.2: a plant may cap at 1.5 × the lowest rating instead', () => {
    expect(testPressure({ designPressurePsi: 200, lowestComponentRatingPsi: 280, medium: 'water', cap: 'one-and-a-half-rating' })).toMatchObject({
      ok: true, testPsi: 300, capPsi: 420, cap: 'one-and-a-half-rating',
    });
  });

  it.each(['air', 'nitrogen', 'compressed air', 'N2', 'helium', 'gas', 'CO2'])(
    'a plastic pipe trade association user bulletin; ASTM D1785 §1.2: testing with %s is refused',
    (medium) => {
      const r = testPressure({ designPressurePsi: 50, lowestComponentRatingPsi: 280, medium });
      expect(r.ok).toBe(false);
      expect(!r.ok && r.reason).toMatch(/stores energy and can shatter thermoplastic pipe/);
      expect(!r.ok && r.reason).toContain('ASTM D1785 §1.2');
    },
  );

  it('any medium but water is refused', () => {
    expect(testPressure({ designPressurePsi: 50, lowestComponentRatingPsi: 280, medium: 'glycol' }).ok).toBe(false);
  });

  it('non-positive or missing pressures are refused, never thrown', () => {
    expect(testPressure({ designPressurePsi: 0, lowestComponentRatingPsi: 280, medium: 'water' }).ok).toBe(false);
    expect(testPressure({ designPressurePsi: 50, lowestComponentRatingPsi: Number.NaN, medium: 'water' }).ok).toBe(false);
    expect(testPressure({ designPressurePsi: 50, lowestComponentRatingPsi: 100, medium: 'water', cap: 'x' as never }).ok).toBe(false);
  });

  it('property: an accepted test is at least 1.5 × design and never above its cap', () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 500, noNaN: true }), fc.double({ min: 1, max: 900, noNaN: true }), fc.constantFrom('rating' as const, 'one-and-a-half-rating' as const), (d, rating, cap) => {
      const r = testPressure({ designPressurePsi: d, lowestComponentRatingPsi: rating, medium: 'water', cap });
      if (!r.ok) return;
      expect(r.testPsi).toBeGreaterThanOrEqual(d * 1.5);
      expect(r.testPsi).toBeLessThanOrEqual(r.capPsi);
      expect(r.capPsi).toBeLessThanOrEqual(cap === 'rating' ? rating : rating * 1.5);
    }));
  });
});
