// Joint tasks, the isolation plan, and the materials and test pressure the engine gives an order.
import { describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { IsolationPoint } from '@server/db/models/isolation-point';
import { JointTask } from '@server/db/models/joint-task';
import { applicatorSize, cementBody, cementQuantities, crewAndTools } from '@shared/trade';
import { useTestApp } from '../helpers/app';
import { makeIsolationPoint, makeLines, uniquePrefix } from '../helpers/line-rows';
import { createOrder, plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
const idOf = async (role: 'planner' | 'fitter') => (await users[role].get('/api/me')).body.id as string;
const addJoints = (orderId: string, body: unknown) => users.planner.post(`/api/work-orders/${orderId}/joint-tasks`, body);
const auditOf = (orderId: string, action: string) => AuditEntry.findAll({ where: { entity: 'work-order', entityId: orderId, action }, order: [['id', 'ASC']] });

describe('joint tasks', () => {
  it('adding joints makes one task each, numbered J1, J2 … within the order, at the line size or a tee branch size; rows and audit written', async () => {
    const lines = await makeLines(uniquePrefix('JT'), [{ nominalSize: '4' }]);
    const order = await createOrder(users.planner, lines);
    const couplings = await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'coupling', count: 3 });
    expect(couplings.status).toBe(201);
    expect(couplings.body.map((j: any) => [j.label, j.nominalSize, j.jointSize])).toEqual([['J1', '4', '4'], ['J2', '4', '4'], ['J3', '4', '4']]);
    const branch = await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'tee', reducingSize: '1-1/2' });
    expect(branch.body).toEqual([expect.objectContaining({ label: 'J4', fittingKind: 'tee', nominalSize: '4', reducingSize: '1-1/2', jointSize: '1-1/2', fitter: null })]);
    expect(await JointTask.count({ where: { workOrderId: order.id } })).toBe(4);
    const audits = await auditOf(order.id, 'joint-tasks-added');
    expect(audits.map((a) => a.after)).toEqual([
      { jointTasks: ['J1', 'J2', 'J3'], line: lines[0]!.lineNumber, fittingKind: 'coupling', size: '4', reducingSize: null },
      { jointTasks: ['J4'], line: lines[0]!.lineNumber, fittingKind: 'tee', size: '4', reducingSize: '1-1/2' },
    ]);
  });

  it('a removed task leaves its number unused: after J2 goes, the next is J4', async () => {
    const lines = await makeLines(uniquePrefix('JDEL'), [{}]);
    const order = await createOrder(users.planner, lines);
    const [, j2] = (await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'elbow-45', count: 3 })).body;
    expect((await users.fitter.del(`/api/joint-tasks/${j2.id}`)).status).toBe(403);
    expect((await users.planner.del(`/api/joint-tasks/${j2.id}`)).status).toBe(204);
    expect(await JointTask.findByPk(j2.id)).toBeNull();
    expect((await auditOf(order.id, 'joint-task-removed'))[0]!.before).toEqual({ jointTask: 'J2', line: lines[0]!.lineNumber, fittingKind: 'elbow-45', size: '2' });
    const [next] = (await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'cap' })).body;
    expect(next.label).toBe('J4');
    expect((await users.planner.get(`/api/work-orders/${order.id}`)).body.jointTasks.map((j: any) => j.label)).toEqual(['J1', 'J3', 'J4']);
  });

  it('a reducing size on a coupling, one not smaller than the line, or a line not on the order is a 400 and adds nothing', async () => {
    const lines = await makeLines(uniquePrefix('JBAD'), [{ nominalSize: '2' }, {}]);
    const order = await createOrder(users.planner, [lines[0]!]);
    const coupling = await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'coupling', reducingSize: '1' });
    expect(coupling.body.error.details.reducingSize).toEqual(['only a tee or a reducing bushing has a reducing size']);
    const bigger = await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'reducing-bushing', reducingSize: '3' });
    expect(bigger.body.error.details.reducingSize).toEqual(['must be smaller than 2"']);
    const elsewhere = await addJoints(order.id, { lineId: lines[1]!.id, fittingKind: 'coupling' });
    expect(elsewhere.body.error.details.lineId).toEqual(['not a line of this order']);
    expect(await JointTask.count({ where: { workOrderId: order.id } })).toBe(0);
  });

  it('a task is assigned to a person holding the fitter role (audited), never to someone else, and may be taken back', async () => {
    const lines = await makeLines(uniquePrefix('JFIT'), [{}]);
    const order = await createOrder(users.planner, lines);
    const [task] = (await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'union' })).body;
    const planner = await users.planner.put(`/api/joint-tasks/${task.id}/fitter`, { personId: await idOf('planner') });
    expect(planner.status).toBe(400);
    expect(planner.body.error.message).toBe('Ines Varga does not hold the pipefitter role, so cannot be given a joint to make.');
    const res = await users.planner.put(`/api/joint-tasks/${task.id}/fitter`, { personId: await idOf('fitter') });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ label: 'J1', fitter: { id: await idOf('fitter'), name: 'Tomas Lind' } });
    expect((await JointTask.findByPk(task.id))?.fitterId).toBe(await idOf('fitter'));
    expect((await auditOf(order.id, 'joint-task-fitter-set'))[0]).toMatchObject({ before: { jointTask: 'J1', fitter: null }, after: { jointTask: 'J1', fitter: 'Tomas Lind' } });
    expect((await users.planner.put(`/api/joint-tasks/${task.id}/fitter`, { personId: null })).body.fitter).toBeNull();
  });
});

