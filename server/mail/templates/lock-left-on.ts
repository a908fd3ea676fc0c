// The mail to the supervisors when a lock stays on after an order's cure holds have all run out:
// the hydrostatic test waits on it, and its owner may have gone home.

import { htmlMail } from '@server/mail/layout';

export interface LockLeftOnFacts {
  orderId: string;
  number: string;
  lines: string[];
  ownerName: string;
  lockNumber: string;
  place: string;
  /** Already in the plant's time zone. */
  appliedAt: string;
  curesEndedAt: string;
  minutes: number;
}

export function lockLeftOn(f: LockLeftOnFacts, origin: string) {
  const subject = `${f.number} (${f.lines.join(', ')}): lock ${f.lockNumber} (${f.ownerName}) is still on ${f.place}, ${f.minutes} min after the cure ended`;
  const href = `${origin}/work-orders/${f.orderId}`;
  const intro = `Every cure hold on ${f.number} ran out at ${f.curesEndedAt}, and its hydrostatic test waits on every lock coming off the test boundary. ${f.ownerName}'s lock ${f.lockNumber} on ${f.place} (on since ${f.appliedAt}) is still on more than ${f.minutes} minutes later.`;
  const next = [
    `Reach ${f.ownerName}: the lock comes off by its owner's hand, after tools and people are clear (OSHA 29 CFR 1910.147(f)(1)).`,
    'If they cannot be reached, the plant\'s procedure for an absent person\'s lock applies ((e)(3)): the order\'s page records each step.',
  ];
  const caution = 'Never pressurise a section while anyone\'s lock is still on it. Local codes and the plant\'s procedures come first.';
  return {
    subject,
    text: `${intro}\n\n${next.map((x) => `  ${x}`).join('\n')}\n\n${caution}\n\nThe order: ${href}\n`,
    html: htmlMail(subject, [{ p: intro }, { list: next }, { p: caution }, { link: { href, text: `Open ${f.number}` } }]),
  };
}
