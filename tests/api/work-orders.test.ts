import { describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';
import { WorkOrder, WorkOrderLine } from '@server/db/models/work-order';
import { workOrderListResponseSchema, workOrderSchema } from '@shared/schemas/work-orders';
import { useTestApp } from '../helpers/app';
import { makeIsolationPoint, makeLines, uniquePrefix } from '../helpers/line-rows';
import { createOrder, orderBody, plannableOrder, plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'supervisor', 'fitter', 'operations'], before: plantForWorkOrders });
const me = async (role: 'planner' | 'supervisor') => (await users[role].get('/api/me')).body.id as string;
const patch = (id: string, body: unknown) => users.planner.json('PATCH', `/api/work-orders/${id}`, body);
const auditOf = (orderId: string, action: string) => AuditEntry.findAll({ where: { entity: 'work-order', entityId: orderId, action }, order: [['id', 'ASC']] });

describe('creating a work order', () => {
  it('a planner creates an order on two lines: 201, a WO-<year>-<4 digits> number, draft; the rows and the audit entry are written', async () => {
    const lines = await makeLines(uniquePrefix('NEW'), [{}, { nominalSize: '3' }]);
    const res = await users.planner.post('/api/work-orders', orderBody(lines, { kind: 'tie-in', priority: 'urgent', requestedBy: 'Maud Okafor' }));
    expect(res.status).toBe(201);
    const order = workOrderSchema.parse(res.body);
    expect(order).toMatchObject({ kind: 'tie-in', priority: 'urgent', state: 'draft', version: 1, requestedBy: 'Maud Okafor', windowStart: '2027-03-01T12:00:00.000Z' });
    expect(order.number).toMatch(/^WO-2\d{3}-\d{4}$/);
    expect(order.lines.map((l) => l.lineNumber)).toEqual(lines.map((l) => l.lineNumber));
    expect(await WorkOrder.findByPk(order.id)).toMatchObject({ number: order.number, state: 'draft', createdById: await me('planner'), forecastLowF: 70 });
    expect(await WorkOrderLine.count({ where: { workOrderId: order.id } })).toBe(2);
    const [audit, ...more] = await auditOf(order.id, 'work-order-created');
    expect(more).toEqual([]);
    expect(audit).toMatchObject({ actorId: await me('planner'), after: { number: order.number, kind: 'tie-in', lines: lines.map((l) => l.lineNumber) } });
    expect(order.history).toEqual([expect.objectContaining({ action: 'work-order-created', actor: { id: await me('planner'), name: 'Ines Varga' } })]);
  });

  it('two orders take consecutive numbers from the year counter of the plant time zone', async () => {
    const lines = await makeLines(uniquePrefix('NUM'), [{}]);
    const [a, b] = [await createOrder(users.planner, lines), await createOrder(users.supervisor, lines)];
    const year = new Intl.DateTimeFormat('en', { timeZone: 'America/Chicago', year: 'numeric' }).format(new Date());
    expect(a.number.startsWith(`WO-${year}-`)).toBe(true);
    expect(Number(b.number.slice(-4))).toBe(Number(a.number.slice(-4)) + 1);
    expect(b.createdBy.name).toBe('Rafe Adeyemi');
  });

  it('a fitter or operations may not write an order: 403 naming who may, and nothing is written', async () => {
    const lines = await makeLines(uniquePrefix('DENY'), [{}]);
    for (const role of ['fitter', 'operations'] as const) {
      const res = await users[role].post('/api/work-orders', orderBody(lines));
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/^Only a maintenance planner or supervisor may do this/);
    }
    expect(await WorkOrderLine.count({ where: { lineId: lines[0]!.id } })).toBe(0);
  });

  it('a line that is not in the register, half a window or a window ending before it starts is a 400 on the field', async () => {
    const lines = await makeLines(uniquePrefix('BAD'), [{}]);
    const ghost = await users.planner.post('/api/work-orders', orderBody(lines, { lineIds: ['4c3bd7e5-3a4e-4a2e-9e0c-4f8d8f1b2a11'] }));
    expect(ghost.status).toBe(400);
    expect(ghost.body.error.details.lineIds[0]).toMatch(/not in the register/);
    const half = await users.planner.post('/api/work-orders', orderBody(lines, { windowEnd: null }));
    expect(half.body.error.details.windowEnd).toBeDefined();
    const backwards = await users.planner.post('/api/work-orders', orderBody(lines, { windowStart: '2027-03-02T00:00:00Z', windowEnd: '2027-03-01T00:00:00Z' }));
    expect(backwards.body.error.details.windowEnd).toEqual(['the window must end after it starts']);
    expect(await WorkOrderLine.count({ where: { lineId: lines[0]!.id } })).toBe(0);
  });
});

