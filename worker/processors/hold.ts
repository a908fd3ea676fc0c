import { DelayedError, type Job } from 'bullmq';
import { now } from '@server/clock';
import { holdJobSchema } from '@server/queues/holds';
import { liftHold } from '@server/services/holds/lift';

/**
 * Lifts the hold if it is due by the database and the clock. A hold that is not (lengthened by a
 * temperature log, or the worker woke early) puts the same job back until its end.
 */
export async function processHoldLift(job: Job, token?: string): Promise<void> {
  const { holdId } = holdJobSchema.parse(job.data);
  const result = await liftHold(holdId, 'worker');
  if (result.notYet && token) {
    await job.moveToDelayed(Date.now() + Math.max(0, result.notYet.getTime() - now().getTime()), token);
    throw new DelayedError();
  }
}
