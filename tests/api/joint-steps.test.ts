// A joint's steps on the shift tablet (DESIGN.md section 9): each value checked by the trade
// engine, the steps in order, only by a fitter with a lock on an isolated section, each write
// once per Idempotency-Key, two tablets that disagree refused, photos checked by their bytes and
// stored without metadata, the holds assembly creates, a redo, and the fitter's shift view.
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { DryFitRetry, Hold, JointStepRecord, Photo } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { Line } from '@server/db/models/line';
import { WorkOrder } from '@server/db/models/work-order';
import { cureSchedule } from '@shared/trade';
import type { HoldDto, JointDetailDto, ShiftDto } from '@shared/schemas/joint-steps';
import { useTestApp } from '../helpers/app';
import { Browserless } from '../helpers/browserless';
import {
  board, GOOD_STEPS, isolatedOrder, lockEveryPoint, lockNo, plannedOrder, recordStep, recordStepsThrough, verificationOf, type StepName,
} from '../helpers/lockout';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'fitter2', 'operations', 'supervisor'], before: plantForWorkOrders });

const TOMAS = 'Tomas Lind';
let fitterId = '';
beforeAll(async () => {
  fitterId = (await users.fitter.get('/api/me')).body.id;
});

const auditOf = (orderId: string, action: string) => AuditEntry.findAll({ where: { entity: 'work-order', entityId: orderId, action }, order: [['id', 'ASC']] });
const stepRows = (jointId: string, step?: StepName) => JointStepRecord.findAll({ where: { jointTaskId: jointId, ...(step ? { step } : {}) } });
const stateOf = async (orderId: string) => (await WorkOrder.findByPk(orderId))!.state;
const detail = async (who: Browserless, jointId: string): Promise<JointDetailDto> => (await who.get(`/api/joint-tasks/${jointId}`)).body;
const withValues = (step: StepName, over: Record<string, unknown>) => ({ ...GOOD_STEPS[step], ...over });
/** Records every step before `step`, so `step` is the next one. */
async function recordBefore(who: Browserless, jointId: string, step: StepName) {
  const steps = Object.keys(GOOD_STEPS) as StepName[];
  const i = steps.indexOf(step);
  if (i > 0) await recordStepsThrough(who, jointId, steps[i - 1]!);
}
/** `YYYY-MM-DD`, `days` before today (UTC). */
const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);
const shiftJoint = (shift: ShiftDto, orderId: string, jointId: string) =>
  shift.orders.find((o) => o.id === orderId)?.lines.flatMap((l) => l.joints).find((j) => j.id === jointId);

/**
 * One isolated order whose joints the step checks share, a joint each, so the file stays quick:
 * a check on one joint does not touch another (the order's own state is tested on orders of their own).
 */
const bench = { orderId: '', number: '', joints: [] as string[] };
let benchUsed = 0;
beforeAll(async () => {
  const { order, jointIds } = await isolatedOrder(users, { word: 'BENCH', joints: 10 });
  Object.assign(bench, { orderId: order.id, number: order.number, joints: jointIds });
});
/** A joint of the shared order no other test uses, and its label. */
async function benchJoint() {
  const id = bench.joints[benchUsed++];
  if (!id) throw new Error('the shared order has no joint left: give it more');
  return { id, label: (await detail(users.fitter, id)).label };
}
const auditOfJoint = async (action: string, label: string) =>
  (await auditOf(bench.orderId, action)).filter((a) => (a.after as { jointTask?: string }).jointTask === label);

