// Submitting the plan: what it needs, the window plan against the engine's own figures, the late
// plan's reason and mail, the step back to draft on an edit, and overlapping windows.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { WorkOrder } from '@server/db/models/work-order';
import { closeQueues } from '@server/queues/connection';
import { cureSchedule, MIN_TEST_HOLD_MINUTES } from '@shared/trade';
import { WINDOW_PLAN_DEFAULTS } from '@shared/schemas/plant-settings';
import { startWorkers } from '../../worker/workers';
import { useTestApp } from '../helpers/app';
import { waitFor } from '../helpers/import-csv';
import { makeIsolationPoint, makeLines, uniquePrefix } from '../helpers/line-rows';
import { mailMentioning } from '../helpers/mail';
import { createOrder, plannableOrder, plantForWorkOrders, windowOf } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
let workers: ReturnType<typeof startWorkers>;
beforeAll(() => void (workers = startWorkers()));
afterAll(async () => {
  await workers.close();
  await closeQueues();
});

const plan = (id: string, body: unknown = {}) => users.planner.post(`/api/work-orders/${id}/plan`, body);
const auditOf = (orderId: string, action: string) => AuditEntry.findAll({ where: { entity: 'work-order', entityId: orderId, action }, order: [['id', 'ASC']] });
const D = WINDOW_PLAN_DEFAULTS;
/** The engine's own cure for the order's joints (schedule A, PVC), the figure the window plan must show. */
const engineCure = (size: string, temperatureF: number, relativeHumidity: number, pressurePsi: number) => {
  const cure = cureSchedule({ material: 'PVC', nominalSize: size, temperatureF, relativeHumidity, pressurePsi, schedule: 'A' });
  if (!cure.ok) throw new Error(cure.reason);
  return cure.cureMinutes;
};

/** A line with one valve in the register, and an order on it ready to plan. */
async function readyOrder(word: string, line: Record<string, unknown> = {}, over: Record<string, unknown> = {}, joints = 2) {
  const p = uniquePrefix(word);
  const lines = await makeLines(p, [line]);
  await makeIsolationPoint(lines[0]!, `${p}-HV-1`);
  return { lines, order: await plannableOrder(users.planner, lines, { joints, over }) };
}

describe('what a plan needs', () => {
  it('a plan with no joints, no isolation plan and no window is refused with 409 naming each, and stays a draft', async () => {
    const lines = await makeLines(uniquePrefix('EMPTY'), [{}]);
    const order = await createOrder(users.planner, lines, { windowStart: null, windowEnd: null });
    const res = await plan(order.id);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('plan_incomplete');
    expect(res.body.error.details.plan).toEqual(['It has no joint tasks.', 'It has no isolation plan.', 'No repair window is booked.']);
    expect(res.body.error.message).toBe(`${order.number} cannot be planned yet. It has no joint tasks. It has no isolation plan. No repair window is booked.`);
    expect(await WorkOrder.findByPk(order.id)).toMatchObject({ state: 'draft', version: 1 });
    expect(await auditOf(order.id, 'work-order-planned')).toEqual([]);
  });

  it('each missing part alone is refused: joints, isolation plan, window', async () => {
    const { order } = await readyOrder('ONE');
    const j1 = order.jointTasks.map((j: any) => j.id);
    for (const id of j1) await users.planner.del(`/api/joint-tasks/${id}`);
    expect((await plan(order.id)).body.error.details.plan).toEqual(['It has no joint tasks.']);

    const noPlan = (await readyOrder('TWO')).order;
    await users.planner.put(`/api/work-orders/${noPlan.id}/isolation-plan`, { entries: [] });
    expect((await plan(noPlan.id)).body.error.details.plan).toEqual(['It has no isolation plan.']);

    const noWindow = (await readyOrder('THREE')).order;
    await users.planner.json('PATCH', `/api/work-orders/${noWindow.id}`, { version: noWindow.version, windowStart: null, windowEnd: null });
    expect((await plan(noWindow.id)).body.error.details.plan).toEqual(['No repair window is booked.']);
  });

  it('a cement mismatch (a PVC and an ABS line on one order) cannot be planned', async () => {
    const p = uniquePrefix('MIXPLAN');
    const lines = await makeLines(p, [{ material: 'PVC' }, { material: 'ABS' }]);
    await makeIsolationPoint(lines[0]!, `${p}-HV-1`);
    const order = await plannableOrder(users.planner, lines);
    const res = await plan(order.id);
    expect(res.status).toBe(409);
    expect(res.body.error.details.plan).toContain(`Materials: Line ${lines[1]!.lineNumber} (ABS): ASTM D2564 is the cement for PVC, not ABS pipe; use ASTM D2235.`);
    expect((await WorkOrder.findByPk(order.id))?.state).toBe('draft');
  });

  it('a fitter or operations trying to plan gets 403 and the order stays a draft', async () => {
    const { order } = await readyOrder('ROLE');
    for (const role of ['fitter', 'operations'] as const) {
      const res = await users[role].post(`/api/work-orders/${order.id}/plan`, {});
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/^Only a maintenance planner or supervisor may do this; your roles are/);
    }
    expect((await WorkOrder.findByPk(order.id))?.state).toBe('draft');
  });
});

