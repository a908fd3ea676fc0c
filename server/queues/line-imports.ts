import type { JobState } from 'bullmq';
import { z } from 'zod';
import { queueFor } from './connection';

/** Large register files: the preview and the apply of one import, run by the worker. */
export const LINE_IMPORTS_QUEUE = 'line-imports';

export const importJobSchema = z.object({ importId: z.string().uuid(), step: z.enum(['preview', 'apply']) });
export type ImportJob = z.infer<typeof importJobSchema>;

export const importQueue = () => queueFor(LINE_IMPORTS_QUEUE);

/** The one job id a step of an import ever has: enqueueing the same step twice is one job. */
export const importJobId = (job: ImportJob) => `${job.step}-${job.importId}`;

export async function enqueueImport(job: ImportJob): Promise<void> {
  await importQueue().add(job.step, importJobSchema.parse(job), { jobId: importJobId(job), attempts: 1 });
}

/** Where the step's job stands in Redis; null when Redis has no such job (never queued, removed, or flushed). */
export async function importJobState(job: ImportJob): Promise<JobState | null> {
  const found = await importQueue().getJob(importJobId(job));
  const state = found ? await found.getState() : 'unknown';
  return state === 'unknown' ? null : state;
}