describe('the dry fit', () => {
  it('outside 1/3–2/3 of the socket (too loose, too tight, in inches or mm) is refused and kept as a retry; a good one is recorded', async () => {
    const { id: j, label } = await benchJoint();
    await recordBefore(users.fitter, j, 'dry-fit');
    const key = randomUUID();
    const loose = await recordStep(users.fitter, j, 'dry-fit', { insertion: 1.2, unit: 'in' }, key);
    expect(loose.status).toBe(409);
    expect(loose.body.error.code).toBe('dry_fit_outside');
    expect(loose.body.error.message).toBe(
      'The dry pipe enters deeper than 2/3 of the socket: too loose for a sound joint; try another fitting or pipe. ' +
        'It entered 1.200 in; a 2" socket 1.5 in deep takes 0.500–1.000 in dry. Re-cut the pipe or take another fitting, then record the dry fit again.',
    );
    // The kept refusal is the key's answer: sent again, it is answered again and kept once.
    const replay = await recordStep(users.fitter, j, 'dry-fit', { insertion: 1.2, unit: 'in' }, key);
    expect(replay.status).toBe(409);
    expect(replay.headers.get('idempotent-replayed')).toBe('true');
    expect(replay.body).toEqual(loose.body);

    const tight = await recordStep(users.fitter, j, 'dry-fit', { insertion: 0.3, unit: 'in' });
    expect(tight.status).toBe(409);
    expect(tight.body.error.code).toBe('dry_fit_outside');
    expect(tight.body.error.message).toMatch(/^The dry pipe enters less than 1\/3 of the socket: too tight; .* It entered 0\.300 in;/);
    const looseMm = await recordStep(users.fitter, j, 'dry-fit', { insertion: 30, unit: 'mm' }); // 1.181 in
    expect(looseMm.status).toBe(409);
    expect(looseMm.body.error.message).toContain('too loose');
    expect(looseMm.body.error.message).toContain('It entered 1.181 in;');
    const tightMm = await recordStep(users.fitter, j, 'dry-fit', { insertion: 10, unit: 'mm' }); // 0.394 in
    expect(tightMm.status).toBe(409);
    expect(tightMm.body.error.message).toContain('too tight');
    expect(tightMm.body.error.message).toContain('It entered 0.394 in;');

    expect(await stepRows(j, 'dry-fit')).toEqual([]);
    const retries = await DryFitRetry.findAll({ where: { jointTaskId: j }, order: [['recordedAt', 'ASC']] });
    expect(retries.map((r) => Math.round(r.insertionIn * 1000) / 1000)).toEqual([1.2, 0.3, 1.181, 0.394]);
    expect(retries.every((r) => r.recordedById === fitterId)).toBe(true);
    expect(await auditOfJoint('dry-fit-refused', label)).toHaveLength(4);
    const before = await detail(users.fitter, j);
    expect(before.nextStep).toBe('dry-fit');
    expect(before.dryFitRetries).toHaveLength(4);
    expect(before.dryFitRetries[0]).toMatchObject({ by: { name: TOMAS }, message: loose.body.error.message });

    const good = await recordStep(users.fitter, j, 'dry-fit', { insertion: 19, unit: 'mm' }); // 0.748 in
    expect(good.status).toBe(201);
    expect(good.body.nextStep).toBe('depth-marks');
    const [row, ...more] = await stepRows(j, 'dry-fit');
    expect(more).toEqual([]);
    expect(row!.values).toEqual({ insertion: 19, unit: 'mm', insertionIn: 0.748, socketDepthIn: 1.5, fit: 'ok' });
    expect(row!.recordedById).toBe(fitterId);
    expect(await DryFitRetry.count({ where: { jointTaskId: j } })).toBe(4);
  });
});

describe('the primer and the cement', () => {
  it('refuses expired cement (more than two years from its stamped date)', async () => {
    const { id: j } = await benchJoint();
    await recordBefore(users.fitter, j, 'cement');
    const made = daysAgo(2 * 365 + 30);
    const res = await recordStep(users.fitter, j, 'cement', withValues('cement', { manufacturedOn: made, lot: 'OLD-1' }));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('step_refused');
    expect(res.body.error.message).toMatch(new RegExp(`^Cement lot OLD-1 made ${made} expired on \\d{4}-\\d\\d-\\d\\d \\(about two years from its stamped date\\): do not use it\\.$`));
    expect(await stepRows(j, 'cement')).toEqual([]);
    // A can well inside its shelf life is taken.
    const fresh = await recordStep(users.fitter, j, 'cement', withValues('cement', { manufacturedOn: daysAgo(300) }));
    expect(fresh.status).toBe(201);
  });

  it('refuses the cement for another material (ASTM F493, for CPVC, on PVC)', async () => {
    const { id: j } = await benchJoint();
    await recordBefore(users.fitter, j, 'cement');
    const res = await recordStep(users.fitter, j, 'cement', withValues('cement', { standard: 'ASTM F493' }));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('step_refused');
    expect(res.body.error.message).toBe('ASTM F493 is the cement for CPVC, not PVC pipe; use ASTM D2564.');
    expect(await stepRows(j, 'cement')).toEqual([]);
  });

  it('refuses ASTM D3138 transition cement on a line in pressure service, and takes it on a non-pressure line', async () => {
    const { id: j } = await benchJoint();
    await recordBefore(users.fitter, j, 'cement');
    const res = await recordStep(users.fitter, j, 'cement', withValues('cement', { standard: 'ASTM D3138' }));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('ASTM D3138 transition cement is for non-pressure service only (25 psi or less).');
    expect(await stepRows(j, 'cement')).toEqual([]);

    const drain = await isolatedOrder(users, { word: 'NOPRESS', line: { designPressurePsi: 0 } });
    await recordBefore(users.fitter, drain.jointIds[0]!, 'cement');
    expect((await recordStep(users.fitter, drain.jointIds[0]!, 'cement', withValues('cement', { standard: 'ASTM D3138' }))).status).toBe(201);
  });

  it('refuses a primer that does not suit the material', async () => {
    const { id: j } = await benchJoint();
    await recordBefore(users.fitter, j, 'primer');
    const res = await recordStep(users.fitter, j, 'primer', withValues('primer', { standard: 'ASTM D2564' }));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('step_refused');
    expect(res.body.error.message).toBe('ASTM D2564 is not a primer for PVC; use an ASTM F656 primer.');
    expect(await stepRows(j, 'primer')).toEqual([]);
    expect((await detail(users.fitter, j)).nextStep).toBe('primer');
  });
});

