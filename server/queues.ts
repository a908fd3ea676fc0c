import { Queue } from 'bullmq';
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

/** Deterministic job ids: enqueueing the same step twice is one job. */
export async function enqueueImport(job: ImportJob): Promise<void> {
  await importQueue().add(job.step, job, { jobId: `${job.step}-${job.importId}`, attempts: 1 });
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
