// The mail to a person whose lock a supervisor removed while they were away (1910.147(e)(3)).

import { htmlMail } from '@server/mail/layout';

export interface AbsentLockFacts {
  orderId: string;
  number: string;
  lines: string[];
  ownerName: string;
  lockNumber: string;
  place: string;
  removedBy: string;
  /** Already in the plant's time zone. */
  removedAt: string;
  contactAttempts: string;
  contactAttemptedAt: string;
  informBeforeReturn: string;
}

export function lockRemovedAbsent(f: AbsentLockFacts, origin: string) {
  const subject = `${f.number} (${f.lines.join(', ')}): your lock ${f.lockNumber} on ${f.place} was removed while you were away`;
  const href = `${origin}/work-orders/${f.orderId}`;
  const intro = `${f.ownerName}, ${f.removedBy} removed your lock ${f.lockNumber} from ${f.place} on ${f.number} at ${f.removedAt}, under the plant's procedure for an absent person's lock (OSHA 29 CFR 1910.147(e)(3)).`;
  const facts = [
    `Attempts to reach you: ${f.contactAttempts} (${f.contactAttemptedAt})`,
    `How you will be told before you resume work: ${f.informBeforeReturn}`,
  ];
  const warn = 'Your lock no longer protects you on this section. Before you work on it again, speak to the supervisor and apply your own lock.';
  return {
    subject,
    text: `${intro}\n\n${facts.map((x) => `  ${x}`).join('\n')}\n\n${warn}\n\nThe order: ${href}\n`,
    html: htmlMail(subject, [{ p: intro }, { list: facts }, { p: warn }, { link: { href, text: `Open ${f.number}` } }]),
  };
}
