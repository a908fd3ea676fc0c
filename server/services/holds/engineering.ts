// A supervisor's engineering cure time (DESIGN.md section 4): where the trade engine refused a joint
// (outside the published tables), the hold waits until a supervisor enters set and cure minutes
// with a written reason. The hold then runs from the assembly, its delayed job is queued, and its
// basis says it is an engineering entry, by whom and why.

import type { Transaction } from 'sequelize';
import { Hold } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { findOrder, jointLabel } from '@server/services/work-orders/order-facts';
import type { EngineeringEntry } from '@shared/schemas/joint-steps';
import type { Me } from '@shared/schemas/roles';
import { scheduleLifts } from './lift';

const MINUTE = 60_000;

/** Enters the cure time on the joint's waiting set and cure holds (given either one); returns the joint's id. */
export async function enterEngineeringCureTime(me: Me, holdId: string, body: EngineeringEntry, t: Transaction): Promise<string> {
  const first = await Hold.findByPk(holdId, { transaction: t });
  if (!first || !first.jointTaskId) throw AppError.notFound('There is no such hold.');
  const order = await findOrder(first.workOrderId, t, { lock: true });
  const holds = await Hold.findAll({ where: { jointTaskId: first.jointTaskId, status: 'awaiting-engineering' }, transaction: t, lock: t.LOCK.UPDATE });
  if (!holds.length) throw AppError.conflict('That joint has no hold waiting for an engineering cure time; the published tables gave its times.');
  const task = (await JointTask.findByPk(first.jointTaskId, { transaction: t }))!;
  const basis = `Engineering cure time entered by ${me.name}: ${body.reason} (the published tables refused: ${holds[0]!.basis})`;
  for (const h of holds) {
    const minutes = h.kind === 'set' ? body.setMinutes : body.cureMinutes;
    await h.update({
      status: 'running', endsAt: new Date(h.startsAt.getTime() + minutes * MINUTE), basis, source: 'engineering entry',
      engineeringById: me.id, engineeringReason: body.reason, engineeringMinutes: minutes,
    }, { transaction: t });
  }
  scheduleLifts(holds, t);
  await recordAudit({
    actorId: me.id, action: 'engineering-cure-time', entity: AUDIT_ENTITY, entityId: order.id,
    after: { jointTask: jointLabel(task.number), setMinutes: body.setMinutes, cureMinutes: body.cureMinutes, reason: body.reason },
  }, t);
  return task.id;
}