describe('the isolation plan', () => {
  it("is pre-filled from the register's points of the order's lines, each with the position it must be in", async () => {
    const p = uniquePrefix('ISO');
    const [line, other] = await makeLines(p, [{}, {}]);
    await makeIsolationPoint(line!, `${p}-HV-2`);
    await makeIsolationPoint(line!, `${p}-BL-1`, 'blind');
    await makeIsolationPoint(line!, `${p}-DC-1`, 'disconnect');
    await makeIsolationPoint(other!, `${p}-HV-9`);
    const order = await createOrder(users.planner, [line!]);
    const res = await users.fitter.get(`/api/work-orders/${order.id}/isolation-plan`);
    expect(res.status).toBe(200);
    expect(res.body.entries).toEqual([]);
    expect(res.body.suggested.map((s: any) => [s.tag, s.kind, s.requiredPosition, s.inPlan])).toEqual([
      [`${p}-BL-1`, 'blind', 'installed', false],
      [`${p}-DC-1`, 'disconnect', 'disconnected', false],
      [`${p}-HV-2`, 'valve', 'closed', false],
    ]);
  });

  it('a PUT replaces the plan with register points, a new valve that joins the register (audited) and a vent point', async () => {
    const p = uniquePrefix('ISOSET');
    const [line] = await makeLines(p, [{}]);
    const hv = await makeIsolationPoint(line!, `${p}-HV-1`);
    const order = await createOrder(users.planner, [line!]);
    const entries = [
      { isolationPointId: hv.id },
      { lineId: line!.id, tag: `${p}-XV-7`, kind: 'valve', notes: 'Found on the walk-down, not on the drawing.' },
      { lineId: line!.id, tag: `${p}-VT-1`, kind: 'vent' },
    ];
    const res = await users.planner.put(`/api/work-orders/${order.id}/isolation-plan`, { entries });
    expect(res.status).toBe(200);
    expect(res.body.entries.map((e: any) => [e.tag, e.kind, e.requiredPosition, e.isolationPointId === null])).toEqual([
      [`${p}-HV-1`, 'valve', 'closed', false],
      [`${p}-XV-7`, 'valve', 'closed', false],
      [`${p}-VT-1`, 'vent', 'open', true],
    ]);
    const joined = await IsolationPoint.findOne({ where: { tag: `${p}-XV-7` } });
    expect(joined).toMatchObject({ lineId: line!.id, kind: 'valve', normalPosition: 'open', notes: 'Found on the walk-down, not on the drawing.' });
    const added = await AuditEntry.findOne({ where: { action: 'isolation-point-added', entityId: joined!.id } });
    expect(added).toMatchObject({ entity: 'isolation-point', actorId: await idOf('planner'), after: { tag: `${p}-XV-7`, line: line!.lineNumber, workOrder: order.number } });
    expect(await IsolationPlanEntry.count({ where: { workOrderId: order.id } })).toBe(3);
    expect((await auditOf(order.id, 'isolation-plan-set'))[0]).toMatchObject({
      before: { isolationPlan: [] }, after: { isolationPlan: [`${p}-HV-1 (valve: closed)`, `${p}-XV-7 (valve: closed)`, `${p}-VT-1 (vent: open)`] },
    });
    expect(res.body.suggested.find((s: any) => s.tag === `${p}-XV-7`)).toMatchObject({ inPlan: true });
    // a second PUT replaces it
    const again = await users.planner.put(`/api/work-orders/${order.id}/isolation-plan`, { entries: [{ isolationPointId: hv.id }] });
    expect(again.body.entries).toHaveLength(1);
    expect(await IsolationPlanEntry.count({ where: { workOrderId: order.id } })).toBe(1);
  });

  it("a point on another line is a 400, a new tag the register has on another line is a 409, and the plan stays as it was", async () => {
    const p = uniquePrefix('ISOBAD');
    const [line, other] = await makeLines(p, [{}, {}]);
    const elsewhere = await makeIsolationPoint(other!, `${p}-HV-9`);
    const order = await createOrder(users.planner, [line!]);
    const foreign = await users.planner.put(`/api/work-orders/${order.id}/isolation-plan`, { entries: [{ isolationPointId: elsewhere.id }] });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.message).toBe(`${p}-HV-9 is on a line that is not on this order.`);
    const taken = await users.planner.put(`/api/work-orders/${order.id}/isolation-plan`, { entries: [{ lineId: line!.id, tag: `${p}-HV-9`, kind: 'valve' }] });
    expect(taken.status).toBe(409);
    expect(await IsolationPlanEntry.count({ where: { workOrderId: order.id } })).toBe(0);
    expect((await users.operations.put(`/api/work-orders/${order.id}/isolation-plan`, { entries: [] })).status).toBe(403);
  });
});