describe('editing a work order', () => {
  it('an edit of a draft changes only what was sent, raises the version and is audited with before and after', async () => {
    const lines = await makeLines(uniquePrefix('EDIT'), [{}, {}]);
    const order = await createOrder(users.planner, [lines[0]!]);
    const res = await patch(order.id, { version: 1, priority: 'emergency', scope: order.scope, forecastLowF: 45, lineIds: lines.map((l) => l.id) });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ priority: 'emergency', forecastLowF: 45, version: 2, state: 'draft' });
    expect(res.body.lines).toHaveLength(2);
    expect(await WorkOrder.findByPk(order.id)).toMatchObject({ priority: 'emergency', forecastLowF: 45, version: 2 });
    const [audit] = await auditOf(order.id, 'work-order-updated');
    expect(audit!.before).toEqual({ priority: 'soon', forecastLowF: 70, lines: [lines[0]!.lineNumber] });
    expect(audit!.after).toEqual({ priority: 'emergency', forecastLowF: 45, lines: lines.map((l) => l.lineNumber) });
  });

  it('an edit made from an older version is refused with who changed the order and when, and the newer change stands', async () => {
    const lines = await makeLines(uniquePrefix('STALE'), [{}]);
    const order = await createOrder(users.planner, lines);
    expect((await users.supervisor.json('PATCH', `/api/work-orders/${order.id}`, { version: 1, priority: 'urgent' })).status).toBe(200);
    const late = await patch(order.id, { version: 1, priority: 'routine' });
    expect(late.status).toBe(409);
    expect(late.body.error).toMatchObject({ code: 'stale_order', message: expect.stringMatching(/^Rafe Adeyemi changed WO-.+ at \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC, after you opened it/) });
    expect((await WorkOrder.findByPk(order.id))?.priority).toBe('urgent');
  });

  it('a line with joint tasks on it cannot leave the order', async () => {
    const lines = await makeLines(uniquePrefix('LEAVE'), [{}, {}]);
    const order = await createOrder(users.planner, lines);
    await users.planner.post(`/api/work-orders/${order.id}/joint-tasks`, { lineId: lines[1]!.id, fittingKind: 'elbow-90', count: 2 });
    const res = await patch(order.id, { version: 2, lineIds: [lines[0]!.id] });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(`Line ${lines[1]!.lineNumber} still has joint tasks J1, J2 on this order; remove them before taking the line off the order.`);
    expect(await WorkOrderLine.count({ where: { workOrderId: order.id } })).toBe(2);
  });

  it('the test pressure may be raised within the cap; below the minimum or above the cap is a 400 on the field and nothing changes', async () => {
    // 2" Sch 80 PVC at 73 °F is rated 400 psi (ASTM D1785); design 100 psi → minimum 150 psi; the plant caps at the rating
    const lines = await makeLines(uniquePrefix('TEST'), [{ designPressurePsi: 100 }]);
    const order = await createOrder(users.planner, lines);
    expect(order.testPressure).toMatchObject({ ok: true, minimumPsi: 150, capPsi: 400, testPsi: 150, raised: false });
    const low = await patch(order.id, { version: 1, testPressurePsi: 149 });
    expect(low.status).toBe(400);
    expect(low.body.error.details.testPressurePsi[0]).toBe('The test pressure of 149 psi is below the minimum of 150 psi (1.5 × the highest design pressure); it may be raised, never lowered.');
    const high = await patch(order.id, { version: 1, testPressurePsi: 401 });
    expect(high.body.error.details.testPressurePsi[0]).toBe('The test pressure of 401 psi is above the cap of 400 psi set by the weakest component.');
    const weakValve = await patch(order.id, { version: 1, componentRatingPsi: 200, testPressurePsi: 250 });
    expect(weakValve.body.error.details.testPressurePsi[0]).toMatch(/above the cap of 200 psi/);
    expect(await WorkOrder.findByPk(order.id)).toMatchObject({ testPressurePsi: null, componentRatingPsi: null, version: 1 });
    const raised = await patch(order.id, { version: 1, testPressurePsi: 200 });
    expect(raised.status).toBe(200);
    expect(raised.body.testPressure).toMatchObject({ ok: true, testPsi: 200, raised: true, minimumPsi: 150 });
  });
});