describe('the order of the steps and who may record them', () => {
  it('refuses a step out of order (the cement before the primer)', async () => {
    const { id: j, label } = await benchJoint();
    await recordBefore(users.fitter, j, 'primer');
    const res = await recordStep(users.fitter, j, 'cement');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('step_out_of_order');
    expect(res.body.error.message).toBe(`Record ${label}'s primer before its cement.`);
    expect(await stepRows(j, 'cement')).toEqual([]);
    expect((await auditOfJoint('joint-step-recorded', label)).map((a) => (a.after as { step: string }).step)).toEqual(['prep', 'dry-fit', 'depth-marks']);
  });

  it('refuses a fitter without their own lock on the section', async () => {
    const { id: j } = await benchJoint();
    const res = await recordStep(users.fitter2, j, 'prep');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('my_lock_missing');
    expect(res.body.error.message).toBe(`You have no lock on ${bench.number}. Put your own lock on a point or the lock box before working on the section (OSHA 29 CFR 1910.147(d)(4)).`);
    expect(await stepRows(j)).toEqual([]);
    // The fitter whose lock is on records the same step.
    expect((await recordStep(users.fitter, j, 'prep')).status).toBe(201);
  });
});

describe('the assembly', () => {
  it('of a 6" joint is refused without a mechanical joining device, and taken with one', async () => {
    const { jointIds } = await isolatedOrder(users, { word: 'SIX', line: { nominalSize: '6' } });
    const j = jointIds[0]!;
    expect((await detail(users.fitter, j)).engine).toMatchObject({ joiningDevice: true, socketDepthIn: 3, dryFitMinIn: 1, dryFitMaxIn: 2 });
    for (const step of ['prep', 'dry-fit', 'depth-marks', 'primer', 'cement'] as const) {
      const res = await recordStep(users.fitter, j, step, step === 'dry-fit' ? { insertion: 1.5, unit: 'in' } : GOOD_STEPS[step]);
      expect(res.status, `${step}: ${JSON.stringify(res.body)}`).toBe(201);
    }
    const res = await recordStep(users.fitter, j, 'assembly', withValues('assembly', { joiningDeviceUsed: false }));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('step_refused');
    expect(res.body.error.message).toBe('A 6" joint needs a mechanical joining device to bottom the pipe evenly; cut it out and remake it with one.');
    expect(await stepRows(j, 'assembly')).toEqual([]);
    expect(await Hold.count({ where: { jointTaskId: j } })).toBe(0);
    expect((await recordStep(users.fitter, j, 'assembly', withValues('assembly', { joiningDeviceUsed: true }))).status).toBe(201);
  });

  it('held fewer seconds than the engine asks at the recorded temperature is refused; the holds count at the colder recorded temperature and the higher humidity', async () => {
    // Forecast 70 °F and 50 % RH; the fitter records 10 °C (50 °F) and 70 % RH at the cement step.
    const { order, jointIds } = await isolatedOrder(users, { over: { forecastLowF: 70, forecastHighRh: 50 } });
    const j = jointIds[0]!;
    await recordBefore(users.fitter, j, 'cement');
    const cement = await recordStep(users.fitter, j, 'cement', withValues('cement', { ambientTemperature: 10, temperatureUnit: 'C', relativeHumidity: 70 }));
    expect(cement.status).toBe(201);
    expect((await stepRows(j, 'cement'))[0]!.values).toMatchObject({ temperatureF: 50 });

    const short = await recordStep(users.fitter, j, 'assembly', withValues('assembly', { heldSeconds: 45 }));
    expect(short.status).toBe(409);
    expect(short.body.error.code).toBe('step_refused');
    expect(short.body.error.message).toBe('Hold the joint still at least 60 s at 50 °F; it was held 45 s.');
    expect(await stepRows(j, 'assembly')).toEqual([]);
    expect(await Hold.count({ where: { jointTaskId: j } })).toBe(0);

    const res = await recordStep(users.fitter, j, 'assembly', withValues('assembly', { heldSeconds: 60 }));
    expect(res.status).toBe(201);
    const testPsi = (await users.planner.get(`/api/work-orders/${order.id}`)).body.testPressure.testPsi as number;
    expect(testPsi).toBeGreaterThan(0);
    const engine = cureSchedule({ material: 'PVC', nominalSize: '2', temperatureF: 50, relativeHumidity: 70, pressurePsi: testPsi, schedule: 'A' });
    if (!engine.ok) throw new Error(engine.reason);
    expect(engine.humidityAdjusted).toBe(true);
    const holds = (res.body as JointDetailDto).holds;
    const set = holds.find((h) => h.kind === 'set')!;
    const cure = holds.find((h) => h.kind === 'cure')!;
    for (const h of [set, cure]) {
      expect(h).toMatchObject({ status: 'running', temperatureF: 50, relativeHumidity: 70, pressurePsi: testPsi, schedule: 'A', source: engine.source });
      expect(h.basis).toBe(`${engine.temperatureBand} · ${engine.sizeBand} · ${engine.pressureBand} · +50% for humidity above 60%`);
    }
    expect(Date.parse(set.endsAt!) - Date.parse(set.startsAt)).toBe(engine.setMinutes * 60_000);
    expect(Date.parse(cure.endsAt!) - Date.parse(cure.startsAt)).toBe(engine.cureMinutes * 60_000);
    const rows = await Hold.findAll({ where: { jointTaskId: j } });
    expect(rows.map((h) => `${h.kind} ${h.status} ${h.temperatureF}`).sort()).toEqual(['cure running 50', 'set running 50']);
    expect((await stepRows(j, 'assembly'))[0]!.values).toMatchObject({ heldSeconds: 60, requiredHoldSeconds: 60 });
  });

  it('on an ABS line (no published cure table) leaves both holds awaiting engineering, with the engine\'s reason', async () => {
    // An ABS order cannot be planned through the API (no cure table, no rating): the line is a
    // non-pressure PVC drain when planned and isolated, and the register calls it ABS before the joint is made.
    const { jointIds, lines } = await isolatedOrder(users, { word: 'ABS', line: { designPressurePsi: 0 } });
    await Line.update({ material: 'ABS' }, { where: { id: lines[0]!.id } });
    const j = jointIds[0]!;
    const abs = { primer: withValues('primer', { standard: 'none' }), cement: withValues('cement', { standard: 'ASTM D2235' }) };
    for (const step of ['prep', 'dry-fit', 'depth-marks', 'primer', 'cement', 'assembly'] as const) {
      const res = await recordStep(users.fitter, j, step, step === 'primer' || step === 'cement' ? abs[step] : GOOD_STEPS[step]);
      expect(res.status, `${step}: ${JSON.stringify(res.body)}`).toBe(201);
    }
    const engine = cureSchedule({ material: 'ABS', nominalSize: '2', temperatureF: 70, relativeHumidity: 50, pressurePsi: 0, schedule: 'A' });
    expect(engine.ok).toBe(false);
    const reason = engine.ok ? '' : engine.reason;
    const d = await detail(users.fitter, j);
    expect(d.holds).toHaveLength(2);
    for (const h of d.holds) expect(h).toMatchObject({ status: 'awaiting-engineering', endsAt: null, basis: reason, source: null });
    expect(d.holds.map((h) => h.kind).sort()).toEqual(['cure', 'set']);
    expect(d.blockers.filter((b) => b.kind === 'hold')).toEqual([
      { kind: 'hold', message: `Set hold waits for a supervisor's engineering cure time: ${reason}`, until: null },
      { kind: 'hold', message: `Cure hold waits for a supervisor's engineering cure time: ${reason}`, until: null },
    ]);
    const rows = await Hold.findAll({ where: { jointTaskId: j } });
    expect(rows.map((h) => [h.status, h.endsAt])).toEqual([['awaiting-engineering', null], ['awaiting-engineering', null]]);
  });

  it('a supervisor enters an engineering cure time with a reason: the holds run from the assembly, and every record says so', async () => {
    const { jointIds, lines, order } = await isolatedOrder(users, { word: 'ENG', line: { designPressurePsi: 0 } });
    await Line.update({ material: 'ABS' }, { where: { id: lines[0]!.id } });
    const j = jointIds[0]!;
    const abs = { primer: withValues('primer', { standard: 'none' }), cement: withValues('cement', { standard: 'ASTM D2235' }) };
    for (const step of ['prep', 'dry-fit', 'depth-marks', 'primer', 'cement', 'assembly'] as const) {
      expect((await recordStep(users.fitter, j, step, step === 'primer' || step === 'cement' ? abs[step] : GOOD_STEPS[step])).status).toBe(201);
    }
    const [waiting] = await Hold.findAll({ where: { jointTaskId: j } });
    const entry = { setMinutes: 45, cureMinutes: 1440, reason: 'ABS drain, no pressure: the cement maker\'s data sheet gives 24 h at 60–100 °F.' };
    expect((await users.fitter.tablet(`/api/holds/${waiting!.id}/engineering`, entry)).status).toBe(403);
    const res = await users.supervisor.tablet(`/api/holds/${waiting!.id}/engineering`, entry);
    expect(res.status).toBe(200);
    for (const h of res.body.holds) {
      expect(h.status).toBe('running');
      expect(Date.parse(h.endsAt) - Date.parse(h.startsAt)).toBe((h.kind === 'set' ? 45 : 1440) * 60_000);
      expect(h.engineering).toEqual({ by: { id: expect.any(String), name: 'Rafe Adeyemi' }, reason: entry.reason, minutes: h.kind === 'set' ? 45 : 1440 });
      expect(h.basis).toMatch(/^Engineering cure time entered by Rafe Adeyemi: ABS drain/);
    }
    const onOrder = (await users.planner.get(`/api/work-orders/${order.id}`)).body;
    expect(onOrder.holds.every((h: { engineering: unknown }) => h.engineering !== null)).toBe(true);
    expect(onOrder.history.some((e: { action: string }) => e.action === 'engineering-cure-time')).toBe(true);
    expect((await users.supervisor.tablet(`/api/holds/${waiting!.id}/engineering`, entry)).status).toBe(409); // nothing waits any more
  });
});

