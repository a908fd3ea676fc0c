// Every step a work order may take between its states (DESIGN.md section 7), in one table.
// A state is a consequence: each service that records a fact moves the order with `moveTo`, in
// the same transaction, and a step the table does not hold is refused with 409 and a sentence
// naming what has not happened yet. No endpoint sets a state directly.

import { AppError } from '@server/errors';
import { WORK_ORDER_STATE_LABELS, WORK_ORDER_STATES, type WorkOrderState } from '@shared/schemas/work-orders';

/** What has happened when an order reaches each state, as a sentence can name it. */
export const REACHED_WHEN: Record<WorkOrderState, string> = {
  draft: 'the order is written',
  planned: 'a complete plan is submitted (lines, joint tasks, an isolation plan, a window and the cure conditions)',
  isolated: 'every point of the isolation plan carries a lock and zero energy is verified',
  'in-work': 'the first joint step is recorded',
  curing: 'every joint task is assembled (or replaced by its redo)',
  testing: 'every cure hold in the test boundary has ended',
  ready: 'a pressure test has passed and every lock is off',
  released: 'operations has signed the release checklist',
  closed: 'the record is complete and the planner has closed it',
  cancelled: 'it is cancelled with a reason',
};

/** The allowed steps: from → the states it may go to, each with what moves it. */
export const STEPS: Record<WorkOrderState, Partial<Record<WorkOrderState, string>>> = {
  draft: { planned: 'the planner submits the plan', cancelled: 'the planner cancels it' },
  planned: {
    draft: 'the planner edits the plan, which then has to be submitted again',
    isolated: 'locks and verification',
    cancelled: 'the planner cancels it',
  },
  isolated: { 'in-work': 'the first joint step', cancelled: 'a supervisor cancels it once every lock is off' },
  'in-work': { curing: 'the last assembly step', cancelled: 'a supervisor cancels it once every lock is off' },
  curing: { testing: 'the last cure hold ends', 'in-work': 'a joint is cut out for redo', cancelled: 'a supervisor cancels it once every lock is off' },
  testing: {
    ready: 'the test passes and every lock is off',
    'in-work': 'the test fails: leaking joints become redo tasks',
    cancelled: 'a supervisor cancels it once every lock is off',
  },
  ready: { released: 'operations signs the release', cancelled: 'a supervisor cancels it once every lock is off' },
  released: { closed: 'the planner closes the record' },
  closed: {},
  cancelled: {},
};

/** The main line of states, draft to closed (cancelled is off to the side). */
const CHAIN: readonly WorkOrderState[] = WORK_ORDER_STATES.filter((s) => s !== 'cancelled');

export function mayStep(from: WorkOrderState, to: WorkOrderState): boolean {
  return STEPS[from][to] !== undefined;
}

/** A state in words, lower case: "in work", "ready for release". */
export const stateWords = (s: WorkOrderState) => WORK_ORDER_STATE_LABELS[s].toLowerCase();
const label = stateWords;

/** Why `from → to` is refused, as a sentence that says what is missing. */
export function refusalOf(number: string, from: WorkOrderState, to: WorkOrderState): string {
  if (from === 'cancelled') return `${number} is cancelled; nothing more happens to a cancelled order.`;
  if (from === 'closed') return `${number} is closed; its record is complete and does not change.`;
  if (from === to) return `${number} is already ${label(to)}.`;
  const [i, j] = [CHAIN.indexOf(from), CHAIN.indexOf(to)];
  if (i >= 0 && j > i + 1) {
    const skipped = CHAIN.slice(i + 1, j);
    const missing = skipped.map((s) => `${label(s)} (${REACHED_WHEN[s]})`).join(', then ');
    return `${number} is ${label(from)}; it cannot become ${label(to)} before it has been ${missing}.`;
  }
  const allowed = Object.entries(STEPS[from]).map(([s, why]) => `${label(s as WorkOrderState)} when ${why}`);
  return `${number} is ${label(from)}; it cannot become ${label(to)} from here. From ${label(from)} it goes to ${allowed.join('; or ')}.`;
}

/** Refuses (409) a step the table does not hold. */
export function assertStep(number: string, from: WorkOrderState, to: WorkOrderState): void {
  if (!mayStep(from, to)) throw new AppError(409, 'state_conflict', refusalOf(number, from, to));
}

/** The order's next state after the step, or a 409 naming what is missing. */
export function moveTo(order: { number: string; state: WorkOrderState }, to: WorkOrderState): WorkOrderState {
  assertStep(order.number, order.state, to);
  return to;
}
