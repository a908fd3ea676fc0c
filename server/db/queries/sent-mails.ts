// The ledger of mail jobs being or already sent (sent_mails), so a mail job that runs twice sends once.

import { QueryTypes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';

/** Claims `jobId` for sending; false when another run claimed it already (sending or sent). */
export async function claimMail(jobId: string): Promise<boolean> {
  const rows = await sequelize.query('insert into sent_mails (job_id) values (:jobId) on conflict do nothing returning job_id', { replacements: { jobId }, type: QueryTypes.SELECT });
  return rows.length === 1;
}

export async function markMailSent(jobId: string): Promise<void> {
  await sequelize.query('update sent_mails set sent_at = now() where job_id = :jobId', { replacements: { jobId } });
}

/** Gives the claim back after a failed send, so the job's retry can send it. */
export async function releaseMailClaim(jobId: string): Promise<void> {
  await sequelize.query('delete from sent_mails where job_id = :jobId and sent_at is null', { replacements: { jobId } });
}
