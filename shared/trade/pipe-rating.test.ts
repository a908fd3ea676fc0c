import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DERATING_TABLE, deratingFactor } from './derating';
import { NOMINAL_SIZES } from './nominal-size';
import { IPS_PIPE_TABLE, pipeRow } from './pipe-dimensions';
import { isoRating, pipeRating, sdrRating } from './pipe-rating';

// Copied from TRADE-REFERENCE §1, ASTM D1785 table [pub]: NPS | OD | Sch 40 wall | Sch 40 WP | Sch 80 wall | Sch 80 WP
const D1785 = `
| 1/2 | 0.840 | 0.109 | 600 | 0.147 | 850 |
| 3/4 | 1.050 | 0.113 | 480 | 0.154 | 690 |
| 1 | 1.315 | 0.133 | 450 | 0.179 | 630 |
| 1-1/4 | 1.660 | 0.140 | 370 | 0.191 | 520 |
| 1-1/2 | 1.900 | 0.145 | 330 | 0.200 | 470 |
| 2 | 2.375 | 0.154 | 280 | 0.218 | 400 |
| 2-1/2 | 2.875 | 0.203 | 300 | 0.276 | 420 |
| 3 | 3.500 | 0.216 | 260 | 0.300 | 370 |
| 3-1/2 | 4.000 | 0.226 | 240 | 0.318 | 350 |
| 4 | 4.500 | 0.237 | 220 | 0.337 | 320 |
| 5 | 5.563 | 0.258 | 190 | 0.375 | 290 |
| 6 | 6.625 | 0.280 | 180 | 0.432 | 280 |
| 8 | 8.625 | 0.322 | 160 | 0.500 | 250 |
| 10 | 10.750 | 0.365 | 140 | 0.593 | 230 |
| 12 | 12.750 | 0.406 | 130 | 0.687 | 230 |
| 14 | 14.000 | 0.437 | 130 | 0.750 | 220 |
| 16 | 16.000 | 0.500 | 130 | 0.843 | 220 |
| 18 | 18.000 | 0.562 | 130 | 0.937 | 220 |
| 20 | 20.000 | 0.593 | 120 | 1.031 | 220 |
| 24 | 24.000 | 0.687 | 120 | 1.218 | 210 |`
  .trim()
  .split('\n')
  .map((line) => line.split('|').map((c) => c.trim()).filter(Boolean))
  .map(([size, od, w40, p40, w80, p80]) => ({ size: size as string, od: Number(od), w40: Number(w40), p40: Number(p40), w80: Number(w80), p80: Number(p80) }));

describe('ASTM D1785 / F441 table', () => {
  it('ASTM D1785 table: the engine holds exactly the twenty IPS rows of the reference', () => {
    expect(IPS_PIPE_TABLE.map((r) => r.size)).toEqual(D1785.map((r) => r.size));
    expect([...NOMINAL_SIZES]).toEqual(D1785.map((r) => r.size));
  });

  it.each(D1785)('ASTM D1785, Sch 40/80 table: $size" OD $od, walls $w40 / $w80, rated $p40 / $p80 psi at 73 °F', (ref) => {
    const row = pipeRow(ref.size);
    expect(row).toEqual({ size: ref.size, odIn: ref.od, sch40WallIn: ref.w40, sch40Psi: ref.p40, sch80WallIn: ref.w80, sch80Psi: ref.p80 });
    for (const material of ['PVC', 'CPVC'] as const) {
      const r40 = pipeRating({ material, schedule: 40, nominalSize: ref.size, temperatureF: 73 });
      const r80 = pipeRating({ material, schedule: 80, nominalSize: ref.size, temperatureF: 73 });
      expect(r40).toMatchObject({ ok: true, psi: ref.p40, ratedPsiAt73: ref.p40, factor: 1 });
      expect(r80).toMatchObject({ ok: true, psi: ref.p80, ratedPsiAt73: ref.p80, factor: 1 });
    }
  });

  it('ASTM D1785, Sch 80 table: 3" rates 370 psi at 73 °F, not the equation\'s 375', () => {
    expect(isoRating({ odIn: 3.5, wallIn: 0.3 }).ok && isoRating({ odIn: 3.5, wallIn: 0.3 })).toMatchObject({ psi: 375 });
    const r = pipeRating({ material: 'PVC', schedule: 80, nominalSize: '3', temperatureF: 73 });
    expect(r).toMatchObject({ ok: true, psi: 370 });
    expect(r.ok && r.fromEquation).toBeFalsy();
  });

  it('ASTM D1785, Sch 80 table: 20" rates 220 psi, not the equation\'s 217', () => {
    expect(isoRating({ odIn: 20, wallIn: 1.031 })).toMatchObject({ ok: true, psi: 217 });
    expect(pipeRating({ material: 'PVC', schedule: 80, nominalSize: '20', temperatureF: 73 })).toMatchObject({ ok: true, psi: 220 });
  });

  it('ASTM F441: CPVC takes the same 73 °F ratings and names its standard', () => {
    const r = pipeRating({ material: 'CPVC', schedule: 40, nominalSize: '2', temperatureF: 73 });
    expect(r).toMatchObject({ ok: true, psi: 280 });
    expect(r.ok && r.source).toContain('ASTM F441');
  });
});

