import { afterEach, describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { PlantSetting } from '@server/db/models/plant-setting';
import { jointPicture, parseTemperature, type JointSpecInput } from '@shared/trade';
import { DEFAULT_VALUES, type CalculatorValues } from '@/features/calculator/form';
import { differingSections, previewJoint } from '@/features/calculator/preview';
import { useTestApp } from '../helpers/app';
import { signedIn } from '../helpers/browserless';

const plain: JointSpecInput = {
  material: 'PVC', schedule: 80, nominalSize: '2', designPressurePsi: 100, designTemperatureF: 73,
  cureTemperatureF: 70, relativeHumidity: 40, testMedium: 'water', pressureService: true,
};
/** What the importer says of the same temperature (shared/trade/units.ts): the one rule both follow. */
const BELOW_ABSOLUTE_ZERO = (() => {
  const r = parseTemperature(-500, 'F');
  return r.ok ? 'accepted' : r.reason;
})();
const PLANT_A = { cureScheduleId: 'A', testCap: 'rating' } as const;
/** What crosses the wire: the engine's picture as JSON. */
const expected = (spec: JointSpecInput, plant: { cureScheduleId: string; testCap: 'rating' | 'one-and-a-half-rating' } = PLANT_A) =>
  JSON.parse(JSON.stringify(jointPicture({ ...spec, ...plant })));

const plantDefaults = () => PlantSetting.update({ cureScheduleId: 'A', testCap: 'rating', updatedById: null }, { where: { id: 1 } });

const users = useTestApp({ signIn: ['fitter'], before: plantDefaults });
// each test that changes the plant's settings puts the defaults back
afterEach(plantDefaults);

describe('POST /api/calc/joint answers with the same picture as jointPicture', () => {
  const cases: [string, JointSpecInput, (body: any) => void][] = [
    ['a plain 2" Sch 80 joint', plain, (b) => expect(b).toMatchObject({ ok: true, cure: { setMinutes: 5, cureMinutes: 30, schedule: 'A' }, test: { testPsi: 150 } })],
    ['a cold 10" joint takes days', { ...plain, schedule: 40, nominalSize: '10', designPressurePsi: 50, cureTemperatureF: 35 },
      (b) => expect(b).toMatchObject({ ok: true, cure: { temperatureBand: '0–40 °F', sizeBand: '10"–15"', cureMinutes: 8 * 24 * 60 }, crew: { mechanicalJoiningDevice: true } })],
    ['humid air adds half again', { ...plain, relativeHumidity: 80 }, (b) => expect(b.cure).toMatchObject({ humidityAdjusted: true, setMinutes: 8, cureMinutes: 45 })],
    ['a test pressure above the table has no published cure', { ...plain, designPressurePsi: 250 }, (b) => {
      expect(b.ok).toBe(false);
      expect(b.cure).toMatchObject({ ok: false });
      expect(b.problems.join(' ')).toMatch(/Cure: Pressure 375 psi is above the highest column \(315 psi\).*supervisor may enter/);
    }],
    ['an air test is refused', { ...plain, testMedium: 'air' }, (b) => {
      expect(b.ok).toBe(false);
      expect(b.test).toMatchObject({ ok: false });
      expect(b.test.reason).toMatch(/air is refused.*shatter/);
    }],
    ['transition cement on pressure service is refused', { ...plain, cementStandard: 'ASTM D3138' }, (b) => {
      expect(b.ok).toBe(false);
      expect(b.cement.problems.join(' ')).toMatch(/non-pressure service only/);
    }],
  ];
  it.each(cases)('%s', async (_name, spec, check) => {
    const res = await users.fitter.post('/api/calc/joint', spec);
    expect(res.status).toBe(200);
    expect(res.body).toEqual(expected(spec));
    check(res.body);
  });

  it('every signed-in role may ask', async () => {
    for (const role of ['planner', 'operations', 'supervisor', 'admin']) {
      expect((await (await signedIn(role)).post('/api/calc/joint', plain)).status).toBe(200);
    }
  });

  it('a body of the wrong types is a 400 in the one error shape, with details per field', async () => {
    const res = await users.fitter.post('/api/calc/joint', { ...plain, designPressurePsi: '100', schedule: 60, nominalSize: '7' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'bad_request', message: expect.any(String) });
    expect(Object.keys(res.body.error.details).sort()).toEqual(['designPressurePsi', 'nominalSize', 'schedule']);
    expect(res.body.error.details.nominalSize).toEqual(['Not a listed nominal pipe size']);
  });

  it('a temperature below absolute zero is refused (400) with the reason the importer gives, field by field', async () => {
    const res = await users.fitter.post('/api/calc/joint', { ...plain, cureTemperatureF: -500, testTemperatureF: -459.7 });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({ cureTemperatureF: [BELOW_ABSOLUTE_ZERO], testTemperatureF: [BELOW_ABSOLUTE_ZERO] });
    expect((await users.fitter.post('/api/calc/joint', { ...plain, cureTemperatureF: -459.67 })).status).toBe(200);
  });
});

describe("the plant's settings decide the schedule and the test cap", () => {
  it('with schedule B the server answers from schedule B', async () => {
    await PlantSetting.update({ cureScheduleId: 'B' }, { where: { id: 1 } });
    const res = await users.fitter.post('/api/calc/joint', plain);
    expect(res.body).toEqual(expected(plain, { cureScheduleId: 'B', testCap: 'rating' }));
    expect(res.body.cure).toMatchObject({ schedule: 'B', sizeBand: '1-1/2"–3"', cureMinutes: 120 });
  });

  it('a caller cannot pick another schedule than the plant uses', async () => {
    const res = await users.fitter.post('/api/calc/joint', { ...plain, cureScheduleId: 'B', testCap: 'one-and-a-half-rating' });
    expect(res.body.spec).toMatchObject({ cureScheduleId: 'A', testCap: 'rating' });
    expect(res.body.cure.schedule).toBe('A');
  });

  it("with the 1.5 × cap, a test above the weakest component's rating passes", async () => {
    const spec = { ...plain, lowestComponentRatingPsi: 100 };
    expect((await users.fitter.post('/api/calc/joint', spec)).body.test.ok).toBe(false);
    await PlantSetting.update({ testCap: 'one-and-a-half-rating' }, { where: { id: 1 } });
    const res = await users.fitter.post('/api/calc/joint', spec);
    expect(res.body.test).toMatchObject({ ok: true, testPsi: 150, capPsi: 150 });
  });
});

describe('GET and PUT /api/plant-settings', () => {
  it('every role reads them, with the schedule described', async () => {
    const res = await users.fitter.get('/api/plant-settings');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ cureScheduleId: 'A', testCap: 'rating', schedule: { id: 'A', source: expect.stringContaining('[mfr]') } });
  });

  it('a planner, fitter or supervisor may not change them', async () => {
    for (const role of ['planner', 'fitter', 'supervisor']) {
      const res = await (await signedIn(role)).put('/api/plant-settings', { cureScheduleId: 'B', testCap: 'rating', version: 1 });
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/^Only an administrator may do this/);
    }
    expect((await PlantSetting.findByPk(1))?.cureScheduleId).toBe('A');
  });

  it('an admin changes them: written, audited, and the calculator follows', async () => {
    const admin = await signedIn('admin');
    const me = (await admin.get('/api/me')).body;
    const { version } = (await admin.get('/api/plant-settings')).body;
    const res = await admin.put('/api/plant-settings', { cureScheduleId: 'B', testCap: 'one-and-a-half-rating', version });
    expect(res.status).toBe(200);
    expect(res.body.version).toBe(version + 1);
    expect(res.body).toMatchObject({ cureScheduleId: 'B', testCap: 'one-and-a-half-rating', updatedBy: { id: me.id, name: 'Kit Morrow' } });
    expect(await PlantSetting.findByPk(1)).toMatchObject({ cureScheduleId: 'B', testCap: 'one-and-a-half-rating', updatedById: me.id });
    const audit = await AuditEntry.findOne({ where: { action: 'plant-settings-set', actorId: me.id }, order: [['id', 'DESC']] });
    expect(audit).toMatchObject({ entity: 'plant-settings', before: { cureScheduleId: 'A', testCap: 'rating' }, after: { cureScheduleId: 'B', testCap: 'one-and-a-half-rating' } });
    expect((await users.fitter.post('/api/calc/joint', plain)).body.cure.schedule).toBe('B');
  });

  it('two admins save from the same version: the second is refused with who changed them and when, and the first choice stands', async () => {
    const [first, second] = [await signedIn('admin'), await signedIn('admin')];
    const { version } = (await first.get('/api/plant-settings')).body;
    expect((await first.put('/api/plant-settings', { cureScheduleId: 'B', testCap: 'rating', version })).status).toBe(200);
    const late = await second.put('/api/plant-settings', { cureScheduleId: 'A', testCap: 'one-and-a-half-rating', version });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('stale_settings');
    expect(late.body.error.message).toMatch(/^Kit Morrow changed the plant settings at \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC, after you opened them/);
    expect(await PlantSetting.findByPk(1)).toMatchObject({ cureScheduleId: 'B', testCap: 'rating', version: version + 1 });
    // Having seen the change, the second admin saves from the new version.
    expect((await second.put('/api/plant-settings', { cureScheduleId: 'A', testCap: 'rating', version: version + 1 })).status).toBe(200);
  });

  it("the minutes before a lock left on is told: the default until set, set and audited, refused outside 5–1,440, and back to the default with null", async () => {
    const admin = await signedIn('admin');
    let now = (await admin.get('/api/plant-settings')).body;
    expect(now.lockLeftOnMinutes).toBe(60);
    expect(now.atDefault).toContain('lockLeftOnMinutes');
    const bad = await admin.put('/api/plant-settings', { cureScheduleId: now.cureScheduleId, testCap: now.testCap, version: now.version, lockLeftOnMinutes: 3 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.lockLeftOnMinutes[0]).toMatch(/at least 5 minutes/);
    const set = await admin.put('/api/plant-settings', { cureScheduleId: now.cureScheduleId, testCap: now.testCap, version: now.version, lockLeftOnMinutes: 120 });
    expect(set.status).toBe(200);
    expect(set.body.lockLeftOnMinutes).toBe(120);
    expect(set.body.atDefault).not.toContain('lockLeftOnMinutes');
    expect((await PlantSetting.findByPk(1))!.lockLeftOnMinutes).toBe(120);
    const audit = await AuditEntry.findOne({ where: { action: 'plant-settings-set' }, order: [['id', 'DESC']] });
    expect(audit).toMatchObject({ before: { lockLeftOnMinutes: null }, after: { lockLeftOnMinutes: 120 } });
    now = set.body;
    const back = await admin.put('/api/plant-settings', { cureScheduleId: now.cureScheduleId, testCap: now.testCap, version: now.version, lockLeftOnMinutes: null });
    expect(back.body).toMatchObject({ lockLeftOnMinutes: 60, atDefault: expect.arrayContaining(['lockLeftOnMinutes']) });
  });

  it('a schedule that is not published is a 400 naming the field, and nothing changes', async () => {
    const res = await (await signedIn('admin')).put('/api/plant-settings', { cureScheduleId: 'Z', testCap: 'nearly' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.cureScheduleId[0]).toMatch(/choose A or B/);
    expect(res.body.error.details.testCap).toBeDefined();
    expect((await PlantSetting.findByPk(1))?.cureScheduleId).toBe('A');
  });
});

