import { z } from 'zod';
import { queueFor } from './connection';

/** Outgoing mail. A job names why it is sent and the record it is about; the worker renders it then. */
export const MAIL_QUEUE = 'mail';

/** Every reason the product sends mail; each has a template in server/mail/templates. */
export const MAIL_PURPOSES = ['line-import-applied', 'line-import-failed', 'work-order-planned-late', 'lock-removed-absent', 'hold-lifted', 'test-ready', 'ready-for-release', 'window-at-risk', 'lock-left-on'] as const;
export type MailPurpose = (typeof MAIL_PURPOSES)[number];

export const mailJobSchema = z.object({ purpose: z.enum(MAIL_PURPOSES), recordId: z.string().min(1).max(200) });
export type MailJob = z.infer<typeof mailJobSchema>;

export const mailQueue = () => queueFor(MAIL_QUEUE);

/** One mail per purpose and record, however often it is asked for (while Redis keeps the finished job). */
export const mailJobId = (job: MailJob) => `${job.purpose}-${job.recordId}`;

export async function enqueueMail(job: MailJob): Promise<void> {
  await mailQueue().add(job.purpose, mailJobSchema.parse(job), { jobId: mailJobId(job) });
}
