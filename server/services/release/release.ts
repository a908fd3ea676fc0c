// Operations' release (DESIGN.md sections 7 and 10): one transaction holding the order's row lock,
// so two releases cannot both pass. Every reason against it is read inside that transaction from
// the database and the clock, and all of them are named. The lines go back into service, unless
// another order still holds one of them out; the order's lockout is closed.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { Line } from '@server/db/models/line';
import { sequelize } from '@server/db/sequelize';
import { IsolationVerification } from '@server/db/models/lockout';
import { Release } from '@server/db/models/release';
import { WorkOrder, WorkOrderLine } from '@server/db/models/work-order';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { findOrder } from '@server/services/work-orders/order-facts';
import { moveTo } from '@server/services/work-orders/states';
import type { ReleaseBody } from '@shared/schemas/release';
import type { Me } from '@shared/schemas/roles';
import { releaseBlockers } from './blockers';

/** States in which an order holds its lines out of service. */
const HOLDS_LINE_OUT = ['isolated', 'in-work', 'curing', 'testing', 'ready'];

/** Releases the order in a transaction of its own; answers the order's state after. */
export async function releaseOrder(me: Me, orderId: string, body: ReleaseBody): Promise<{ id: string; number: string; state: string; releasedAt: string | null }> {
  await sequelize.transaction((t) => releaseInTransaction(me, orderId, body, t));
  const order = await findOrder(orderId);
  return { id: order.id, number: order.number, state: order.state, releasedAt: order.releasedAt?.toISOString() ?? null };
}

export async function releaseInTransaction(me: Me, orderId: string, body: ReleaseBody, t: Transaction): Promise<void> {
  const order = await findOrder(orderId, t, { lock: true });
  const blockers = await releaseBlockers(order, t);
  if (blockers.length) {
    throw new AppError(409, 'release_refused', `${order.number} cannot be released: ${blockers.map((b) => b.message).join(' ')}`, { reasons: blockers.map((b) => b.message) });
  }
  const at = now();
  const { notes, ...checklist } = body;
  await Release.create({ workOrderId: order.id, releasedById: me.id, releasedAt: at, checklist, notes: notes ?? null }, { transaction: t });
  await order.update({ state: moveTo(order, 'released'), releasedAt: at, version: order.version + 1 }, { transaction: t });
  await IsolationVerification.update({ supersededAt: at }, { where: { workOrderId: order.id, supersededAt: { [Op.is]: null } }, transaction: t });
  const lineIds = (await WorkOrderLine.findAll({ where: { workOrderId: order.id }, transaction: t })).map((l) => l.lineId);
  const stillOut = await WorkOrderLine.findAll({
    where: { lineId: { [Op.in]: lineIds }, workOrderId: { [Op.ne]: order.id } },
    include: [],
    transaction: t,
  });
  const othersOut = new Set<string>();
  if (stillOut.length) {
    const open = await WorkOrder.findAll({ where: { id: { [Op.in]: stillOut.map((l) => l.workOrderId) }, state: { [Op.in]: HOLDS_LINE_OUT } }, attributes: ['id'], transaction: t });
    for (const l of stillOut) if (open.some((o) => o.id === l.workOrderId)) othersOut.add(l.lineId);
  }
  const back = lineIds.filter((id) => !othersOut.has(id));
  await Line.update({ status: 'in-service' }, { where: { id: { [Op.in]: back } }, transaction: t });
  await recordAudit({
    actorId: me.id, action: 'order-released', entity: AUDIT_ENTITY, entityId: order.id,
    before: { state: 'ready' }, after: { state: 'released', releasedBy: me.name, checklist, notes: notes ?? null, linesInService: back.length },
  }, t);
}
