// The line status board: every line not in service, the open orders holding it out with every
// reason each cannot release yet, and the latest hold end — the soonest it can come back by the clock.

import { Op } from 'sequelize';
import { currentSnapshot, keptEntry, type ChangeView, type KeptAnswer } from '@server/db/change-log';
import { Line } from '@server/db/models/line';
import { WorkOrderLine } from '@server/db/models/work-order';
import type { LineStatusBoardDto } from '@shared/schemas/release';
import { firstHoldEnd, keptReleaseQueue, RELEASE_TOPICS } from './queue';

/** The board, kept like the release queue it is made from (server/services/release/queue.ts). */
export function keptLineStatusBoard(view?: ChangeView): Promise<KeptAnswer<LineStatusBoardDto>> {
  return keptEntry('line-status', RELEASE_TOPICS, async () => {
    const snapshot = await currentSnapshot(); // before the reads: the oldest snapshot among them
    return { snapshot, value: await lineStatusBoard(view) };
  }, { view, until: (b) => firstHoldEnd(b.lines.flatMap((l) => l.orders.flatMap((o) => o.blockers))) });
}

export async function lineStatusBoard(view?: ChangeView): Promise<LineStatusBoardDto> {
  const lines = await Line.findAll({ where: { status: { [Op.ne]: 'in-service' } }, order: [['lineNumber', 'ASC']], limit: 1000 });
  const queue = (await keptReleaseQueue(view)).value.orders;
  const links = await WorkOrderLine.findAll({ where: { lineId: { [Op.in]: lines.map((l) => l.id) }, workOrderId: { [Op.in]: queue.map((o) => o.id) } } });
  const linked = new Set(links.map((k) => `${k.lineId} ${k.workOrderId}`));
  return {
    lines: lines.map((l) => {
      const orders = queue.filter((o) => linked.has(`${l.id} ${o.id}`));
      const ends = orders.map((o) => o.latestHoldEnd).filter((x): x is string => !!x).sort();
      return {
        id: l.id, lineNumber: l.lineNumber, area: l.area, service: l.service, status: l.status as 'out-of-service' | 'locked-out',
        orders, earliestBack: ends.length ? ends[ends.length - 1]! : null,
      };
    }),
  };
}
