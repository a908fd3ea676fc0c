// Holds that enforce themselves: the delayed job lifts a hold at its end by the database and the
// clock, a flushed Redis loses nothing because the sweep reads PostgreSQL, lifting twice changes
// nothing, and the order moves from curing to testing when its last cure hold ends, with mail.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { setClockOffsetForTests } from '@server/clock';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Hold } from '@server/db/models/joint-record';
import { WorkOrder } from '@server/db/models/work-order';
import { closeQueues, redis } from '@server/queues/connection';
import { holdJobId, holdsQueue, scheduleHoldLift } from '@server/queues/holds';
import { liftHold } from '@server/services/holds/lift';
import { watchWindows } from '@server/services/holds/watches';
import { startWorkers } from '../../worker/workers';
import { useTestApp } from '../helpers/app';
import { waitFor } from '../helpers/import-csv';
import { isolatedOrder, recordStepsThrough } from '../helpers/lockout';
import { mailMentioning } from '../helpers/mail';
import { plantForWorkOrders, windowOf } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
let workers: ReturnType<typeof startWorkers> | null = null;
beforeAll(() => void (workers = startWorkers({ sweepWatchMs: 200 })));
afterEach(() => setClockOffsetForTests(0));
afterAll(async () => {
  await workers?.close();
  await closeQueues();
});

/** An order curing: one joint assembled (its set and cure holds running). */
async function curingOrder() {
  const { order, jointIds } = await isolatedOrder(users, { joints: 1 });
  await recordStepsThrough(users.fitter, jointIds[0]!, 'assembly');
  const holds = await Hold.findAll({ where: { jointTaskId: jointIds[0] } });
  return { order, jointId: jointIds[0]!, set: holds.find((h) => h.kind === 'set')!, cure: holds.find((h) => h.kind === 'cure')! };
}

/** As a temperature log or an engineering entry would move it: the hold now ends `ms` from the clock's now. */
async function endIn(hold: Hold, ms: number) {
  await hold.update({ endsAt: new Date(Date.now() + ms) });
  await scheduleHoldLift(hold.id, ms);
}

describe('lifting holds', () => {
  it('assembly queues a delayed job per hold, at its end', async () => {
    const { set, cure } = await curingOrder();
    for (const h of [set, cure]) {
      const job = await holdsQueue().getJob(holdJobId(h.id));
      expect(job, h.kind).toBeTruthy();
      expect(Math.abs(job!.timestamp + job!.delay - h.endsAt!.getTime())).toBeLessThan(2000);
    }
  });

  it('the worker lifts a hold at its end, within a second, and the last cure hold moves the order to testing with one mail to operations', async () => {
    const { order, set, cure } = await curingOrder();
    await endIn(set, 300);
    await endIn(cure, 600);
    const ended = await waitFor('the cure hold to end', () => Hold.findByPk(cure.id), (h) => h!.status === 'ended', 5000);
    expect(ended!.endedBy).toBe('worker');
    expect(ended!.endedAt!.getTime() - ended!.endsAt!.getTime()).toBeLessThan(1000);
    expect((await Hold.findByPk(set.id))!.status).toBe('ended');
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('testing');
    const mails = await waitFor('the test-ready mail', () => mailMentioning(`${order.number}`), (m) => m.some((x) => x.subject.includes('ready for its hydrostatic test')), 10_000);
    const ready = mails.filter((m) => m.subject.includes('ready for its hydrostatic test'));
    expect(ready).toHaveLength(1);
    expect(ready[0]!.to).toContain('maud.okafor@marrowby.invalid');
    expect(ready[0]!.html).toContain(order.number);
  });

  it('a hold is not lifted before its end by the clock, and lifting twice changes nothing', async () => {
    const { order, cure } = await curingOrder();
    expect(await liftHold(cure.id, 'worker')).toMatchObject({ lifted: false, notYet: cure.endsAt });
    setClockOffsetForTests(cure.endsAt!.getTime() - Date.now() + 1000); // the clock moved past the cure's end
    expect((await liftHold(cure.id, 'worker')).lifted).toBe(true);
    expect((await liftHold(cure.id, 'sweep')).lifted).toBe(false);
    const entries = await AuditEntry.findAll({ where: { entity: 'work-order', entityId: order.id, action: 'hold-ended' } });
    expect(entries.filter((e) => (e.after as { hold: string }).hold === 'cure')).toHaveLength(1);
  });

  it('after FLUSHALL the sweep lifts every due hold from PostgreSQL', async () => {
    const { order, set, cure } = await curingOrder();
    await redis().flushall(); // the delayed jobs and the sweep's schedule are gone
    expect(await holdsQueue().getJob(holdJobId(cure.id))).toBeFalsy();
    setClockOffsetForTests(cure.endsAt!.getTime() - Date.now() + 1000);
    await waitFor('the sweep to lift both holds', () => Hold.findAll({ where: { id: [set.id, cure.id] } }), (hs) => hs.every((h) => h.status === 'ended'), 15_000);
    expect((await Hold.findByPk(cure.id))!.endedBy).toBe('sweep');
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('testing');
  });

  it('an order whose earliest release moves past its window end alerts the planner and operations once', async () => {
    const start = new Date(Date.now() - 3_600_000).toISOString();
    const { order, jointIds } = await isolatedOrder(users, { joints: 1, over: windowOf(start, 2) });
    await recordStepsThrough(users.fitter, jointIds[0]!, 'assembly'); // the cure runs past the window's end
    await watchWindows();
    const second = await watchWindows();
    // the sweep running beside this test may have told first; either way, once
    const entries = await AuditEntry.findAll({ where: { entity: 'work-order', entityId: order.id, action: 'window-at-risk' } });
    expect(entries).toHaveLength(1);
    expect(second.told).not.toContain(order.number);
    const mails = await waitFor('the window mail', () => mailMentioning(order.number), (m) => m.some((x) => x.subject.includes('will run past its window')), 10_000);
    const risk = mails.filter((m) => m.subject.includes('will run past its window'));
    expect(risk).toHaveLength(1);
    expect(risk[0]!.to).toContain('ines.varga@marrowby.invalid');
    expect(risk[0]!.to).toContain('maud.okafor@marrowby.invalid');
  });
});