describe("the page's preview and the server's answer agree", () => {
  const form = (over: Partial<CalculatorValues>): CalculatorValues => ({ ...DEFAULT_VALUES, ...over });
  const table: [string, CalculatorValues][] = [
    ['the defaults', form({})],
    ['metric: bar and °C', form({ pressureUnit: 'bar', temperatureUnit: 'C', designPressure: '6.9', designTemperature: '23', cureTemperature: '4', relativeHumidity: '75' })],
    ['kPa with a component rating', form({ pressureUnit: 'kPa', designPressure: '550', lowestComponentRating: '1000', nominalSize: '6', schedule: '40' })],
    ['a unit typed into the field', form({ designPressure: '7 bar', cureTemperature: '12 C' })],
    ['a cold cure below the table, in °C', form({ temperatureUnit: 'C', designTemperature: '20', cureTemperature: '-20', nominalSize: '12' })],
    ['an air test', form({ testMedium: 'air' })],
    ['a non-pressure ABS drain', form({ material: 'ABS', pressureService: 'no', designPressure: '0', cementStandard: 'ASTM D2235', nominalSize: '4' })],
    ['a test pressure given in bar', form({ pressureUnit: 'bar', designPressure: '5', testPressure: '8', designTemperature: '73', nominalSize: '1' })],
  ];
  it.each(table)('%s', async (_name, values) => {
    const preview = previewJoint(values, PLANT_A);
    if (!preview.ok) throw new Error(`the form did not read: ${JSON.stringify(preview.errors)}`);
    const res = await users.fitter.post('/api/calc/joint', preview.spec);
    expect(res.status).toBe(200);
    expect(differingSections(preview.picture, res.body)).toEqual([]);
  });

  it('they disagree when the plant changed its schedule after the page loaded', async () => {
    const preview = previewJoint(DEFAULT_VALUES, PLANT_A);
    if (!preview.ok) throw new Error('the defaults did not read');
    await PlantSetting.update({ cureScheduleId: 'B' }, { where: { id: 1 } });
    const res = await users.fitter.post('/api/calc/joint', preview.spec);
    expect(differingSections(preview.picture, res.body)).toEqual(expect.arrayContaining(['spec', 'cure']));
  });
});
