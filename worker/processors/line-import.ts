import type { Job } from 'bullmq';
import { importJobSchema } from '@shared/queues';

export async function processImport(job: Job): Promise<void> {
  importJobSchema.parse(job.data);
  throw new Error('line import processor not written yet');
}
