import type { Job } from 'bullmq';
import { claimMail, markMailSent, releaseMailClaim } from '@server/db/queries/sent-mails';
import { composeMail } from '@server/mail/compose-mail';
import { sendMail } from '@server/mail/send-mail';
import { mailJobId, mailJobSchema } from '@server/queues/mail';

/**
 * Renders the mail from the record it is about, and sends it; nobody to tell is no mail. The job's
 * id is claimed in PostgreSQL first, so a job that runs twice sends once; a failed send gives the
 * claim back for the retry.
 */
export async function processMail(job: Pick<Job, 'data'>): Promise<void> {
  const data = mailJobSchema.parse(job.data);
  const mail = await composeMail(data);
  if (!mail) return;
  const id = mailJobId(data);
  if (!(await claimMail(id))) return;
  try {
    await sendMail(mail);
  } catch (err) {
    await releaseMailClaim(id);
    throw err;
  }
  await markMailSent(id);
}
