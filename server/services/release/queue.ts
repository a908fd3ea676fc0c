// The release queue for operations: every order whose lines are out for it, ready ones first, each
// with every reason it cannot go back yet and the latest hold end by the clock.

import { Op } from 'sequelize';
import { now } from '@server/clock';
import { WorkOrder } from '@server/db/models/work-order';
import { orderLines } from '@server/services/work-orders/order-facts';
import type { ReleaseQueueDto } from '@shared/schemas/release';
import { activeHolds, releaseBlockers } from './blockers';

const IN_QUEUE = ['isolated', 'in-work', 'curing', 'testing', 'ready'];

export async function releaseQueue(): Promise<ReleaseQueueDto> {
  const orders = await WorkOrder.findAll({ where: { state: { [Op.in]: IN_QUEUE } }, order: [['windowEnd', 'ASC'], ['number', 'ASC']] });
  const at = now();
  const rows = [];
  for (const order of orders) {
    const [blockers, holds, lines] = [await releaseBlockers(order), await activeHolds(order.id, at), await orderLines(order.id)];
    const ends = holds.map((h) => h.hold.endsAt?.getTime()).filter((x): x is number => x !== undefined);
    rows.push({
      id: order.id, number: order.number, state: order.state, lines: lines.map((l) => l.lineNumber), windowEnd: order.windowEnd?.toISOString() ?? null,
      latestHoldEnd: ends.length ? new Date(Math.max(...ends)).toISOString() : null, ready: blockers.length === 0, blockers,
    });
  }
  rows.sort((a, b) => Number(b.ready) - Number(a.ready));
  return { orders: rows };
}
