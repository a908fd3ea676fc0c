// A mail job that runs twice — two workers at once, or queued again after Redis forgot the first —
// sends its mail once: the job's id is claimed in PostgreSQL before sending.
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { setClockOffsetForTests } from '@server/clock';
import { Hold } from '@server/db/models/joint-record';
import { closeQueues } from '@server/queues/connection';
import { liftHold } from '@server/services/holds/lift';
import { processMail } from '../../worker/processors/mail';
import { useTestApp } from '../helpers/app';
import { isolatedOrder, recordStepsThrough } from '../helpers/lockout';
import { mailMentioning } from '../helpers/mail';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
afterEach(() => setClockOffsetForTests(0));
afterAll(() => closeQueues());

describe('mail jobs', () => {
  it('the same hold-lifted job run twice at once, and once more later, sends one mail', async () => {
    const { order, jointIds } = await isolatedOrder(users, { joints: 1 });
    await recordStepsThrough(users.fitter, jointIds[0]!, 'assembly');
    const cure = (await Hold.findOne({ where: { jointTaskId: jointIds[0], kind: 'cure' } }))!;
    setClockOffsetForTests(cure.endsAt!.getTime() - Date.now() + 1000);
    expect((await liftHold(cure.id, 'worker')).lifted).toBe(true);
    const job = { data: { purpose: 'hold-lifted', recordId: cure.id } };
    await Promise.all([processMail(job), processMail(job)]);
    await processMail(job);
    const mails = (await mailMentioning(order.number)).filter((m) => m.subject.includes("cure hold has run out"));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.to).toContain('tomas.lind@marrowby.invalid');
    expect(mails[0]!.to).toContain('ines.varga@marrowby.invalid');
  });
});
