import type { Job } from 'bullmq';
import { sendMail } from '@server/services/mail-service';
import { mailJobSchema } from '@shared/queues';

export async function processMail(job: Job): Promise<void> {
  await sendMail(mailJobSchema.parse(job.data));
}