describe('ISO equation, used only where the table has no value', () => {
  it('ISO equation P = 2·S/(SDR − 1), S = 2000 psi: SDR 21 → 200, SDR 26 → 160, SDR 13.5 → 320', () => {
    expect(sdrRating(21)).toMatchObject({ ok: true, psi: 200, fromEquation: true });
    expect(sdrRating(26)).toMatchObject({ ok: true, psi: 160 });
    expect(sdrRating(13.5)).toMatchObject({ ok: true, psi: 320 });
  });

  it('an SDR pipe is rated by the equation and the result says so', () => {
    const r = pipeRating({ material: 'PVC', sdr: 21, nominalSize: '4', temperatureF: 100 });
    expect(r).toMatchObject({ ok: true, ratedPsiAt73: 200, factor: 0.62, psi: 124, fromEquation: true });
    expect(r.ok && r.source).toContain('ISO equation');
  });

  it('an impossible wall or SDR is refused, not computed', () => {
    expect(isoRating({ odIn: 1, wallIn: 0.6 }).ok).toBe(false);
    expect(isoRating({ odIn: Number.NaN, wallIn: 0.1 }).ok).toBe(false);
    expect(sdrRating(1).ok).toBe(false);
  });
});

// Copied from TRADE-REFERENCE §2, de-rating factors, a manufacturer's installation manual [mfr]
const PVC_FACTORS: [number, number, number?][] = [
  [73, 1.0], [80, 0.88], [90, 0.75], [100, 0.62], [110, 0.51, 0.5], [120, 0.4], [130, 0.31, 0.3], [140, 0.22],
];
const CPVC_FACTORS: [number, number, number?][] = [
  [73, 1.0], [80, 1.0], [90, 0.91], [100, 0.82], [110, 0.72, 0.77], [120, 0.65], [130, 0.57, 0.62],
  [140, 0.5], [150, 0.42, 0.47], [160, 0.4], [170, 0.29, 0.32], [180, 0.25], [200, 0.2],
];

