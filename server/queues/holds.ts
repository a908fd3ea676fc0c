import { z } from 'zod';
import { queueFor } from './connection';

/**
 * Timed holds (STYLE.md, "Queues"): each running hold is a row in PostgreSQL and a delayed job that
 * wakes the worker at its end. The row is the truth: the job and the sweep both lift only what the
 * database and the clock say is due, and lifting twice changes nothing.
 */
export const HOLDS_QUEUE = 'holds';
export const LIFT_HOLD = 'lift-hold';

export const holdJobSchema = z.object({ holdId: z.uuid() });
export type HoldJob = z.infer<typeof holdJobSchema>;

export const holdsQueue = () => queueFor(HOLDS_QUEUE);

/** One job per hold (BullMQ refuses ':' in a custom id, so a dash). */
export const holdJobId = (holdId: string) => `hold-${holdId}`;

/** Queues (or moves) the lift of a hold to `delayMs` from now; an earlier job for the hold is replaced. */
export async function scheduleHoldLift(holdId: string, delayMs: number): Promise<void> {
  const q = holdsQueue();
  const id = holdJobId(holdId);
  const old = await q.getJob(id);
  if (old) await old.remove().catch(() => undefined); // running or locked: it re-checks the row and reschedules itself
  await q.add(LIFT_HOLD, holdJobSchema.parse({ holdId }), { jobId: id, delay: Math.max(0, delayMs), attempts: 5, removeOnComplete: true, removeOnFail: 1000 });
}
