// What each kind of mail job becomes: the worker reads the record it is about and renders the
// template then, so a job carries ids only and a mail says what the database says when it goes.

import { config } from '@server/config';
import { LineImport } from '@server/db/models/line-import';
import { Person } from '@server/db/models/person';
import type { MailJob, MailPurpose } from '@server/queues/mail';
import type { OutgoingMail } from './send-mail';
import { lineImportApplied, lineImportFailed } from './templates/line-import-outcome';
import { latePlanMail } from './work-order-mail';
import { absentLockMail, lockLeftOnMail } from './lockout-mail';
import { holdLiftedMail, testReadyMail, windowAtRiskMail } from './hold-mail';
import { readyForReleaseMail } from './release-mail';

type Composer = (recordId: string) => Promise<OutgoingMail | null>;

/** To whoever confirmed the import; nobody to tell (no confirmer, no address) is no mail. */
const importMail = (render: typeof lineImportApplied): Composer => async (importId) => {
  const imp = await LineImport.findByPk(importId);
  const person = imp?.confirmedById ? await Person.findByPk(imp.confirmedById) : null;
  if (!imp || !person?.email) return null;
  return { to: person.email, ...render(imp, config.origin) };
};

const COMPOSERS: Record<MailPurpose, Composer> = {
  'line-import-applied': importMail(lineImportApplied),
  'line-import-failed': importMail(lineImportFailed),
  'work-order-planned-late': latePlanMail,
  'lock-removed-absent': absentLockMail,
  'hold-lifted': holdLiftedMail,
  'test-ready': testReadyMail,
  'ready-for-release': readyForReleaseMail,
  'window-at-risk': windowAtRiskMail,
  'lock-left-on': lockLeftOnMail,
};

export function composeMail(job: MailJob): Promise<OutgoingMail | null> {
  return COMPOSERS[job.purpose](job.recordId);
}
