// The whole way through one order as its people would go: locks on, zero energy verified, every
// step of each joint recorded on the tablet, and the order curing with the engine's holds.
import { describe, expect, it } from 'vitest';
import { Line } from '@server/db/models/line';
import { WorkOrder } from '@server/db/models/work-order';
import { cureSchedule } from '@shared/trade';
import { useTestApp } from '../helpers/app';
import { isolatedOrder, recordStep, recordStepsThrough } from '../helpers/lockout';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });

describe('an order from lockout to curing', () => {
  it('isolates, moves to in work at the first step and to curing at the last assembly, with holds from the engine', async () => {
    const { order, jointIds, board, lines } = await isolatedOrder(users, { joints: 2 });
    expect(board).toMatchObject({ isolated: true, missing: [], state: 'isolated' });
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('isolated');
    expect((await Line.findByPk(lines[0]!.id))!.status).toBe('locked-out');

    await recordStepsThrough(users.fitter, jointIds[0]!, 'prep');
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('in-work');
    for (const step of ['dry-fit', 'depth-marks', 'primer', 'cement', 'assembly', 'wipe'] as const) {
      expect((await recordStep(users.fitter, jointIds[0]!, step)).status, step).toBe(201);
    }
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('in-work'); // J2 is not assembled yet
    await recordStepsThrough(users.fitter, jointIds[1]!, 'assembly');
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('curing');

    const shift = (await users.fitter.get('/api/shift')).body;
    const mine = shift.orders.find((o: { id: string }) => o.id === order.id);
    expect(mine).toMatchObject({ isolated: true, myLockOn: true });
  });

  it('assembly creates set and cure holds at the lower temperature and the test pressure', async () => {
    // Forecast 45 °F is colder than the 70 °F recorded at the cement step: the holds count at 45 °F.
    const { order, jointIds } = await isolatedOrder(users, { joints: 1, over: { forecastLowF: 45, forecastHighRh: 40 } });
    const done = await recordStepsThrough(users.fitter, jointIds[0]!, 'assembly');
    expect(done.holds).toHaveLength(2);
    const o = (await users.planner.get(`/api/work-orders/${order.id}`)).body;
    const testPsi = o.testPressure.testPsi as number;
    const engine = cureSchedule({ material: 'PVC', nominalSize: '2', temperatureF: 45, relativeHumidity: 50, pressurePsi: testPsi, schedule: 'A' });
    if (!engine.ok) throw new Error(engine.reason);
    const cure = done.holds.find((h: { kind: string }) => h.kind === 'cure');
    const set = done.holds.find((h: { kind: string }) => h.kind === 'set');
    expect(cure).toMatchObject({ status: 'running', temperatureF: 45, relativeHumidity: 50, pressurePsi: testPsi, schedule: 'A' });
    expect(Date.parse(cure.endsAt) - Date.parse(cure.startsAt)).toBe(engine.cureMinutes * 60_000);
    expect(Date.parse(set.endsAt) - Date.parse(set.startsAt)).toBe(engine.setMinutes * 60_000);
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('curing');
    // The order's page shows each joint's progress and the holds.
    const detail = (await users.planner.get(`/api/work-orders/${order.id}`)).body;
    expect(detail.jointTasks.map((j: { stepsDone: number }) => j.stepsDone)).toEqual([6]); // every step but the wipe
    expect(detail.holds.map((h: { kind: string; status: string }) => `${h.kind} ${h.status}`).sort()).toEqual(['cure running', 'set running']);
  });
});
