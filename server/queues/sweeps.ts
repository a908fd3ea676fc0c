import { z } from 'zod';
import { queueFor } from './connection';

/**
 * The repeating sweep: one job every SWEEP_EVERY_MS whose processor runs every registered sweep
 * (worker/sweeps.ts). PostgreSQL is the truth; the sweep finds in it whatever a lost job, a
 * flushed Redis or a dead worker left undone.
 */
export const SWEEPS_QUEUE = 'sweeps';
export const SWEEP = 'sweep';
export const SWEEP_EVERY_MS = 30_000;

/** The sweep carries nothing: it reads what to do from PostgreSQL. */
export const sweepJobSchema = z.object({});

export const sweepQueue = () => queueFor(SWEEPS_QUEUE);

const RUN_OPTS = { attempts: 1, removeOnComplete: 100, removeOnFail: 500 };

/** Schedules the sweep (an upsert: many workers, one schedule) and queues one run now. */
export async function scheduleSweep(): Promise<void> {
  await sweepQueue().upsertJobScheduler(SWEEP, { every: SWEEP_EVERY_MS }, { name: SWEEP, data: {}, opts: RUN_OPTS });
  await sweepQueue().add(SWEEP, {}, { jobId: `${SWEEP}-now`, attempts: 1, removeOnComplete: true, removeOnFail: true });
}

/**
 * Schedules the sweep again when Redis has lost its schedule (flushed, or a new Redis behind the
 * same address); true when it had to. Cheap enough to ask every few seconds.
 */
export async function ensureSweepScheduled(): Promise<boolean> {
  if (await sweepQueue().getJobScheduler(SWEEP)) return false;
  await scheduleSweep();
  return true;
}