describe("temperature de-rating, a manufacturer's installation manual", () => {
  it.each([
    ['PVC', PVC_FACTORS],
    ['CPVC', CPVC_FACTORS],
  ] as const)("a manufacturer's installation manual: every %s de-rating row, and the second maker's bracketed values", (material, rows) => {
    expect(DERATING_TABLE[material].map((r) => [r.temperatureF, r.factor, r.secondMaker])).toEqual(
      rows.map(([t, f, s]) => [t, f, s]),
    );
    for (const [t, f, s] of rows) {
      expect(deratingFactor(material, t)).toMatchObject({ ok: true, factor: f });
      expect(deratingFactor(material, t, 'second')).toMatchObject({ ok: true, factor: s ?? f });
    }
  });

  it("a manufacturer's worked example: 6\" Sch 80 PVC at 140 °F → 280 × 0.22 = 62 psi (rounded to nearest, as printed)", () => {
    expect(pipeRating({ material: 'PVC', schedule: 80, nominalSize: '6', temperatureF: 140 })).toMatchObject({
      ok: true, psi: 62, ratedPsiAt73: 280, factor: 0.22, psiUnrounded: 61.6,
    });
  });

  it('an exact half psi rounds down, the conservative side of a tie: 8" Sch 80 CPVC at 120 °F → 250 × 0.65 = 162.5 → 162', () => {
    expect(pipeRating({ material: 'CPVC', schedule: 80, nominalSize: '8', temperatureF: 120 })).toMatchObject({ ok: true, psi: 162, psiUnrounded: 162.5 });
  });

  it('common practice: between rows the next higher listed temperature counts (PVC 75 °F → 80 °F row, 0.88)', () => {
    expect(pipeRating({ material: 'PVC', schedule: 40, nominalSize: '2', temperatureF: 75 })).toMatchObject({ ok: true, factor: 0.88, factorRowF: 80 });
    expect(deratingFactor('CPVC', 190)).toMatchObject({ ok: true, factor: 0.2, rowTemperatureF: 200 });
  });

  it('below 73 °F the factor is 1.00', () => {
    expect(pipeRating({ material: 'PVC', schedule: 40, nominalSize: '1', temperatureF: 35 })).toMatchObject({ ok: true, factor: 1, psi: 450 });
  });

  it('above the maximum service temperature (PVC 140 °F, CPVC 200 °F) there is no rating', () => {
    const pvc = pipeRating({ material: 'PVC', schedule: 40, nominalSize: '2', temperatureF: 141 });
    expect(pvc.ok).toBe(false);
    expect(!pvc.ok && pvc.reason).toMatch(/140 °F/);
    expect(pipeRating({ material: 'CPVC', schedule: 40, nominalSize: '2', temperatureF: 200 }).ok).toBe(true);
    expect(pipeRating({ material: 'CPVC', schedule: 40, nominalSize: '2', temperatureF: 201 }).ok).toBe(false);
  });

  it('ABS, an unknown size or a schedule other than 40/80 is refused with a reason, never thrown', () => {
    for (const bad of [
      { material: 'ABS', schedule: 40, nominalSize: '2', temperatureF: 73 },
      { material: 'PVC', schedule: 40, nominalSize: '7', temperatureF: 73 },
      { material: 'PVC', schedule: 120, nominalSize: '2', temperatureF: 73 },
      { material: 'PVC', schedule: 40, nominalSize: '2', temperatureF: Number.NaN },
    ]) {
      const r = pipeRating(bad as never);
      expect(r.ok).toBe(false);
      expect(!r.ok && r.reason.length).toBeGreaterThan(0);
    }
  });

  it('property: de-rating never rises with temperature', () => {
    fc.assert(
      fc.property(fc.constantFrom('PVC' as const, 'CPVC' as const), fc.double({ min: -40, max: 210, noNaN: true }), fc.double({ min: 0, max: 50, noNaN: true }), (m, t, dt) => {
        const a = deratingFactor(m, t);
        const b = deratingFactor(m, t + dt);
        if (a.ok && b.ok) expect(b.factor).toBeLessThanOrEqual(a.factor);
        if (!a.ok) expect(b.ok).toBe(false);
      }),
    );
  });

  it('property: a rating is never above the 73 °F table value nor below the table\'s lowest factor, else ok:false', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('PVC' as const, 'CPVC' as const), fc.constantFrom(40 as const, 80 as const),
        fc.constantFrom(...NOMINAL_SIZES), fc.double({ min: -100, max: 300, noNaN: true }),
        (material, schedule, nominalSize, temperatureF) => {
          const r = pipeRating({ material, schedule, nominalSize, temperatureF });
          if (!r.ok) return;
          expect(r.psi).toBeLessThanOrEqual(850);
          expect(r.psi).toBeLessThanOrEqual(r.ratedPsiAt73);
          expect(r.psi).toBeGreaterThanOrEqual(Math.floor(120 * 0.2));
        },
      ),
    );
  });
});
