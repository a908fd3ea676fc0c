// Recovery of large imports the worker lost. PostgreSQL says which imports are in progress;
// Redis only says whether a job is still going to run them. If the worker died or Redis was
// flushed, the row would stay 'previewing' or 'applying' for ever (and an 'applying' one makes
// every later confirm of its kind "busy"). The sweep finds those rows and either queues the step
// again (both steps are idempotent) or, when the step's job has already finished without moving
// the row on, marks the import failed. An 'applying' row after a finished job means the apply
// transaction never committed (the commit is what sets 'applied'), so nothing was written.

import type { JobState } from 'bullmq';
import { sequelize } from '@server/db/sequelize';
import { IMPORT_LOCK_SPACE, REGISTER_LOCK, lockForTransaction, lockRecordForTransaction } from '@server/db/locks';
import { LineImport } from '@server/db/models/line-import';
import { importsLeftInProgress } from '@server/db/queries/line-imports';
import { logger } from '@server/logger';
import { enqueueImport, importJobState } from '@server/queues/line-imports';
import { mailConfirmer } from './import-service';

export const STOPPED_MESSAGE = 'The import stopped before it finished; nothing was written. Upload the file again.';

/**
 * Rows touched more recently than this are left alone: the API creates or confirms the row a
 * moment before it queues the job, and small files run in the request with no job at all.
 * (Acting early would still be safe, only wasted work.)
 */
export const RECOVERY_GRACE_MS = 60_000;

type InProgress = 'previewing' | 'applying';
export type Recovery = 'leave' | 'requeue' | 'fail';

/** What to do with an in-progress import, given its step's job: missing → run it again; finished → it stopped. */
export function recoveryFor(job: JobState | null): Recovery {
  if (job === null) return 'requeue';
  if (job === 'completed' || job === 'failed') return 'fail';
  return 'leave'; // waiting, delayed, prioritized or active: BullMQ will run it (a stalled active job is retried or failed by BullMQ)
}

export interface SweepResult {
  requeued: string[];
  failed: string[];
}

/**
 * Marks an import failed if it is still in the state the sweep saw, under the lock its step
 * holds while writing: so a step still running somewhere either commits first (and this
 * changes nothing) or finds the row failed and writes nothing.
 */
async function markStopped(id: string, status: InProgress): Promise<boolean> {
  return sequelize.transaction(async (t) => {
    if (status === 'applying') await lockForTransaction(t, REGISTER_LOCK);
    else await lockRecordForTransaction(t, IMPORT_LOCK_SPACE, id);
    const [changed] = await LineImport.update({ status: 'failed', error: STOPPED_MESSAGE }, { where: { id, status }, transaction: t });
    return changed > 0;
  });
}

/** One pass over the imports in progress; safe to run from several workers at once. */
export async function recoverStalledImports(opts: { graceMs?: number } = {}): Promise<SweepResult> {
  const graceMs = opts.graceMs ?? RECOVERY_GRACE_MS;
  const stuck = await importsLeftInProgress(graceMs);
  const result: SweepResult = { requeued: [], failed: [] };
  for (const { id, status } of stuck) {
    const job = { importId: id, step: status === 'previewing' ? 'preview' : 'apply' } as const;
    const state = await importJobState(job);
    const action = recoveryFor(state);
    if (action === 'requeue') {
      await enqueueImport(job);
      result.requeued.push(id);
      logger.warn({ importId: id, step: job.step }, 'line import had no job; queued it again');
    } else if (action === 'fail' && (await markStopped(id, status))) {
      result.failed.push(id);
      logger.warn({ importId: id, step: job.step, jobState: state }, 'line import job finished without finishing the import; marked failed');
      if (status === 'applying') await mailConfirmer(id, 'failed');
    }
  }
  return result;
}