describe('a step sent again', () => {
  it('with the same Idempotency-Key and body is recorded once and answered the same; the key with another body is refused; no key is refused', async () => {
    const { id: j, label } = await benchJoint();
    const key = randomUUID();
    const first = await recordStep(users.fitter, j, 'prep', GOOD_STEPS.prep, key);
    expect(first.status).toBe(201);
    expect(first.headers.get('idempotent-replayed')).toBeNull();
    const again = await recordStep(users.fitter, j, 'prep', GOOD_STEPS.prep, key);
    expect(again.status).toBe(201);
    expect(again.headers.get('idempotent-replayed')).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await stepRows(j, 'prep')).toHaveLength(1);
    expect(await auditOfJoint('joint-step-recorded', label)).toHaveLength(1);

    const reused = await recordStep(users.fitter, j, 'dry-fit', GOOD_STEPS['dry-fit'], key);
    expect(reused.status).toBe(422);
    expect(reused.body.error.code).toBe('idempotency_key_reused');
    expect(await stepRows(j, 'dry-fit')).toEqual([]);

    const keyless = await users.fitter.post(`/api/joint-tasks/${j}/steps`, { step: 'dry-fit', values: GOOD_STEPS['dry-fit'] });
    expect(keyless.status).toBe(400);
    expect(keyless.body.error.message).toContain('Idempotency-Key');
    expect(await stepRows(j, 'dry-fit')).toEqual([]);
    // Two sends of one write racing each other (the tablet retries before the first answer came) record it once.
    const raceKey = randomUUID();
    const race = await Promise.all([recordStep(users.fitter, j, 'dry-fit', GOOD_STEPS['dry-fit'], raceKey), recordStep(users.fitter, j, 'dry-fit', GOOD_STEPS['dry-fit'], raceKey)]);
    expect(race.map((r) => r.status)).toEqual([201, 201]);
    expect(race.map((r) => r.headers.get('idempotent-replayed')).sort()).toEqual(['true', null].sort());
    expect(race[0]!.body).toEqual(race[1]!.body);
    expect(await stepRows(j, 'dry-fit')).toHaveLength(1);
    expect((await auditOfJoint('joint-step-recorded', label)).map((a) => (a.after as { step: string }).step)).toEqual(['prep', 'dry-fit']);
  });

  it('from a second tablet with other values is a conflict naming what was recorded and by whom', async () => {
    const { order, jointIds } = await isolatedOrder(users);
    const j = jointIds[0]!;
    const { points } = await board(users.fitter2, order.id);
    expect((await users.fitter2.tablet(`/api/work-orders/${order.id}/locks`, { locks: [{ entryId: points[0]!.entryId, lockNumber: lockNo('N') }] })).status).toBe(201);
    await recordStepsThrough(users.fitter, j, 'dry-fit');
    const label = (await detail(users.fitter, j)).label;

    const res = await recordStep(users.fitter2, j, 'dry-fit', { insertion: 0.8, unit: 'in' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('step_conflict');
    expect(res.body.error.message).toMatch(new RegExp(`^${label}'s dry fit was already recorded by ${TOMAS} at \\d{4}-\\d\\d-\\d\\d \\d\\d:\\d\\d UTC \\(.*\\)\\. Yours was not recorded\\.$`));
    expect(res.body.error.message).toContain('insertion 0.75');
    expect(res.body.error.message).toContain('unit in');
    const rows = await stepRows(j, 'dry-fit');
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ recordedById: fitterId, values: { insertion: 0.75 } });
    // The same values from another person are theirs, not a copy of Tomas's record: a conflict too.
    const same = await recordStep(users.fitter2, j, 'dry-fit');
    expect(same.status).toBe(409);
    expect(same.body.error.code).toBe('step_conflict');
    // The same fitter's tablet sending the same values again (a new key) is no conflict.
    expect((await recordStep(users.fitter, j, 'dry-fit')).status).toBe(200);
    expect(await stepRows(j, 'dry-fit')).toHaveLength(1);
  });
});

