import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { JointTask } from '@server/db/models/joint-task';
import { Line } from '@server/db/models/line';
import { Person } from '@server/db/models/person';
import { Hold, JointStepRecord, Photo } from '@server/db/models/joint-record';
import { lockoutBoard } from '@server/services/lockout/board';
import { WorkOrder } from '@server/db/models/work-order';
import { closeQueues } from '@server/queues/connection';
import { getOrder } from '@server/services/work-orders/order-dto';
import { confirmImport, uploadImport } from '@server/services/line-imports/import-service';
import { PressureTest, Release } from '@server/db/models/release';
import { Lock } from '@server/db/models/lockout';
import { WorkOrderLine } from '@server/db/models/work-order';
import { orderRecordGaps } from '@server/services/record/completeness';
import { WORK_ORDER_STATES } from '@shared/schemas/work-orders';
import { DEMO_ORDERS, DEMO_ORDER_LINES, loadDemoOrders, type DemoOrdersResult } from '../../scripts/demo-orders';
import { demoPlant, toCsv } from '../../scripts/demo-plant';

/**
 * The demo plant's work orders, made by the loader through the services on the demo lines. The
 * test database is shared and kept between runs of one `--serve`: the lines are imported when they
 * are missing, and the orders may already be there from an earlier run, which is the "once" case.
 */
async function importDemoLines(): Promise<void> {
  if ((await Line.count({ where: { lineNumber: { [Op.in]: DEMO_ORDER_LINES } } })) === DEMO_ORDER_LINES.length) return;
  const [person] = await Person.findOrCreate({ where: { issuer: 'linewright', subject: 'system' }, defaults: { issuer: 'linewright', subject: 'system', name: 'Linewright (demo loader)', email: null, lastSignInAt: null } });
  const me = { id: person.id, name: person.name, email: null, roles: [] };
  const { lines, points } = demoPlant();
  const mine = <T extends { line_number: string }>(rows: T[]) => rows.filter((r) => DEMO_ORDER_LINES.includes(r.line_number));
  for (const [filename, rows] of [['demo-lines.csv', mine(lines)], ['demo-points.csv', mine(points)]] as const) {
    const preview = await uploadImport(me, { filename, buffer: Buffer.from(toCsv(rows)) }, { inline: true });
    if (preview.counts.new + preview.counts.changed) await confirmImport(me, preview.id, { inline: true });
  }
}

let first: DemoOrdersResult;
beforeAll(async () => {
  await importDemoLines();
  first = await loadDemoOrders();
}, 60_000);
afterAll(() => closeQueues());

