import { Queue, type JobState } from 'bullmq';
import IORedis from 'ioredis';
import { config } from '@server/config';
import { QUEUES, type ImportJob, type MailJob } from '@shared/queues';

let connection: IORedis | null = null;
const queues = new Map<string, Queue>();

/** One Redis connection per process; BullMQ workers need maxRetriesPerRequest: null. */
export function redis(): IORedis {
  connection ??= new IORedis(config.redisUrl, { maxRetriesPerRequest: null });
  return connection;
}

function queue(name: string): Queue {
  let q = queues.get(name);
  if (!q) {
    q = new Queue(name, { connection: redis(), defaultJobOptions: { attempts: 3, backoff: { type: 'exponential', delay: 1000 }, removeOnComplete: 1000, removeOnFail: 5000 } });
    queues.set(name, q);
  }
  return q;
}

export const importQueue = () => queue(QUEUES.imports);
export const mailQueue = () => queue(QUEUES.mail);
export const sweepQueue = () => queue(QUEUES.sweeps);

/** The one job id a step of an import ever has. */
export const importJobId = (job: ImportJob) => `${job.step}-${job.importId}`;

/** Deterministic job ids: enqueueing the same step twice is one job. */
export async function enqueueImport(job: ImportJob): Promise<void> {
  await importQueue().add(job.step, job, { jobId: importJobId(job), attempts: 1 });
}

/** Where the step's job stands in Redis; null when Redis has no such job (never queued, removed, or flushed). */
export async function importJobState(job: ImportJob): Promise<JobState | null> {
  const found = await importQueue().getJob(importJobId(job));
  const state = found ? await found.getState() : 'unknown';
  return state === 'unknown' ? null : state;
}

export const IMPORT_SWEEP = 'import-sweep';
export const IMPORT_SWEEP_EVERY_MS = 60_000;

/**
 * Schedules the import sweep every minute (upserting: many workers, one scheduler) and queues one
 * sweep now, so a restarted worker recovers at once. Redis holds the schedule only; a flush loses
 * it until a worker starts again, and loses nothing else that PostgreSQL does not also know.
 */
export async function scheduleSweeps(): Promise<void> {
  const opts = { attempts: 1, removeOnComplete: 100, removeOnFail: 500 };
  await sweepQueue().upsertJobScheduler(IMPORT_SWEEP, { every: IMPORT_SWEEP_EVERY_MS }, { name: IMPORT_SWEEP, data: {}, opts });
  await sweepQueue().add(IMPORT_SWEEP, {}, { jobId: `${IMPORT_SWEEP}-at-start`, attempts: 1, removeOnComplete: true, removeOnFail: true });
}

export async function enqueueMail(job: MailJob, jobId: string): Promise<void> {
  await mailQueue().add('send', job, { jobId });
}

export async function closeQueues(): Promise<void> {
  await Promise.all([...queues.values()].map((q) => q.close()));
  queues.clear();
  if (connection) await connection.quit().catch(() => undefined);
  connection = null;
}
