import type { Job } from 'bullmq';
import { importJobSchema } from '@server/queues/line-imports';
import { applyImport, previewImport } from '@server/services/line-imports/import-service';

/** Runs the step the API queued for a large file; both steps are no-ops when already done. */
export async function processImport(job: Pick<Job, 'data'>): Promise<void> {
  const { importId, step } = importJobSchema.parse(job.data);
  if (step === 'preview') await previewImport(importId);
  else await applyImport(importId, { notify: true });
}
