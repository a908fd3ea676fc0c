import type { Job } from 'bullmq';
import { logger } from '@server/logger';
import { recoverStalledImports } from '@server/services/line-import-recovery';
import { sweepJobSchema } from '@shared/queues';

/** The periodic sweep: imports left in progress by a lost job are queued again or marked failed. */
export async function processImportSweep(job: Job): Promise<void> {
  sweepJobSchema.parse(job.data);
  const { requeued, failed } = await recoverStalledImports();
  if (requeued.length || failed.length) logger.info({ requeued, failed }, 'import sweep recovered imports');
}