describe('joint photos', () => {
  let jointId = '';
  beforeAll(async () => {
    jointId = (await benchJoint()).id;
  });

  async function upload(who: Browserless, filename: string, content: Buffer, opts: { step?: string; key?: string } = {}) {
    const form = new FormData();
    form.append('step', opts.step ?? 'depth-marks');
    form.append('photo', new Blob([new Uint8Array(content)]), filename);
    const res = await who.raw(`/api/joint-tasks/${jointId}/photos`, { method: 'POST', body: form, headers: { 'Idempotency-Key': opts.key ?? randomUUID() } });
    const text = await res.text();
    return { status: res.status, body: text && res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text };
  }
  const photoCount = () => Photo.count({ where: { jointTaskId: jointId } });
  const picture = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: { r: 180, g: 90, b: 30 } } });

  it('refuses a PDF renamed photo.jpg, and an HTML file renamed .png (415), by their content', async () => {
    const pdf = await upload(users.fitter, 'photo.jpg', Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<<>>\n%%EOF\n'));
    expect(pdf.status).toBe(415);
    expect(pdf.body.error).toEqual({ code: 'not_an_image', message: 'That file is a PDF file by its content; a joint photo must be a JPEG, PNG or WebP picture.' });
    const html = await upload(users.fitter, 'joint.png', Buffer.from('<!DOCTYPE html><html><body><script>alert(1)</script></body></html>'));
    expect(html.status).toBe(415);
    expect(html.body.error.code).toBe('not_an_image');
    expect(html.body.error.message).toMatch(/^That file is not an image by its content/);
    expect(await photoCount()).toBe(0);
  });

  it('refuses a picture over 12 MB (413)', async () => {
    const big = Buffer.alloc(13 * 1024 * 1024, 0x20);
    big.set([0xff, 0xd8, 0xff, 0xe0]);
    const res = await upload(users.fitter, 'big.jpg', big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('photo_too_large');
    expect(await photoCount()).toBe(0);
  });

  it('stores a JPEG upright and without its metadata, served as image/jpeg by id', async () => {
    // 64 × 32 with orientation 6 (turn 90° clockwise to view): upright it is 32 wide and 64 high.
    const jpeg = await picture(64, 32).jpeg().withMetadata({ orientation: 6, exif: { IFD0: { Make: 'TestCam', Model: 'Leaky 1' } } }).toBuffer();
    expect(jpeg.includes('TestCam')).toBe(true);
    expect((await sharp(jpeg).metadata()).exif).toBeDefined();
    const key = randomUUID();
    const res = await upload(users.fitter, 'IMG_0001.JPG', jpeg, { key });
    expect(res.status).toBe(201);
    // Sent again with its key (the answer was lost on the way), it is kept once.
    const again = await upload(users.fitter, 'IMG_0001.JPG', jpeg, { key });
    expect(again).toEqual({ status: 201, body: res.body });
    expect(await photoCount()).toBe(1);
    expect(res.body).toMatchObject({ step: 'depth-marks', width: 32, height: 64, takenBy: { id: fitterId, name: TOMAS }, url: `/api/photos/${res.body.id}` });

    const row = (await Photo.findByPk(res.body.id))!;
    expect(row).toMatchObject({ jointTaskId: jointId, step: 'depth-marks', mediaType: 'image/jpeg', takenById: fitterId, width: 32, height: 64 });
    const served = await users.operations.raw(res.body.url);
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('image/jpeg');
    const bytes = Buffer.from(await served.arrayBuffer());
    expect(bytes.includes('TestCam')).toBe(false);
    const meta = await sharp(bytes).metadata();
    expect(meta).toMatchObject({ format: 'jpeg', width: 32, height: 64 });
    expect(meta.exif).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
    expect((await detail(users.fitter, jointId)).photos.map((p) => p.id)).toContain(res.body.id);
  });

  it('takes a PNG and serves it as a JPEG', async () => {
    const png = await picture(40, 30).png().toBuffer();
    const res = await upload(users.fitter, 'finished.png', png, { step: 'wipe' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ step: 'wipe', width: 40, height: 30 });
    const served = await users.fitter.raw(res.body.url);
    expect(served.headers.get('content-type')).toBe('image/jpeg');
    expect((await sharp(Buffer.from(await served.arrayBuffer())).metadata()).format).toBe('jpeg');
    expect((await Photo.findByPk(res.body.id))!.mediaType).toBe('image/jpeg');
  });

  it('refuses a signed-out client (401), for an upload and for reading a photo', async () => {
    const before = await photoCount();
    const stranger = new Browserless();
    const res = await upload(stranger, 'a.png', await picture(8, 8).png().toBuffer());
    expect(res.status).toBe(401);
    expect(await photoCount()).toBe(before);
    const some = await Photo.findOne({ where: { jointTaskId: jointId } });
    expect(some, 'an earlier test stored a photo').not.toBeNull();
    expect((await stranger.raw(`/api/photos/${some!.id}`)).status).toBe(401);
  });
});

