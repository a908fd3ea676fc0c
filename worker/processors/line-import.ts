import type { Job } from 'bullmq';
import { applyImport, previewImport } from '@server/services/line-import-service';
import { importJobSchema } from '@shared/queues';

/** Runs the step the API queued for a large file; both steps are no-ops when already done. */
export async function processImport(job: Job): Promise<void> {
  const { importId, step } = importJobSchema.parse(job.data);
  if (step === 'preview') await previewImport(importId);
  else await applyImport(importId, { notify: true });
}
