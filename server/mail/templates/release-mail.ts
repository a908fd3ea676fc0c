// The mail to operations when an order's test has passed and every lock is off: its lines may go back.

import { htmlMail } from '@server/mail/layout';

export function readyForRelease(f: { orderId: string; number: string; lines: string[]; testPsi: number; passedAt: string; witness: string }, origin: string) {
  const subject = `${f.number} (${f.lines.join(', ')}) is ready for release`;
  const href = `${origin}/release`;
  const intro = `${f.number}'s hydrostatic test passed at ${f.testPsi} psi (${f.passedAt}, witnessed by ${f.witness}), every lock is off and every cure hold has run out.`;
  const next = 'Walk the area, make sure everyone is clear and told, set vents and drains for service, then sign the release and refill slowly, watching the new joints.';
  return {
    subject,
    text: `${intro}\n\n${next}\n\nThe release queue: ${href}\n`,
    html: htmlMail(subject, [{ p: intro }, { p: next }, { link: { href, text: 'Open the release queue' } }]),
  };
}