describe('cancelling a work order', () => {
  it('a draft is cancelled with a reason: state, reason and audit written; editing, planning or cancelling it again is 409', async () => {
    const lines = await makeLines(uniquePrefix('CANCEL'), [{}]);
    const order = await createOrder(users.planner, lines);
    expect((await users.planner.post(`/api/work-orders/${order.id}/cancellation`, {})).body.error.details.reason).toBeDefined();
    const res = await users.planner.post(`/api/work-orders/${order.id}/cancellation`, { reason: 'Operations moved the shutdown to spring.' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: 'cancelled', cancelReason: 'Operations moved the shutdown to spring.', version: 2 });
    expect(await WorkOrder.findByPk(order.id)).toMatchObject({ state: 'cancelled', cancelReason: 'Operations moved the shutdown to spring.' });
    const [audit] = await auditOf(order.id, 'work-order-cancelled');
    expect(audit).toMatchObject({ actorId: await me('planner'), before: { state: 'draft' }, after: { state: 'cancelled', reason: 'Operations moved the shutdown to spring.' } });

    const edit = await patch(order.id, { version: 2, priority: 'urgent' });
    expect(edit.status).toBe(409);
    expect(edit.body.error.message).toMatch(new RegExp(`^${order.number} was cancelled at .+ \\("Operations moved the shutdown to spring\\."\\); a cancelled order cannot be edited\\.$`));
    const joints = await users.planner.post(`/api/work-orders/${order.id}/joint-tasks`, { lineId: lines[0]!.id, fittingKind: 'cap' });
    expect(joints.status).toBe(409);
    const plan = await users.planner.post(`/api/work-orders/${order.id}/plan`, {});
    expect(plan.body.error.message).toBe(`${order.number} is cancelled; nothing more happens to a cancelled order.`);
    expect((await users.planner.post(`/api/work-orders/${order.id}/cancellation`, { reason: 'again' })).status).toBe(409);
    expect(await WorkOrder.findByPk(order.id)).toMatchObject({ priority: 'soon', version: 2 });
  });

  it('a planned order may be cancelled by a supervisor; a fitter or operations may not cancel', async () => {
    const p = uniquePrefix('CANCEL2');
    const lines = await makeLines(p, [{}]);
    await makeIsolationPoint(lines[0]!, `${p}-HV1`);
    const order = await plannableOrder(users.planner, lines);
    expect((await users.planner.post(`/api/work-orders/${order.id}/plan`, {})).body.state).toBe('planned');
    for (const role of ['fitter', 'operations'] as const) {
      expect((await users[role].post(`/api/work-orders/${order.id}/cancellation`, { reason: 'no' })).status).toBe(403);
    }
    const res = await users.supervisor.post(`/api/work-orders/${order.id}/cancellation`, { reason: 'Line to be replaced in full next year.' });
    expect(res.body).toMatchObject({ state: 'cancelled' });
    expect((await auditOf(order.id, 'work-order-cancelled'))[0]).toMatchObject({ before: { state: 'planned' }, actorId: await me('supervisor') });
  });
});

