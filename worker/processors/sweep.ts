import type { Job } from 'bullmq';
import { logger } from '@server/logger';
import { sweepJobSchema } from '@server/queues/sweeps';
import { SWEEPS, type Sweep } from '../sweeps';

/**
 * The repeating sweep: runs every registered sweep. One that fails is logged and the others still
 * run; the job fails afterwards, naming the ones that failed, so BullMQ's record shows it.
 */
export async function processSweep(job: Pick<Job, 'data'>, sweeps: readonly Sweep[] = SWEEPS): Promise<void> {
  sweepJobSchema.parse(job.data);
  const failed: string[] = [];
  for (const sweep of sweeps) {
    try {
      const did = await sweep.run();
      if (did && Object.values(did).some((v) => v.length)) logger.info({ sweep: sweep.name, ...did }, 'sweep acted');
    } catch (err) {
      failed.push(sweep.name);
      logger.error({ err, sweep: sweep.name }, 'sweep failed');
    }
  }
  if (failed.length) throw new Error(`These sweeps failed: ${failed.join(', ')}`);
}
