import { Worker } from 'bullmq';
import IORedis from 'ioredis';
import { config } from '@server/config';
import { logger } from '@server/logger';
import { scheduleSweeps } from '@server/queues';
import { QUEUES } from '@shared/queues';
import { processImportSweep } from './processors/import-sweep';
import { processImport } from './processors/line-import';
import { processMail } from './processors/mail';

/** Starts every worker of this process and (re)schedules the sweeps; tests start the same set in-process. */
export function startWorkers() {
  const connection = new IORedis(config.redisUrl, { maxRetriesPerRequest: null });
  const workers = [
    new Worker(QUEUES.imports, processImport, { connection, concurrency: 1 }),
    new Worker(QUEUES.mail, processMail, { connection, concurrency: 4 }),
    new Worker(QUEUES.sweeps, processImportSweep, { connection, concurrency: 1 }),
  ];
  for (const w of workers) {
    w.on('failed', (job, err) => logger.error({ err, queue: w.name, jobId: job?.id }, 'job failed'));
  }
  const scheduled = scheduleSweeps().catch((err) => logger.error({ err }, 'could not schedule the import sweep'));
  return {
    workers,
    async close() {
      await scheduled;
      await Promise.all(workers.map((w) => w.close()));
      await connection.quit().catch(() => undefined);
    },
  };
}
