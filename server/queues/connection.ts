// The one Redis connection and the Queue objects of this process. Each queue's name, job schema,
// job id and enqueue helper live in a file of their own beside this one (server/queues/<queue>.ts).

import { Queue } from 'bullmq';
import IORedis from 'ioredis';
import { config } from '@server/config';

let connection: IORedis | null = null;
const queues = new Map<string, Queue>();

/** One Redis connection per process for the queues; BullMQ needs maxRetriesPerRequest: null. */
export function redis(): IORedis {
  connection ??= new IORedis(config.redisUrl, { maxRetriesPerRequest: null });
  return connection;
}

/** A fresh connection of its own, as each BullMQ Worker needs (it blocks on Redis while it waits). */
export const newRedisConnection = () => new IORedis(config.redisUrl, { maxRetriesPerRequest: null });

/** The Queue object for `name`, made once per process. */
export function queueFor(name: string): Queue {
  let q = queues.get(name);
  if (!q) {
    q = new Queue(name, { connection: redis(), defaultJobOptions: { attempts: 3, backoff: { type: 'exponential', delay: 1000 }, removeOnComplete: 1000, removeOnFail: 5000 } });
    queues.set(name, q);
  }
  return q;
}

export async function closeQueues(): Promise<void> {
  await Promise.all([...queues.values()].map((q) => q.close()));
  queues.clear();
  if (connection) await connection.quit().catch(() => undefined);
  connection = null;
}