describe('the order\'s state and the shift view', () => {
  it('moves to in work at the first step and to curing at the assembly; a redo in curing goes back to in work, voids the old holds and adds a task that points back', async () => {
    const { order, jointIds } = await isolatedOrder(users);
    const j = jointIds[0]!;
    expect(await stateOf(order.id)).toBe('isolated');
    await recordStepsThrough(users.fitter, j, 'prep');
    expect(await stateOf(order.id)).toBe('in-work');
    expect((await auditOf(order.id, 'joint-step-recorded'))[0]).toMatchObject({ before: { state: 'isolated' }, after: { step: 'prep', state: 'in-work' } });
    for (const step of ['dry-fit', 'depth-marks', 'primer', 'cement'] as const) expect((await recordStep(users.fitter, j, step)).status).toBe(201);
    expect(await stateOf(order.id)).toBe('in-work');
    const assembled = await recordStep(users.fitter, j, 'assembly');
    expect(assembled.status).toBe(201);
    expect(await stateOf(order.id)).toBe('curing');
    const oldHolds = (assembled.body as JointDetailDto).holds;
    expect(oldHolds.map((h) => h.status)).toEqual(['running', 'running']);

    const reason = 'The cement skinned over before the pipe went in.';
    const redo = await users.fitter.tablet(`/api/joint-tasks/${j}/redo`, { reason });
    expect(redo.status).toBe(201);
    const fresh = redo.body as JointDetailDto;
    expect(fresh.id).not.toBe(j);
    expect(fresh).toMatchObject({ replacesTaskId: j, nextStep: 'prep', steps: [], holds: [], fitter: { name: TOMAS }, workOrder: { state: 'in-work' } });
    expect(await stateOf(order.id)).toBe('in-work');
    expect((await JointTask.findByPk(fresh.id))!.replacesTaskId).toBe(j);
    const old = (await JointTask.findByPk(j))!;
    expect(old.redoneAt).toBeInstanceOf(Date);
    expect(old.redoReason).toBe(reason);
    const holds = await Hold.findAll({ where: { jointTaskId: j } });
    expect(holds).toHaveLength(2);
    for (const h of holds) {
      expect(h.status).toBe('void');
      expect(h.voidReason).toContain(reason);
    }
    const [entry] = await auditOf(order.id, 'joint-redo');
    expect(entry).toMatchObject({ before: { state: 'curing' }, after: { reason, holdsVoided: 2, state: 'in-work' } });
    const oldDetail = await detail(users.fitter, j);
    expect(oldDetail).toMatchObject({ replacedByTaskId: fresh.id, nextStep: null, redo: { reason, by: { name: TOMAS } } });

    const shift = (await users.fitter.get('/api/shift')).body as ShiftDto;
    expect(shift.orders.find((o) => o.id === order.id)).toMatchObject({ state: 'in-work', isolated: true, myLockOn: true });
    const was = shiftJoint(shift, order.id, j);
    const now = shiftJoint(shift, order.id, fresh.id);
    expect(was).toMatchObject({ redone: true, nextStep: null, stepsDone: 6 });
    expect(was!.blockers).toEqual([{ kind: 'redone', message: `Cut out for redo; ${fresh.label} replaces it.`, until: null }]);
    expect(was!.holds.map((h: HoldDto) => h.status)).toEqual(['void', 'void']);
    expect(now).toMatchObject({ redone: false, nextStep: 'prep', stepsDone: 0, blockers: [] });
  });

  it('shows an isolation blocker until the verification, and a hold blocker with its end after the assembly', async () => {
    const { order, jointIds } = await plannedOrder(users, { word: 'SHIFT' });
    const j = jointIds[0]!;
    const shiftRow = async () => {
      const shift = (await users.fitter.get('/api/shift')).body as ShiftDto;
      return { order: shift.orders.find((o) => o.id === order.id)!, joint: shiftJoint(shift, order.id, j)! };
    };
    // Planned: no lock on, nothing verified.
    const planned = await shiftRow();
    expect(planned.order).toMatchObject({ state: 'planned', isolated: false, myLockOn: false });
    expect(planned.joint.nextStep).toBe('prep');
    expect(planned.joint.blockers.map((b) => b.kind)).toEqual(['isolation', 'my-lock']);
    expect(planned.joint.blockers[0]!.message).toMatch(/^Isolation not verified: 2 of 2 isolation points have no lock: .+\. Zero energy has not been verified for the section\.$/);
    expect(planned.joint.blockers[1]!.message).toBe(`You have no lock on ${order.number}: put your own lock on before working on the section.`);

    // Locked on, not yet verified: still the isolation blocker, no longer the lock one (the joint's own view says the same as the shift).
    const locked = await lockEveryPoint(users.fitter, order.id);
    expect((await detail(users.fitter, j)).blockers).toEqual([{ kind: 'isolation', message: 'Isolation not verified: Zero energy has not been verified for the section.', until: null }]);
    expect((await users.operations.tablet(`/api/work-orders/${order.id}/verification`, verificationOf(locked))).status).toBe(201);
    expect((await detail(users.fitter, j)).blockers).toEqual([]);

    const done = (await recordStepsThrough(users.fitter, j, 'assembly')) as JointDetailDto;
    const set = done.holds.find((h) => h.kind === 'set')!;
    const cure = done.holds.find((h) => h.kind === 'cure')!;
    expect(Date.parse(set.endsAt!)).toBeGreaterThan(Date.now());
    const assembled = await shiftRow();
    expect(assembled.order).toMatchObject({ state: 'curing', isolated: true, myLockOn: true });
    expect(assembled.joint).toMatchObject({ nextStep: 'wipe', stepsDone: 6 });
    expect(assembled.joint.blockers).toEqual([
      { kind: 'hold', message: 'Set hold: do not handle the joint.', until: set.endsAt },
      { kind: 'hold', message: 'Cure hold: no pressure on the joint.', until: cure.endsAt },
    ]);
  });
});
