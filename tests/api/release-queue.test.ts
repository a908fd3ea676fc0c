// The release queue and the line status board: every open order with the same reasons the order's
// own release check gives, ready ones first, and each out-of-service line with the orders holding it
// out — read with a fixed number of queries however many orders are open.
import { afterEach, describe, expect, it } from 'vitest';
import { setClockOffsetForTests } from '@server/clock';
import { WorkOrder } from '@server/db/models/work-order';
import { sequelize } from '@server/db/sequelize';
import { releaseQueue } from '@server/services/release/queue';
import type { ReleaseQueueDto } from '@shared/schemas/release';
import { useTestApp } from '../helpers/app';
import { statementsOf } from '../helpers/statements';
import { isolatedOrder } from '../helpers/lockout';
import { cureEnds, curingOrder as curingOrderOf, removeMyLocks, testBody } from '../helpers/release';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
afterEach(() => setClockOffsetForTests(0));

type Row = ReleaseQueueDto['orders'][number];

/** Ready (tested, locks off), testing (locks on, no test) and curing (locks on, hold running). */
async function ordersInThreeStates() {
  const ready = await curingOrderOf(users);
  const testing = await curingOrderOf(users);
  await cureEnds(testing.order.id); // lifts the holds of both
  await removeMyLocks(users.fitter, ready.order.id);
  expect((await users.operations.tablet(`/api/work-orders/${ready.order.id}/pressure-tests`, await testBody(users.planner, ready.order.id))).status).toBe(201);
  const curing = await curingOrderOf(users); // its hold runs past the moved clock
  const states = await WorkOrder.findAll({ where: { id: [ready.order.id, testing.order.id, curing.order.id] }, attributes: ['id', 'state'] });
  expect(Object.fromEntries(states.map((o) => [o.id, o.state]))).toEqual({ [ready.order.id]: 'ready', [testing.order.id]: 'testing', [curing.order.id]: 'curing' });
  return { ready, testing, curing };
}

describe('the release queue and the line status board', () => {
  it('list ready orders first, each with the reasons its own release check gives, and each line with the orders holding it out', async () => {
    const { ready, testing, curing } = await ordersInThreeStates();
    const mine = [ready, testing, curing].map((m) => m.order.id as string);

    const res = await users.planner.get('/api/release-queue');
    expect(res.status).toBe(200);
    const all: Row[] = res.body.orders;
    const firstNotReady = all.findIndex((o) => !o.ready);
    expect(all.slice(firstNotReady).every((o) => !o.ready)).toBe(true); // ready ones first
    const rows = all.filter((o) => mine.includes(o.id));
    expect(rows.map((o) => o.id)[0]).toBe(ready.order.id);
    const notReady = rows.slice(1);
    const key = (o: Row) => `${o.windowEnd ?? '~'} ${o.number}`;
    expect(notReady.map(key)).toEqual(notReady.map(key).sort()); // then by window end and number

    for (const m of [ready, testing, curing]) {
      const row = rows.find((o) => o.id === m.order.id)!;
      const check = (await users.planner.get(`/api/work-orders/${m.order.id}/release-check`)).body;
      expect(row.blockers).toEqual(check.blockers);
      expect(row.ready).toBe(check.ready);
      expect(row.lines).toEqual(m.lines.map((l) => l.lineNumber));
    }
    const [r, t, c] = [ready, testing, curing].map((m) => rows.find((o) => o.id === m.order.id)!);
    expect(r).toMatchObject({ state: 'ready', ready: true, blockers: [], latestHoldEnd: null });
    expect(t!.blockers.map((b) => b.kind)).toEqual(['state', 'lock', 'lock', 'test']);
    expect(t!.blockers.filter((b) => /^Lock .* \(Tomas Lind\) is still on /.test(b.message))).toHaveLength(2);
    expect(t!.latestHoldEnd).toBeNull();
    const kinds = c!.blockers.map((b) => b.kind);
    expect(kinds.slice(0, 3)).toEqual(['state', 'lock', 'lock']);
    expect(kinds.at(-1)).toBe('test');
    const holds = c!.blockers.filter((b) => b.kind === 'hold'); // the set and the cure hold
    expect(holds.map((b) => b.message)).toContainEqual(expect.stringMatching(/^J1's cure hold runs until \d{4}-\d\d-\d\d \d\d:\d\d UTC\.$/));
    expect(c!.latestHoldEnd).toBe(holds.map((b) => b.until!).sort().at(-1));
    expect(c!.blockers.at(-1)!.message).toBe('No hydrostatic test is recorded.');

    const board = await users.planner.get('/api/line-status');
    expect(board.status).toBe(200);
    for (const [m, row] of [[ready, r], [testing, t], [curing, c]] as const) {
      const line = board.body.lines.find((l: { id: string }) => l.id === m.lines[0]!.id);
      expect(line).toMatchObject({ lineNumber: m.lines[0]!.lineNumber, status: 'locked-out', orders: [row], earliestBack: row!.latestHoldEnd });
    }
  });

  it('the queue is read with the same number of queries however many orders are open', async () => {
    await isolatedOrder(users);
    const before = await statementsOf(releaseQueue);
    await isolatedOrder(users);
    await curingOrderOf(users);
    const after = await statementsOf(releaseQueue);
    expect(after).toBe(before);
    expect(before).toBeLessThanOrEqual(15);
  });

  it('both are kept between reads, and answer anew when anything they read is written or a hold runs out by the clock alone', async () => {
    const { curing } = await ordersInThreeStates();
    const row = async () => ((await users.operations.get('/api/release-queue')).body.orders as Row[]).find((o) => o.id === curing.order.id)!;
    const board = async () => (await users.operations.get('/api/line-status')).body.lines.find((l: { id: string }) => l.id === curing.lines[0]!.id);
    const holds = (r: Row) => r.blockers.filter((b) => b.kind === 'hold');
    const first = await row();
    expect(holds(first).length).toBeGreaterThan(0);
    expect((await board()).orders[0].blockers).toEqual(first.blockers);
    // Asked again with nothing written: the kept answers, without a statement of the app's.
    expect(await statementsOf(async () => { await row(); await board(); })).toBe(0);

    // A write to a table only the release reads (a hold), made outside the app's requests as
    // another process would: the next read has it.
    expect(holds(first).map((b) => b.message)).toContainEqual(expect.stringMatching(/'s set hold runs until/));
    await sequelize.query(`update holds set status = 'void', void_reason = 'joint cut out' where work_order_id = $1 and kind = 'set'`, { bind: [curing.order.id] });
    const voided = await row();
    expect(holds(voided).map((b) => b.message)).not.toContainEqual(expect.stringMatching(/'s set hold/));
    expect(holds(voided).length).toBeGreaterThan(0); // the cure hold still runs
    const [hold] = holds(voided);

    // Past the last hold's end by the clock, with no write at all: the holds no longer stand in the way.
    setClockOffsetForTests(Math.max(...holds(first).map((b) => Date.parse(b.until!))) - Date.now() + 60_000);
    const later = await row();
    expect(holds(later)).toEqual([]);
    expect(later.blockers.map((b) => b.message)).not.toContain(hold!.message);
    expect(holds({ ...(await board()).orders[0] })).toEqual([]);
  });
});