describe('materials and test pressure from the engine', () => {
  it("the cement for the material and the largest joint's body, quantities in containers, applicators and crew are the engine's", async () => {
    const lines = await makeLines(uniquePrefix('MAT'), [{ nominalSize: '4' }]);
    const order = await createOrder(users.planner, lines);
    await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'coupling', count: 3 });
    await addJoints(order.id, { lineId: lines[0]!.id, fittingKind: 'tee', reducingSize: '2', count: 2 });
    const { materials } = (await users.planner.get(`/api/work-orders/${order.id}`)).body;
    const q = cementQuantities([{ nominalSize: '4', count: 3 }, { nominalSize: '2', count: 2 }]);
    if (!q.ok) throw new Error(q.reason);
    const body = cementBody('4');
    const crew = crewAndTools('4');
    expect(materials).toMatchObject({
      ok: true, problems: [], material: 'PVC',
      cement: { standard: 'ASTM D2564', body: body.ok ? body.body : null, primer: 'ASTM F656' },
      quantities: { cementQuarts: q.cementQuarts, primerQuarts: q.primerQuarts, cementContainers: q.cementContainers, primerContainers: q.primerContainers },
      crew: { size: '4', crew: crew.ok ? crew.crew : null, mechanicalJoiningDevice: false },
    });
    expect(materials.applicators.map((a: any) => [a.size, a.widthIn])).toEqual(['2', '4'].map((s) => {
      const a = applicatorSize(s);
      return [s, a.ok ? a.widthIn : null];
    }));
  });

  it('an order over a PVC and an ABS line is refused by the cement check, and so is its test pressure (no ABS rating)', async () => {
    const lines = await makeLines(uniquePrefix('MIX'), [{ material: 'PVC' }, { material: 'ABS' }]);
    const order = await createOrder(users.planner, lines);
    expect(order.materials.ok).toBe(false);
    expect(order.materials.problems).toContain(`Line ${lines[1]!.lineNumber} (ABS): ASTM D2564 is the cement for PVC, not ABS pipe; use ASTM D2235.`);
    expect(order.testPressure).toMatchObject({ ok: false, problems: [expect.stringMatching(/No pressure rating for "ABS"/)] });
  });

  it('the test pressure is 1.5 × the highest design pressure, capped by the weakest line at its design temperature', async () => {
    // 2" Sch 80 PVC: 400 psi at 73 °F; at 100 °F × 0.62 = 248 psi (ASTM D1785 with the maker's de-rating)
    const lines = await makeLines(uniquePrefix('TP'), [{ designPressurePsi: 120 }, { designPressurePsi: 80, designTemperatureF: 100 }]);
    const order = await createOrder(users.planner, lines);
    expect(order.testPressure).toMatchObject({
      ok: true, required: true, minimumPsi: 180, capPsi: 248, testPsi: 180, highestDesign: { lineNumber: lines[0]!.lineNumber, psi: 120 },
      weakest: { psi: 248, what: expect.stringContaining(lines[1]!.lineNumber) }, holdMinutes: 10,
    });
  });
});
