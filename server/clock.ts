// The one clock of the server and the worker (STYLE.md, "Time"): business rules ask `now()`, never
// Date.now(), so a test can move time. The trade engine takes `now` as an argument.

import { config } from '@server/config';

let offsetMs = 0;

/** The current moment, as the business rules see it. */
export function now(): Date {
  return new Date(Date.now() + offsetMs);
}

/** Tests only: moves the clock `ms` ahead of the machine's (0 puts it back). */
export function setClockOffsetForTests(ms: number): void {
  if (config.env !== 'test') throw new Error('The clock can be moved only in the test environment.');
  offsetMs = ms;
}
