// The line status board: every line not in service, the open orders holding it out with every
// reason each cannot release yet, and the latest hold end — the soonest it can come back by the clock.

import { Op } from 'sequelize';
import { Line } from '@server/db/models/line';
import { WorkOrderLine } from '@server/db/models/work-order';
import type { LineStatusBoardDto } from '@shared/schemas/release';
import { releaseQueue } from './queue';

export async function lineStatusBoard(): Promise<LineStatusBoardDto> {
  const lines = await Line.findAll({ where: { status: { [Op.ne]: 'in-service' } }, order: [['lineNumber', 'ASC']], limit: 1000 });
  const queue = (await releaseQueue()).orders;
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
