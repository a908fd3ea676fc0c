import { Worker } from 'bullmq';
import { logger } from '@server/logger';
import { newRedisConnection } from '@server/queues/connection';
import { LINE_IMPORTS_QUEUE } from '@server/queues/line-imports';
import { MAIL_QUEUE } from '@server/queues/mail';
import { HOLDS_QUEUE } from '@server/queues/holds';
import { SWEEPS_QUEUE, ensureSweepScheduled, scheduleSweep } from '@server/queues/sweeps';
import { processSweep } from './processors/sweep';
import { processImport } from './processors/line-import';
import { processMail } from './processors/mail';
import { processHoldLift } from './processors/hold';

/** How often a worker checks that Redis still holds the sweep's schedule (a FLUSHALL drops it). */
export const SWEEP_WATCH_MS = 15_000;

/**
 * Starts every worker of this process and schedules the sweep; tests start the same set in-process.
 * The schedule lives in Redis, so it is checked again whenever the connection comes back and every
 * `sweepWatchMs`: a Redis that lost it (flushed, replaced) gets it back without a worker restart.
 */
export function startWorkers(opts: { sweepWatchMs?: number } = {}) {
  const connection = newRedisConnection();
  const workers = [
    new Worker(LINE_IMPORTS_QUEUE, processImport, { connection, concurrency: 1 }),
    new Worker(MAIL_QUEUE, processMail, { connection, concurrency: 4 }),
    new Worker(SWEEPS_QUEUE, (job) => processSweep(job), { connection, concurrency: 1 }),
    new Worker(HOLDS_QUEUE, processHoldLift, { connection, concurrency: 8 }),
  ];
  for (const w of workers) {
    w.on('failed', (job, err) => logger.error({ err, queue: w.name, jobId: job?.id }, 'job failed'));
  }
  const watch = () =>
    ensureSweepScheduled()
      .then((again) => again && logger.warn('the sweep was missing from Redis; scheduled it again'))
      .catch((err) => logger.error({ err }, 'could not check the sweep schedule'));
  const scheduled = scheduleSweep().catch((err) => logger.error({ err }, 'could not schedule the sweep'));
  const timer = setInterval(() => void watch(), opts.sweepWatchMs ?? SWEEP_WATCH_MS);
  timer.unref();
  connection.on('ready', () => void watch()); // after a reconnect
  return {
    workers,
    async close() {
      clearInterval(timer);
      await scheduled;
      await Promise.all(workers.map((w) => w.close()));
      await connection.quit().catch(() => undefined);
    },
  };
}
