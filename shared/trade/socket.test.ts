import { describe, expect, it } from 'vitest';
import { chamferGuidance, dryFitCheck, socketMarks } from './socket';

// Copied from TRADE-REFERENCE §3: ASTM D2466 (Sch 40) / D2467 (Sch 80) minimum socket depth,
// from a manufacturer's installation manual cross-checked against ASTM D2468 [mfr]
const SIZES = ['1/2', '3/4', '1', '1-1/4', '1-1/2', '2', '2-1/2', '3', '4', '6', '8', '10', '12'];
const SCH40 = [0.688, 0.719, 0.875, 0.938, 1.094, 1.156, 1.75, 1.875, 2.0, 3.0, 4.0, 5.0, 6.0];
const SCH80 = [0.875, 1.0, 1.125, 1.25, 1.375, 1.5, 1.75, 1.875, 2.25, 3.0, 4.0, 5.0, 6.0];
const ROWS = SIZES.flatMap((size, i) => [
  { size, schedule: 40 as const, depth: SCH40[i] as number },
  { size, schedule: 80 as const, depth: SCH80[i] as number },
]);

describe('socket marks', () => {
  it.each(ROWS)('ASTM D2466/D2467 socket depth [mfr]: $size" Sch $schedule is $depth in; check mark 2 in beyond (common practice)', ({ size, schedule, depth }) => {
    expect(socketMarks({ nominalSize: size, schedule })).toMatchObject({
      ok: true, socketDepthIn: depth, insertionMarkIn: depth, checkMarkIn: depth + 2,
    });
  });

  it.each(['3-1/2', '5', '14', '16', '24'])('%s" is not in the socket-depth table and is refused', (size) => {
    const r = socketMarks({ nominalSize: size, schedule: 40 });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.reason).toMatch(/No published socket depth/);
  });

  it('an unknown size or schedule is refused', () => {
    expect(socketMarks({ nominalSize: '7', schedule: 40 }).ok).toBe(false);
    expect(socketMarks({ nominalSize: '2', schedule: 120 as never }).ok).toBe(false);
  });
});

describe('dry fit, ASTM F3328 wording: between 1/3 and 2/3 of socket depth', () => {
  // 2" Sch 80 socket 1.5 in: 0.5 in to 1.0 in
  const check = (dryInsertionIn: number) => dryFitCheck({ nominalSize: '2', schedule: 80, dryInsertionIn });

  it('within 1/3–2/3 (edges included) is ok', () => {
    for (const x of [0.5, 0.75, 1.0]) expect(check(x)).toMatchObject({ ok: true, fit: 'ok', minIn: 0.5, maxIn: 1.0 });
  });

  it('deeper than 2/3 is too loose; less than 1/3 is too tight', () => {
    expect(check(1.01)).toMatchObject({ ok: true, fit: 'too-loose' });
    expect(check(0.49)).toMatchObject({ ok: true, fit: 'too-tight' });
  });

  it("a manufacturer's installation manual: 1/2 to 2/3 for 1/2\"–4\" is shown, not enforced", () => {
    expect(check(0.6)).toMatchObject({ fit: 'ok', makerMinIn: 0.75 });
    expect(dryFitCheck({ nominalSize: '6', schedule: 40, dryInsertionIn: 1.5 })).toMatchObject({ fit: 'ok', makerMinIn: undefined });
  });

  it('a negative or missing insertion is refused', () => {
    expect(check(-1).ok).toBe(false);
    expect(check(Number.NaN).ok).toBe(false);
  });
});

describe('chamfer', () => {
  it("a manufacturer's installation manual: 10°–15°; from memory: 1/16\"–3/32\" long on small sizes", () => {
    expect(chamferGuidance('1')).toMatchObject({ ok: true, angleMinDeg: 10, angleMaxDeg: 15, lengthMinIn: 1 / 16, lengthMaxIn: 3 / 32 });
  });

  it('from memory: more on large sizes, with no invented upper number', () => {
    expect(chamferGuidance('8')).toMatchObject({ ok: true, lengthMinIn: 3 / 32, lengthMaxIn: null });
  });

  it('an unknown size is refused', () => {
    expect(chamferGuidance('9').ok).toBe(false);
  });
});
