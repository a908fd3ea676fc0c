// Pure readings of the release queue and the line status board: which orders may go now, what kind
// each reason is, and what a line still waits for before it can come back. No I/O; the time is passed in.

import { WORK_ORDER_STATE_LABELS, type WorkOrderState } from '@shared/schemas/work-orders';
import type { LineStatusBoardDto, ReleaseBlocker, ReleaseQueueDto } from '@shared/schemas/release';

export type QueueRow = ReleaseQueueDto['orders'][number];
export type StatusLine = LineStatusBoardDto['lines'][number];

/** A text marker per kind of reason, so the kind never rests on a colour or an icon alone. */
export const BLOCKER_KIND: Record<ReleaseBlocker['kind'], { tag: string; name: string }> = {
  lock: { tag: 'LOCK', name: 'a lock still on' },
  hold: { tag: 'HOLD', name: 'a set or cure hold' },
  test: { tag: 'TEST', name: 'the hydrostatic test' },
  state: { tag: 'STAGE', name: 'where the order stands' },
};

/** The order's state in our words; the queue sends it as a plain string. */
export const stateLabel = (state: string): string =>
  Object.hasOwn(WORK_ORDER_STATE_LABELS, state) ? WORK_ORDER_STATE_LABELS[state as WorkOrderState] : state;

/** Ready to release first, then the blocked ones, each group in the server's order (window end, then number). */
export function splitQueue(orders: readonly QueueRow[]): { ready: QueueRow[]; blocked: QueueRow[] } {
  return { ready: orders.filter((o) => o.ready), blocked: orders.filter((o) => !o.ready) };
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** "2 locks · 1 hold · test" — an order's reasons in a few words, for the line board. */
export function blockerSummary(blockers: readonly ReleaseBlocker[]): string {
  const count = (k: ReleaseBlocker['kind']) => blockers.filter((b) => b.kind === k).length;
  const parts = [
    count('lock') ? plural(count('lock'), 'lock on', 'locks on') : null,
    count('hold') ? plural(count('hold'), 'hold', 'holds') : null,
    count('test') ? 'no passed test' : null,
  ];
  return parts.filter(Boolean).join(' · ');
}

/** Orders whose joints are still being made: nothing can be counted until they are. */
const MAKING: readonly string[] = ['isolated', 'in-work'];

/**
 * When a line out of service can come back: not before the end of the last hold still running, by
 * the clock (null when none runs), and what else it needs, in the order it happens ((f)(1): locks
 * off before the test, the test before the release).
 */
export function lineOutlook(line: Pick<StatusLine, 'orders' | 'earliestBack'>, nowMs: number): { notBefore: string | null; needs: string[] } {
  const all = line.orders.flatMap((o) => o.blockers);
  const needs = [
    line.orders.some((o) => MAKING.includes(o.state)) ? 'the joints made' : null,
    all.some((b) => b.kind === 'hold' && b.until === null) ? "a supervisor's engineering cure time" : null,
    all.some((b) => b.kind === 'lock') ? 'every lock off' : null,
    all.some((b) => b.kind === 'test') ? 'a passed hydrostatic test' : null,
    line.orders.length ? "operations' release" : null,
  ].filter((x): x is string => x !== null);
  const notBefore = line.earliestBack && Date.parse(line.earliestBack) > nowMs ? line.earliestBack : null;
  return { notBefore, needs };
}

/** Whether every order holding the line out is ready: operations may release it now. */
export const lineReady = (line: Pick<StatusLine, 'orders'>): boolean => line.orders.length > 0 && line.orders.every((o) => o.ready);