describe('reading work orders', () => {
  it('an order that does not exist is a 404; every role reads an order', async () => {
    expect((await users.fitter.get('/api/work-orders/4c3bd7e5-3a4e-4a2e-9e0c-4f8d8f1b2a11')).status).toBe(404);
    const order = await createOrder(users.planner, await makeLines(uniquePrefix('READ'), [{}]));
    for (const role of ['fitter', 'operations'] as const) expect((await users[role].get(`/api/work-orders/${order.id}`)).status).toBe(200);
  });

  it('the list pages, sorts and filters by state, area, line, priority, fitter, window and number on the server', async () => {
    const p = uniquePrefix('LIST');
    const lines = await makeLines(p, [{}, {}, { area: `${p} east` }]);
    const a = await createOrder(users.planner, [lines[0]!], { priority: 'routine', windowStart: '2027-05-03T08:00:00Z', windowEnd: '2027-05-03T20:00:00Z' });
    const b = await createOrder(users.planner, [lines[1]!], { priority: 'emergency', windowStart: '2027-05-10T08:00:00Z', windowEnd: '2027-05-10T20:00:00Z' });
    const c = await createOrder(users.planner, [lines[2]!], { priority: 'soon', windowStart: null, windowEnd: null });
    await users.planner.post(`/api/work-orders/${c.id}/cancellation`, { reason: 'duplicate' });
    const fitterId = (await users.fitter.get('/api/me')).body.id;
    const [task] = (await users.planner.post(`/api/work-orders/${b.id}/joint-tasks`, { lineId: lines[1]!.id, fittingKind: 'union' })).body;
    await users.planner.put(`/api/joint-tasks/${task.id}/fitter`, { personId: fitterId });

    const list = async (q: string) => {
      const res = await users.fitter.get(`/api/work-orders?area=${encodeURIComponent(`${p} area`)}&area=${encodeURIComponent(`${p} east`)}&${q}`);
      expect(res.status, q).toBe(200);
      return workOrderListResponseSchema.parse(res.body);
    };
    const numbers = (r: { rows: { number: string }[] }) => r.rows.map((x) => x.number);
    expect(numbers(await list('sort=priority&dir=desc'))).toEqual([b.number, c.number, a.number]);
    expect(numbers(await list('sort=number&dir=asc&pageSize=2&page=2'))).toEqual([c.number]);
    expect((await list('pageSize=2')).total).toBe(3);
    expect(numbers(await list('state=cancelled'))).toEqual([c.number]);
    expect(numbers(await list(`line=${lines[0]!.lineNumber}`))).toEqual([a.number]);
    expect(numbers(await list('priority=routine&priority=emergency&sort=number&dir=asc'))).toEqual([a.number, b.number]);
    expect(numbers(await list(`fitter=${fitterId}`))).toEqual([b.number]);
    expect(numbers(await list('windowFrom=2027-05-09T00:00:00Z&windowTo=2027-05-11T00:00:00Z'))).toEqual([b.number]);
    expect(numbers(await list(`search=${a.number.slice(-4)}`))).toEqual([a.number]);
    const row = (await list(`line=${lines[1]!.lineNumber}`)).rows[0]!;
    expect(row).toMatchObject({ jointCount: 1, lines: [{ lineNumber: lines[1]!.lineNumber, area: `${p} area` }], windowStart: '2027-05-10T08:00:00.000Z' });
    expect((await users.fitter.get('/api/work-orders?state=nearly')).status).toBe(400);
    expect(await WorkOrder.count({ where: { number: { [Op.in]: [a.number, b.number, c.number] } } })).toBe(3);
  });

  it('the list total follows a new order, a state change, a fitter or an area change at once, even one written outside this process', async () => {
    const p = uniquePrefix('TOTAL');
    const lines = await makeLines(p, [{}, {}]);
    const total = async (q: string) => {
      const res = await users.planner.get(`/api/work-orders?area=${encodeURIComponent(`${p} area`)}&${q}`);
      expect(res.status, q).toBe(200);
      return workOrderListResponseSchema.parse(res.body).total;
    };
    const a = await createOrder(users.planner, [lines[0]!]);
    expect(await total('state=draft')).toBe(1);
    expect(await total('state=draft')).toBe(1); // asked twice: the second answer may be the kept count
    await createOrder(users.planner, [lines[1]!]);
    expect(await total('state=draft')).toBe(2);
    // Another API process or the worker writes through its own connection; so do these updates.
    await WorkOrder.update({ state: 'planned' }, { where: { id: a.id } });
    expect(await total('state=draft')).toBe(1);
    expect(await total('state=planned')).toBe(1);
    await sequelize.query('update lines set area = $2 where id = $1', { bind: [lines[1]!.id, `${p} moved`] });
    expect(await total('state=draft')).toBe(0);
    const fitterId = (await users.fitter.get('/api/me')).body.id as string;
    expect(await total(`fitter=${fitterId}`)).toBe(0);
    const [task] = (await users.planner.post(`/api/work-orders/${a.id}/joint-tasks`, { lineId: lines[0]!.id, fittingKind: 'union' })).body;
    await users.planner.put(`/api/joint-tasks/${task.id}/fitter`, { personId: fitterId });
    expect(await total(`fitter=${fitterId}`)).toBe(1);
  });
});
