// The release queue for operations: every order whose lines are out for it, ready ones first, each
// with every reason it cannot go back yet and the latest hold end by the clock. All the orders' facts
// are read at once (queue-facts.ts), so the queue costs the same handful of queries however long it is.

import { Op } from 'sequelize';
import { now } from '@server/clock';
import { currentSnapshot, keptEntry, type ChangeTopic, type ChangeView, type KeptAnswer } from '@server/db/change-log';
import { WorkOrder } from '@server/db/models/work-order';
import type { ReleaseBlocker, ReleaseQueueDto } from '@shared/schemas/release';
import { queueFacts } from './queue-facts';

/** Everything the queue and the status board read: orders, the register, lockout, joints, holds, tests. */
export const RELEASE_TOPICS: readonly ChangeTopic[] = ['work-orders', 'lines', 'release'];

/** When the first running hold among these blockers ends: the answer is true by the clock until then. */
export function firstHoldEnd(blockers: readonly ReleaseBlocker[]): Date | null {
  const ends = blockers.flatMap((b) => (b.kind === 'hold' && b.until ? [Date.parse(b.until)] : []));
  return ends.length ? new Date(Math.min(...ends)) : null;
}

/**
 * The queue, kept until anything it reads changes (the request's freshness view,
 * server/db/change-log.ts) or the first running hold in it ends, whichever is sooner.
 */
export function keptReleaseQueue(view?: ChangeView): Promise<KeptAnswer<ReleaseQueueDto>> {
  return keptEntry('release-queue', RELEASE_TOPICS, async () => ({ snapshot: await currentSnapshot(), value: await releaseQueue() }), {
    view,
    until: (q) => firstHoldEnd(q.orders.flatMap((o) => o.blockers)),
  });
}

const IN_QUEUE = ['isolated', 'in-work', 'curing', 'testing', 'ready'];

export async function releaseQueue(): Promise<ReleaseQueueDto> {
  const orders = await WorkOrder.findAll({ where: { state: { [Op.in]: IN_QUEUE } }, order: [['windowEnd', 'ASC'], ['number', 'ASC']] });
  const facts = await queueFacts(orders, now());
  const rows = orders.map((order) => {
    const { blockers, holds, lines } = facts.get(order.id)!;
    const ends = holds.map((h) => h.hold.endsAt?.getTime()).filter((x): x is number => x !== undefined);
    return {
      id: order.id, number: order.number, state: order.state, lines: lines.map((l) => l.lineNumber), windowEnd: order.windowEnd?.toISOString() ?? null,
      latestHoldEnd: ends.length ? new Date(Math.max(...ends)).toISOString() : null, ready: blockers.length === 0, blockers,
    };
  });
  rows.sort((a, b) => Number(b.ready) - Number(a.ready));
  return { orders: rows };
}
