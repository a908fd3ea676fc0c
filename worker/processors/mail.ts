import type { Job } from 'bullmq';
import { composeMail } from '@server/mail/compose-mail';
import { sendMail } from '@server/mail/send-mail';
import { mailJobSchema } from '@server/queues/mail';

/** Renders the mail from the record it is about, and sends it; nobody to tell is no mail. */
export async function processMail(job: Pick<Job, 'data'>): Promise<void> {
  const mail = await composeMail(mailJobSchema.parse(job.data));
  if (mail) await sendMail(mail);
}