describe('the demo plant\'s work orders', () => {
  it('are all there, once each, in the state each is meant to be in', async () => {
    const orders = await WorkOrder.findAll({ where: { scope: { [Op.in]: DEMO_ORDERS.map((o) => o.scope) } } });
    expect(orders).toHaveLength(DEMO_ORDERS.length);
    for (const spec of DEMO_ORDERS) expect(orders.find((o) => o.scope === spec.scope)?.state, spec.scope).toBe(spec.state);
    expect(new Set(orders.map((o) => o.state))).toEqual(new Set(WORK_ORDER_STATES)); // every state a planner, fitter or operations lead meets
  });

  it('carry their joints and an isolation plan, and the late and cancelled ones their reasons', async () => {
    for (const spec of DEMO_ORDERS) {
      const order = (await WorkOrder.findOne({ where: { scope: spec.scope } }))!;
      expect(await JointTask.count({ where: { workOrderId: order.id } }), spec.scope).toBe(spec.joints.reduce((n, j) => n + j.count, 0));
      expect(await IsolationPlanEntry.count({ where: { workOrderId: order.id } }), spec.scope).toBeGreaterThanOrEqual(2);
      expect(order.lateReason).toBe(spec.lateReason ?? null);
      expect(order.cancelReason).toBe(spec.cancelReason ?? null);
    }
    expect(DEMO_ORDERS.some((o) => o.state === 'planned' && o.lateReason)).toBe(true);
  });

  it('show a new user an overlap: the sample-point draft shares 100-SA-001 and its valves with the coupling repair', async () => {
    const [repair, samplePoint] = DEMO_ORDERS.filter((o) => o.line === '100-SA-001').map((o) => first.orders.find((x) => x.scope === o.scope)!);
    const dto = await getOrder(samplePoint!.id);
    expect(dto.overlaps).toContainEqual(expect.objectContaining({ orderId: repair!.id, on: 'line', what: '100-SA-001' }));
    expect(dto.overlaps).toContainEqual(expect.objectContaining({ orderId: repair!.id, on: 'isolation-point' }));
  });

  it('show a fitter an order under way: their locks on, zero energy verified, the first joint prepared and dry-fitted', async () => {
    const spec = DEMO_ORDERS.find((o) => o.state === 'in-work')!;
    const order = (await WorkOrder.findOne({ where: { scope: spec.scope } }))!;
    const board = await lockoutBoard(order.id, order.createdById);
    expect(board).toMatchObject({ isolated: true, missing: [] });
    expect(board.points.every((p) => p.locks.some((l) => l.person.name === 'Tomas Lind'))).toBe(true);
    const [j1] = await JointTask.findAll({ where: { workOrderId: order.id }, order: [['number', 'ASC']] });
    const steps = await JointStepRecord.findAll({ where: { jointTaskId: j1!.id } });
    expect(steps.map((s) => s.step).sort()).toEqual(['dry-fit', 'prep']);
  });

  it('show operations an order testing (cures run out, locks still on), one released (its line in service) and one closed with its record complete', async () => {
    const of = async (state: string) => (await WorkOrder.findOne({ where: { scope: DEMO_ORDERS.find((o) => o.state === state)!.scope } }))!;
    const testing = await of('testing');
    expect(await Hold.count({ where: { workOrderId: testing.id, status: { [Op.ne]: 'ended' } } })).toBe(0);
    expect((await lockoutBoard(testing.id, testing.createdById)).points.every((p) => p.locks.length > 0)).toBe(true);
    const isolated = await of('isolated');
    expect(await lockoutBoard(isolated.id, isolated.createdById)).toMatchObject({ isolated: true, missing: [] });
    const taskIds = async (orderId: string) => (await JointTask.findAll({ where: { workOrderId: orderId } })).map((j) => j.id);
    expect(await JointStepRecord.count({ where: { jointTaskId: { [Op.in]: await taskIds(isolated.id) } } })).toBe(0);
    for (const state of ['released', 'closed']) {
      const order = await of(state);
      expect(await Release.count({ where: { workOrderId: order.id } }), state).toBe(1);
      const [line] = await WorkOrderLine.findAll({ where: { workOrderId: order.id } });
      expect((await Line.findByPk(line!.lineId))!.status, state).toBe('in-service');
    }
    const closed = await of('closed');
    expect(await orderRecordGaps(closed.id)).toEqual([]);
    expect(await Photo.count({ where: { jointTaskId: { [Op.in]: await taskIds(closed.id) } } })).toBe(2); // depth marks and the finished joint
    // its record reads in the order things happened: steps, then the cure, then locks off, the test and the release
    const lastStep = Math.max(...(await JointStepRecord.findAll({ where: { jointTaskId: { [Op.in]: await taskIds(closed.id) } } })).map((r) => r.recordedAt.getTime()));
    const holds = await Hold.findAll({ where: { workOrderId: closed.id } });
    const cureEnd = Math.max(...holds.map((h) => h.endedAt!.getTime()));
    const locksOff = Math.max(...(await Lock.findAll({ where: { workOrderId: closed.id } })).map((l) => l.removedAt!.getTime()));
    const test = (await PressureTest.findOne({ where: { workOrderId: closed.id } }))!;
    const released = (await Release.findOne({ where: { workOrderId: closed.id } }))!.releasedAt.getTime();
    expect(lastStep).toBeLessThanOrEqual(Math.min(...holds.map((h) => h.startsAt.getTime())) + 1000);
    expect(cureEnd).toBeLessThan(locksOff);
    expect(locksOff).toBeLessThan(test.startedAt.getTime());
    expect(test.endedAt.getTime()).toBeLessThan(released);
    expect(released).toBeLessThan(Date.now() - 24 * 3_600_000); // days ago, as its window was
  });

  it('have their windows in the days after they were loaded', async () => {
    // the moment of loading (an order made "before loading" has its own moments moved back)
    const loadedAt = (await AuditEntry.findOne({ where: { action: 'demo-orders-loaded' } }))!.at.getTime();
    for (const spec of DEMO_ORDERS) {
      const order = (await WorkOrder.findOne({ where: { scope: spec.scope } }))!;
      if (!spec.window) {
        expect(order.windowStart).toBeNull();
        continue;
      }
      if (spec.window.fromLoad) {
        // An order under way: its window is open at the moment of loading; a closed one's has ended.
        expect(order.windowStart!.getTime(), spec.scope).toBeLessThan(loadedAt);
        if (spec.state === 'closed') expect(order.windowEnd!.getTime(), spec.scope).toBeLessThan(loadedAt);
        else expect(order.windowEnd!.getTime(), spec.scope).toBeGreaterThan(loadedAt);
        continue;
      }
      const daysAhead = (order.windowStart!.getTime() - order.createdAt.getTime()) / 86_400_000;
      expect(daysAhead, spec.scope).toBeGreaterThan(0);
      expect(daysAhead, spec.scope).toBeLessThan(8);
    }
  });

  it('are made once: a second load makes none and leaves them as they are', async () => {
    const again = await loadDemoOrders();
    expect(again.loaded).toBe(false);
    expect(again.orders.map((o) => o.id).sort()).toEqual(first.orders.map((o) => o.id).sort());
    expect(await WorkOrder.count({ where: { scope: { [Op.in]: DEMO_ORDERS.map((o) => o.scope) } } })).toBe(DEMO_ORDERS.length);
  });
});
