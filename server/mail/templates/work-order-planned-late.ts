// The mail to operations and the requester when a work order is planned to end after its window.

import { htmlMail } from '@server/mail/layout';

export interface LatePlanFacts {
  id: string;
  number: string;
  scope: string;
  lines: string[];
  requestedBy: string;
  plannedBy: string;
  /** Times already written in the plant's time zone. */
  windowStart: string;
  windowEnd: string;
  earliestRelease: string;
  /** The step that runs past the window's end ("Set and cure"). */
  lateStep: string;
  lateReason: string;
}

export function workOrderPlannedLate(f: LatePlanFacts, origin: string) {
  const subject = `${f.number} is planned past its window: release ${f.earliestRelease}, window ends ${f.windowEnd}`;
  const href = `${origin}/work-orders/${f.id}`;
  const facts = [
    `Lines: ${f.lines.join(', ')}`,
    `Window booked: ${f.windowStart} to ${f.windowEnd}`,
    `Earliest release: ${f.earliestRelease}`,
    `Runs past the window: ${f.lateStep}`,
    `Requested by: ${f.requestedBy}`,
  ];
  const intro = `${f.plannedBy} planned ${f.number} knowing it does not fit the repair window; the line stays out of service until the earliest release.`;
  return {
    subject,
    text: `${intro}\n\n${f.scope}\n\n${facts.map((x) => `  ${x}`).join('\n')}\n\nThe planner's reason:\n${f.lateReason}\n\nThe order: ${href}\n`,
    html: htmlMail(subject, [{ p: intro }, { p: f.scope }, { list: facts }, { p: `The planner's reason: ${f.lateReason}` }, { link: { href, text: `Open ${f.number}` } }]),
  };
}
