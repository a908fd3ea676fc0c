// The verification of zero energy ((d)(6)): an authorized person records each point's position as
// found and how the section was proven dead. With every point protected, it moves a planned order
// to isolated and its lines to locked out, in the same transaction.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { Line } from '@server/db/models/line';
import { IsolationVerification } from '@server/db/models/lockout';
import { WorkOrderLine } from '@server/db/models/work-order';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { findOrder } from '@server/services/work-orders/order-facts';
import { moveTo, stateWords } from '@server/services/work-orders/states';
import type { Verification } from '@shared/schemas/lockout';
import type { Me } from '@shared/schemas/roles';
import { readProtection } from './protection';

const same = (a: string, b: string) => a.trim().toLowerCase() === b.trim().toLowerCase();

export async function verifyIsolation(me: Me, orderId: string, body: Verification, t: Transaction): Promise<void> {
  const order = await findOrder(orderId, t, { lock: true });
  if (!['planned', 'in-work', 'testing'].includes(order.state)) {
    throw AppError.conflict(`${order.number} is ${stateWords(order.state)}; zero energy is verified on a planned order, once every point carries a lock.`);
  }
  const p = await readProtection(order.id, t);
  if (p.verification) throw AppError.conflict(`Zero energy was already verified for ${order.number} at ${p.verification.verifiedAt.toISOString()}.`);
  const unprotected = p.missing.filter((m) => !m.startsWith('Zero energy'));
  if (unprotected.length) throw AppError.conflict(`Zero energy cannot be verified yet: ${unprotected.join(' ')}`);
  const given = new Map(body.points.map((x) => [x.entryId, x.positionFound]));
  const unknown = body.points.filter((x) => !p.entries.some((e) => e.id === x.entryId));
  if (unknown.length) throw AppError.badRequest(`Some of those points are not in ${order.number}'s isolation plan.`, { points: ['not a point of this order'] });
  const unstated = p.entries.filter((e) => !given.has(e.id)).map((e) => e.tag);
  if (unstated.length) throw AppError.badRequest(`Record the position found at every point; missing: ${unstated.join(', ')}.`, { points: [`missing ${unstated.join(', ')}`] });
  const wrong = p.entries.filter((e) => !same(given.get(e.id)!, e.requiredPosition));
  if (wrong.length) {
    const list = wrong.map((e) => `${e.tag} was found ${given.get(e.id)!.trim()} and must be ${e.requiredPosition}`).join('; ');
    throw new AppError(409, 'not_isolated', `The section is not isolated: ${list}. Put each point in its required position, then verify again.`);
  }
  const points = p.entries.map((e) => ({ entryId: e.id, tag: e.tag, positionFound: given.get(e.id)!.trim() }));
  await IsolationVerification.create({ workOrderId: order.id, verifiedById: me.id, verifiedAt: now(), method: body.method, reading: body.reading, points }, { transaction: t });
  const before = order.state;
  if (order.state === 'planned') {
    await order.update({ state: moveTo(order, 'isolated'), version: order.version + 1 }, { transaction: t });
    const lineIds = (await WorkOrderLine.findAll({ where: { workOrderId: order.id }, transaction: t })).map((l) => l.lineId);
    await Line.update({ status: 'locked-out' }, { where: { id: { [Op.in]: lineIds } }, transaction: t });
  }
  await recordAudit({
    actorId: me.id, action: 'isolation-verified', entity: AUDIT_ENTITY, entityId: order.id,
    before: { state: before }, after: { state: order.state, verifiedBy: me.name, method: body.method, reading: body.reading, points: points.map(({ tag, positionFound }) => ({ tag, positionFound })) },
  }, t);
}