describe('the window plan, against the engine (schedule A)', () => {
  it('warm case, schedule A 60–100 °F, 1-1/2"–2" ≤160 psi: every step from the settings and the engine, and it fits', async () => {
    const { order } = await readyOrder('WARM', { nominalSize: '2', designPressurePsi: 100 }, { forecastLowF: 68, forecastHighRh: 40 }, 3);
    const res = await users.fitter.get(`/api/work-orders/${order.id}/window-plan`);
    expect(res.status).toBe(200);
    const cure = engineCure('2', 68, 40, 150); // test pressure 1.5 × 100 psi
    const minutes = [D.isolationPerOrderMinutes + D.isolationPerPointMinutes * 2, 3 * 20, cure, D.fillAndVentMinutes + MIN_TEST_HOLD_MINUTES, D.releaseMinutes];
    expect(res.body.steps.map((s: any) => s.minutes)).toEqual(minutes);
    const start = Date.parse(order.windowStart);
    expect(res.body.earliestRelease).toBe(new Date(start + minutes.reduce((a, b) => a + b) * 60_000).toISOString());
    expect(res.body).toMatchObject({ fits: true, late: null, refusals: [], missing: [], timeZone: 'America/Chicago' });
    expect(order.windowPlan).toEqual(res.body); // the order page shows the same plan
  });

  it('cold case, schedule A 0–40 °F, 2-1/2"–8" ≤160 psi: the cure runs days past a 12-hour window; it names the step, the end it needs, and that a cure kept above 40 °F would fit', async () => {
    const { order } = await readyOrder('COLD', { nominalSize: '6', designPressurePsi: 100 }, { forecastLowF: 34, forecastHighRh: 70 });
    const res = await users.planner.get(`/api/work-orders/${order.id}/window-plan`);
    const cure = engineCure('6', 34, 70, 150);
    const heated = engineCure('6', 60, 70, 150);
    expect(cure).toBe(72 * 60 * 1.5); // 72 h, 50% more above 60% humidity
    const minutes = [D.isolationPerOrderMinutes + D.isolationPerPointMinutes * 2, 2 * 45, cure, D.fillAndVentMinutes + MIN_TEST_HOLD_MINUTES, D.releaseMinutes];
    expect(res.body.steps.map((s: any) => s.minutes)).toEqual(minutes);
    const release = Date.parse(order.windowStart) + minutes.reduce((a, b) => a + b) * 60_000;
    expect(res.body.fits).toBe(false);
    expect(res.body.late).toMatchObject({
      step: 'cure', stepLabel: 'Set and cure', neededWindowEnd: new Date(release).toISOString(),
      // kept above 40 °F the same joints cure in hours, and the plan fits the 12 hours
      warmer: { band: '40–60 °F', keepAboveF: 40, cureMinutes: heated, earliestRelease: new Date(release - (cure - heated) * 60_000).toISOString(), fits: true },
    });
  });

  it('a cure outside the published table is shown as a refusal naming the supervisor, and the plan cannot be submitted', async () => {
    // 12" at 150 psi: schedule A's 10"–15" band prints only ≤100 psi
    const { order } = await readyOrder('REFUSE', { nominalSize: '12', designPressurePsi: 100 });
    expect(order.windowPlan.refusals).toEqual([{ step: 'cure', reason: expect.stringMatching(/^J1, J2 \(12"\): Pressure 150 psi is above the highest column/), whoMayDecide: 'supervisor' }]);
    expect(order.windowPlan).toMatchObject({ earliestRelease: null, fits: null });
    const res = await plan(order.id);
    expect(res.body.error.details.plan).toEqual([expect.stringMatching(/^Cure: J1, J2 \(12"\): .+ A supervisor may enter an engineering cure time with a reason\. \(a supervisor decides\)$/)]);
  });
});

describe('submitting the plan', () => {
  it('a plan that fits is planned: state, version and audit written, no reason needed', async () => {
    const { order } = await readyOrder('FITS');
    const res = await plan(order.id, { lateReason: 'not needed' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: 'planned', lateReason: null, version: order.version + 1 });
    expect(await WorkOrder.findByPk(order.id)).toMatchObject({ state: 'planned', lateReason: null });
    const [audit] = await auditOf(order.id, 'work-order-planned');
    expect(audit).toMatchObject({ before: { state: 'draft' }, after: { state: 'planned', fits: true, lateReason: null, earliestRelease: res.body.windowPlan.earliestRelease } });
    expect((await plan(order.id)).body.error.message).toBe(`${order.number} is already planned.`);
  });

  it('a plan that does not fit needs a written reason; with it, it is planned and operations and the requester are mailed', async () => {
    const { order } = await readyOrder('LATE', { nominalSize: '6' }, { forecastLowF: 34, forecastHighRh: 50, requestedBy: 'Tomas Lind', ...windowOf('2027-01-11T07:00:00-06:00', 10) });
    const refused = await plan(order.id);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: 'plan_late', details: { lateReason: ['a plan that does not fit its window needs a written reason'] } });
    expect(refused.body.error.message).toMatch(/^The plan does not fit the window: the earliest release is Thu, 14 Jan 2027, \d\d:\d\d GMT-6, after the window's end at Mon, 11 Jan 2027, 17:00 GMT-6 \(set and cure runs past it\)/);
    expect((await WorkOrder.findByPk(order.id))?.state).toBe('draft');

    const reason = 'The spare pump carries the load; operations accepts three days out of service.';
    const res = await plan(order.id, { lateReason: reason });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: 'planned', lateReason: reason });
    expect((await auditOf(order.id, 'work-order-planned'))[0]).toMatchObject({ after: { fits: false, lateReason: reason, lateStep: 'cure' } });

    const [mail, ...more] = await waitFor('the late-plan mail', () => mailMentioning(order.number), (m) => m.length > 0);
    expect(more).toEqual([]);
    expect(mail!.to).toEqual(expect.arrayContaining(['maud.okafor@marrowby.invalid', 'tomas.lind@marrowby.invalid']));
    expect(mail!.to).not.toContain('ines.varga@marrowby.invalid');
    expect(mail!.subject).toMatch(new RegExp(`^${order.number} is planned past its window: release Thu, 14 Jan 2027, .+ window ends Mon, 11 Jan 2027, 17:00 GMT-6$`));
    expect(mail!.text).toContain(reason);
    expect(mail!.text).toContain('Runs past the window: Set and cure');
    expect(mail!.text).toContain(`/work-orders/${order.id}`);
  });

  it('an edit of a planned order sends it back to draft (audited), to be planned again; assigning a fitter does not', async () => {
    const { order } = await readyOrder('REDRAFT');
    const planned = (await plan(order.id)).body;
    const fitter = await users.planner.put(`/api/joint-tasks/${planned.jointTasks[0].id}/fitter`, { personId: (await users.fitter.get('/api/me')).body.id });
    expect(fitter.status).toBe(200);
    expect((await WorkOrder.findByPk(order.id))?.state).toBe('planned');
    const version = (await WorkOrder.findByPk(order.id))!.version;
    const res = await users.planner.json('PATCH', `/api/work-orders/${order.id}`, { version, priority: 'urgent' });
    expect(res.body).toMatchObject({ state: 'draft', priority: 'urgent', plannedAt: null });
    const [audit] = await auditOf(order.id, 'work-order-updated');
    expect(audit).toMatchObject({ before: { state: 'planned', priority: 'soon' }, after: { state: 'draft', priority: 'urgent' } });
    expect((await plan(order.id)).body.state).toBe('planned');
  });
});

describe('overlapping windows', () => {
  it('two orders booked at once on the same line and isolation point are flagged on both and on the schedule; others are not', async () => {
    const p = uniquePrefix('OVER');
    const [line, other] = await makeLines(p, [{}, {}]);
    await makeIsolationPoint(line!, `${p}-HV-1`);
    const a = await plannableOrder(users.planner, [line!], { over: windowOf('2027-06-01T08:00:00Z', 12) });
    const b = await plannableOrder(users.planner, [line!], { over: windowOf('2027-06-01T18:00:00Z', 12) });
    const after = await createOrder(users.planner, [line!], windowOf('2027-06-02T12:00:00Z', 2));
    const elsewhere = await createOrder(users.planner, [other!], windowOf('2027-06-01T09:00:00Z', 4));
    const gone = await createOrder(users.planner, [line!], windowOf('2027-06-01T10:00:00Z', 4));
    await users.planner.post(`/api/work-orders/${gone.id}/cancellation`, { reason: 'booked twice' });

    const flags = async (id: string) => (await users.fitter.get(`/api/work-orders/${id}`)).body.overlaps;
    expect(await flags(a.id)).toEqual([
      { orderId: b.id, number: b.number, state: 'draft', on: 'isolation-point', what: `${p}-HV-1` },
      { orderId: b.id, number: b.number, state: 'draft', on: 'line', what: line!.lineNumber },
    ]);
    expect((await flags(b.id)).map((f: any) => [f.number, f.on])).toEqual([[a.number, 'isolation-point'], [a.number, 'line']]);
    expect(await flags(after.id)).toEqual([]);
    expect(await flags(elsewhere.id)).toEqual([]);

    const res = await users.operations.get(`/api/schedule?from=2027-06-01T00:00:00Z&to=2027-06-03T00:00:00Z&area=${encodeURIComponent(`${p} area`)}`);
    expect(res.status).toBe(200);
    expect(res.body.orders.map((o: any) => [o.number, o.state, o.overlaps.length])).toEqual([
      [a.number, 'draft', 2], [elsewhere.number, 'draft', 0], [b.number, 'draft', 2], [after.number, 'draft', 0],
    ]);
    expect(res.body.orders[0]).toMatchObject({ windowStart: '2027-06-01T08:00:00.000Z', windowEnd: '2027-06-01T20:00:00.000Z', lines: [{ lineNumber: line!.lineNumber }] });
    expect((await users.operations.get('/api/schedule?from=2027-06-01T00:00:00Z&to=2027-09-01T00:00:00Z')).status).toBe(400);
  });
});
