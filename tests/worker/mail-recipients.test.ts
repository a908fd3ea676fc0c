// Each mail of the holds and release path reaches the people it is meant for, once: a cure hold's
// end (the order's fitters and planner), ready for release (operations), and a lock left on after
// the cure ended (the supervisors; the plant's minutes respected; one mail per lock however often
// the watch runs, and none for a lock taken off meanwhile).
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { setClockOffsetForTests } from '@server/clock';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Hold } from '@server/db/models/joint-record';
import { PlantSetting } from '@server/db/models/plant-setting';
import { closeQueues } from '@server/queues/connection';
import { liftDueHolds } from '@server/services/holds/lift';
import { LOCK_LEFT_ON, watchLeftLocks } from '@server/services/holds/watches';
import { startWorkers } from '../../worker/workers';
import { useTestApp } from '../helpers/app';
import { waitFor } from '../helpers/import-csv';
import { mailMentioning } from '../helpers/mail';
import { cureEnds, curingOrder, release, removeMyLocks, testBody } from '../helpers/release';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations', 'supervisor'], before: plantForWorkOrders });
let workers: ReturnType<typeof startWorkers> | null = null;
beforeAll(() => void (workers = startWorkers({ sweepWatchMs: 200 })));
afterEach(async () => {
  setClockOffsetForTests(0);
  await PlantSetting.update({ lockLeftOnMinutes: null }, { where: { id: 1 } });
});
afterAll(async () => {
  await workers?.close();
  await closeQueues();
});

const PLANNER = 'ines.varga@marrowby.invalid';
const FITTER = 'tomas.lind@marrowby.invalid';
const OPERATIONS = 'maud.okafor@marrowby.invalid';
const SUPERVISOR = 'rafe.adeyemi@marrowby.invalid';
const HOUR = 3_600_000;

/** The mails about `number` whose subject matches, once the first has come (and a moment more, so a second copy would be seen). */
async function mailsAbout(number: string, subject: RegExp) {
  await waitFor(`mail "${subject.source}" about ${number}`, () => mailMentioning(number), (m) => m.some((x) => subject.test(x.subject)), 10_000);
  await new Promise((r) => setTimeout(r, 500));
  return (await mailMentioning(number)).filter((m) => subject.test(m.subject));
}
const recipients = (to: string[]) => [...to].sort();

describe('who hears of what', () => {
  it("a cure hold's end goes to the order's fitter and planner; ready for release to operations — each once", async () => {
    const { order } = await curingOrder(users);
    await cureEnds(order.id);
    const lifted = await mailsAbout(order.number, /cure hold has run out/);
    expect(lifted).toHaveLength(1);
    expect(recipients(lifted[0]!.to)).toEqual([PLANNER, FITTER].sort());
    expect(lifted[0]!.subject).toContain(order.number);
    expect(lifted[0]!.html).toContain(`/work-orders/${order.id}`);

    await removeMyLocks(users.fitter, order.id);
    expect((await users.operations.tablet(`/api/work-orders/${order.id}/pressure-tests`, await testBody(users.planner, order.id))).status).toBe(201);
    const ready = await mailsAbout(order.number, /is ready for release$/);
    expect(ready).toHaveLength(1);
    expect(recipients(ready[0]!.to)).toEqual([OPERATIONS]);
    expect(ready[0]!.text).toMatch(/hydrostatic test passed at \d+ psi/);
    expect(ready[0]!.text).toContain('witnessed by Maud Okafor');
    expect((await release(users.operations, order.id)).status).toBe(201);
  });

  it("a lock still on longer than the plant's minutes after the cure ended tells the supervisors once per lock; a lock taken off is not told", async () => {
    await PlantSetting.update({ lockLeftOnMinutes: 90 }, { where: { id: 1 } });
    const { order } = await curingOrder(users);
    await cureEnds(order.id); // the clock one minute past the cure's end: not yet
    expect((await watchLeftLocks()).told.filter((t) => t.startsWith(order.number))).toEqual([]);

    // the valve's and the drain's locks are both still on, 89 minutes on: still not
    const lastCureEnd = (await Hold.max('endedAt', { where: { workOrderId: order.id, kind: 'cure' } })) as Date;
    setClockOffsetForTests(lastCureEnd.getTime() - Date.now() + 89 * 60_000);
    expect((await watchLeftLocks()).told.filter((t) => t.startsWith(order.number))).toEqual([]);

    // the fitter takes one lock off; 91 minutes on, the other is told
    const board = (await users.fitter.get(`/api/work-orders/${order.id}/lockout`)).body;
    const [off, left] = board.myLocks as { id: string; lockNumber: string }[];
    expect((await users.fitter.tablet(`/api/locks/${off!.id}/removal`, {})).status).toBe(200);
    setClockOffsetForTests(lastCureEnd.getTime() - Date.now() + 91 * 60_000);
    await watchLeftLocks();
    await watchLeftLocks(); // the sweep beside this test may have told first; either way, once
    const entries = await AuditEntry.findAll({ where: { entity: 'work-order', entityId: order.id, action: LOCK_LEFT_ON } });
    expect(entries.map((e) => (e.after as { lockNumber: string }).lockNumber)).toEqual([left!.lockNumber]);

    const mails = await mailsAbout(order.number, /is still on .*after the cure ended/);
    expect(mails).toHaveLength(1);
    expect(recipients(mails[0]!.to)).toEqual([SUPERVISOR]);
    expect(mails[0]!.subject).toContain(`lock ${left!.lockNumber} (Tomas Lind)`);
    expect(mails[0]!.subject).toContain('90 min after the cure ended');
    expect(mails[0]!.text).toContain('(e)(3)');
    expect(mails[0]!.text).toMatch(/local codes and the plant's procedures come first/i);

    // much later, still on: no second mail
    setClockOffsetForTests(lastCureEnd.getTime() - Date.now() + 5 * HOUR);
    expect((await watchLeftLocks()).told).not.toContain(`${order.number} ${left!.lockNumber}`);
    await liftDueHolds();
    expect(await mailsAbout(order.number, /is still on .*after the cure ended/)).toHaveLength(1);
  });
});
