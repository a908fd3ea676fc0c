import { describe, expect, it } from 'vitest';
import { jointPicture } from './joint-picture';
import { jointSpecSchema, type JointSpecInput } from './joint-spec';

const spec: JointSpecInput = {
  material: 'PVC', schedule: 80, nominalSize: '2', designPressurePsi: 100, designTemperatureF: 73,
  cureTemperatureF: 70, relativeHumidity: 40, testMedium: 'water', pressureService: true,
};
const picture = (over: Partial<JointSpecInput> = {}) => {
  const p = jointPicture({ ...spec, ...over });
  if (!('spec' in p)) throw new Error(p.reason);
  return p;
};

describe('the whole picture of one joint', () => {
  it('a plain 2" Sch 80 PVC joint: rating, test, marks, set and cure, cement, quantities, crew, cautions', () => {
    const p = picture();
    expect(p.ok).toBe(true);
    expect(p.rating).toMatchObject({ ok: true, psi: 400 });
    expect(p.test).toMatchObject({ ok: true, testPsi: 150, minHoldMinutes: 10, capPsi: 400 });
    expect(p.socket).toMatchObject({ ok: true, socketDepthIn: 1.5, checkMarkIn: 3.5 });
    expect(p.cure).toMatchObject({ ok: true, setMinutes: 5, cureMinutes: 30, pressureBand: '≤160 psi' });
    expect(p.cement).toMatchObject({ ok: true, requiredStandard: 'ASTM D2564', requiredBody: 'regular' });
    expect(p.quantities).toMatchObject({ ok: true, cementContainers: [{ container: 'pint', count: 1 }] });
    expect(p.crew).toMatchObject({ ok: true, crew: 1 });
    expect(p.hold).toMatchObject({ ok: true, seconds: 30 });
    expect(p.cautions.map((c) => c.id)).toEqual(expect.arrayContaining(['flammable', 'no-gas', 'chemical', 'release']));
  });

  it('common practice: the cure column is picked by the test pressure, not the design pressure', () => {
    const p = picture({ designPressurePsi: 120 });
    expect(p.curePressurePsi).toBe(180);
    expect(p.curePressureBasis).toBe('test');
    expect(p.cure).toMatchObject({ ok: true, pressureBand: '160–315 psi', cureMinutes: 12 * 60 });
    const untested = picture({ designPressurePsi: 120, pressureService: false });
    expect(untested.test).toBeNull();
    expect(untested.cure).toMatchObject({ ok: true, pressureBand: '≤160 psi' });
  });

  it('the test is capped by the pipe itself at the test temperature (default: the design temperature)', () => {
    const hot = picture({ designTemperatureF: 140, designPressurePsi: 60 });
    expect(hot.rating).toMatchObject({ ok: true, psi: 88 });
    expect(hot.test && hot.test.ok).toBe(false);
    expect(hot.ok).toBe(false);
    expect(picture({ designTemperatureF: 140, designPressurePsi: 60, testTemperatureF: 70 }).test).toMatchObject({ ok: true, testPsi: 90 });
  });

  it('an air test, a transition cement on pressure service or a design above the rating is a problem', () => {
    expect(picture({ testMedium: 'air' }).problems.join(' ')).toMatch(/shatter/);
    expect(picture({ cementStandard: 'ASTM D3138' }).problems.join(' ')).toMatch(/non-pressure/);
    expect(picture({ designPressurePsi: 450, testCap: 'one-and-a-half-rating', lowestComponentRatingPsi: 900 }).problems.join(' ')).toMatch(/above the pipe's 400 psi/);
  });

  it('a cold cure or a pressure beyond the table is a problem that names the supervisor route', () => {
    const cold = picture({ cureTemperatureF: -10 });
    expect(cold.ok).toBe(false);
    expect(cold.problems.join(' ')).toMatch(/supervisor may enter an engineering cure time/);
  });

  it('a non-pressure ABS drain joint needs no rating, but still has no published cure here', () => {
    const p = picture({ material: 'ABS', pressureService: false, cementStandard: 'ASTM D2235', designPressurePsi: 0 });
    expect(p.rating.ok).toBe(false);
    expect(p.problems.join(' ')).not.toMatch(/Rating/);
    expect(p.problems.join(' ')).toMatch(/Cure: .*PVC and CPVC only/);
  });

  it('a size with no socket depth is a note, not a problem', () => {
    const p = picture({ nominalSize: '3-1/2' });
    expect(p.ok).toBe(true);
    expect(p.notes.join(' ')).toMatch(/socket depth/);
  });

  it('an invalid specification is refused with its issues, never thrown', () => {
    const r = jointPicture({ ...spec, nominalSize: '7', schedule: 60 });
    expect(r.ok).toBe(false);
    expect('issues' in r && r.issues.length).toBe(2);
    expect(jointPicture(null).ok).toBe(false);
  });

  it('jointSpecSchema fills in defaults the API can rely on', () => {
    const { testMedium: _m, pressureService: _p, ...bare } = spec;
    expect(jointSpecSchema.parse(bare)).toMatchObject({ testMedium: 'water', pressureService: true, testCap: 'rating', chemicalService: true });
  });
});
