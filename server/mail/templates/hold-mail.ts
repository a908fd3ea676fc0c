// Mails about holds and the test: a joint's cure hold has run out; every cure hold has, so the
// order is ready for its hydrostatic test.

import { htmlMail } from '@server/mail/layout';

export interface HoldLiftedFacts {
  orderId: string;
  number: string;
  lines: string[];
  joint: string;
  /** In the plant's time zone. */
  endedAt: string;
  remaining: number;
}

export function holdLifted(f: HoldLiftedFacts, origin: string) {
  const subject = `${f.number} (${f.lines.join(', ')}): ${f.joint}'s cure hold has run out`;
  const href = `${origin}/work-orders/${f.orderId}`;
  const intro = `The cure hold of joint ${f.joint} on ${f.number} ended at ${f.endedAt}.`;
  const next = f.remaining === 0
    ? 'It was the last: every joint of the order has cured, and the order is ready for its hydrostatic test.'
    : `${f.remaining} cure hold${f.remaining === 1 ? '' : 's'} of the order still run${f.remaining === 1 ? 's' : ''}; no pressure on the section until they end.`;
  return {
    subject,
    text: `${intro}\n\n${next}\n\nThe order: ${href}\n`,
    html: htmlMail(subject, [{ p: intro }, { p: next }, { link: { href, text: `Open ${f.number}` } }]),
  };
}

export interface TestReadyFacts {
  orderId: string;
  number: string;
  lines: string[];
  testPsi: number | null;
  holdMinutes: number | null;
}

export function testReady(f: TestReadyFacts, origin: string) {
  const subject = `${f.number} (${f.lines.join(', ')}) is ready for its hydrostatic test`;
  const href = `${origin}/work-orders/${f.orderId}`;
  const intro = `Every cure hold of ${f.number} has run out by the clock; the section may be tested.`;
  const facts = [
    f.testPsi === null ? 'Test pressure: see the order' : `Test pressure: ${f.testPsi} psi, water only, vented of air`,
    f.holdMinutes === null ? 'Hold: see the order' : `Hold at least ${f.holdMinutes} min`,
    'Before pressurising: tools and people clear, the locks on the test boundary removed by their owners (OSHA 29 CFR 1910.147(f)(1)).',
  ];
  return {
    subject,
    text: `${intro}\n\n${facts.map((x) => `  ${x}`).join('\n')}\n\nThe order: ${href}\n`,
    html: htmlMail(subject, [{ p: intro }, { list: facts }, { link: { href, text: `Open ${f.number}` } }]),
  };
}

export interface WindowAtRiskFacts {
  orderId: string;
  number: string;
  lines: string[];
  windowEnd: string;
  earliestRelease: string;
}

export function windowAtRisk(f: WindowAtRiskFacts, origin: string) {
  const subject = `${f.number} (${f.lines.join(', ')}) will run past its window: release ${f.earliestRelease} at the earliest, window ends ${f.windowEnd}`;
  const href = `${origin}/work-orders/${f.orderId}`;
  const intro = `The holds of ${f.number} now run so long that its lines cannot be back in service before its window ends (${f.windowEnd}); the earliest release is ${f.earliestRelease}.`;
  const next = 'Agree the longer outage with operations. The holds stand: no pressure before the cure ends, whatever the window says.';
  return {
    subject,
    text: `${intro}\n\n${next}\n\nThe order: ${href}\n`,
    html: htmlMail(subject, [{ p: intro }, { p: next }, { link: { href, text: `Open ${f.number}` } }]),
  };
}
