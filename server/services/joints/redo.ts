// A joint that went wrong (cement dried before assembly, pipe not bottomed) is cut out: the task is
// marked for redo with a reason, its holds are void, and a new task points back at it. An order
// that was curing goes back to in work, since a joint is to be made again.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { Hold, JointStepRecord } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { readProtection, WORK_OPEN } from '@server/services/lockout/protection';
import type { WorkOrder } from '@server/db/models/work-order';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { findOrder, jointLabel } from '@server/services/work-orders/order-facts';
import { moveTo, stateWords } from '@server/services/work-orders/states';
import type { Me } from '@shared/schemas/roles';
import { findTask } from './joint-view';

/** Marks the joint for redo and returns the new task's id. */
export async function redoJoint(me: Me, taskId: string, reason: string, t: Transaction): Promise<string> {
  const found = await findTask(taskId, t);
  const order = await findOrder(found.workOrderId, t, { lock: true });
  const task = await findTask(taskId, t, true);
  const label = jointLabel(task.number);
  if (task.redoneAt) throw AppError.conflict(`${label} was already cut out for redo.`);
  if (!WORK_OPEN.includes(order.state)) throw AppError.conflict(`${order.number} is ${stateWords(order.state)}; a joint is cut out only while the section is isolated and worked on.`);
  const p = await readProtection(order.id, t);
  if (!p.isolated) throw AppError.conflict(`${order.number}'s section is not isolated now: ${p.missing.join(' ')}`);
  if ((await JointStepRecord.count({ where: { jointTaskId: task.id }, transaction: t })) === 0) {
    throw AppError.conflict(`${label} has no step recorded yet; there is nothing to cut out.`);
  }
  const { replacement, voided } = await cutOutJoint(me, order, task, reason, t);
  const before = order.state;
  const state = order.state === 'curing' ? moveTo(order, 'in-work') : order.state;
  await order.update({ state, version: order.version + 1 }, { transaction: t });
  await recordAudit({
    actorId: me.id, action: 'joint-redo', entity: AUDIT_ENTITY, entityId: order.id,
    before: { jointTask: label, ...(state !== before ? { state: before } : {}) },
    after: { jointTask: label, replacedBy: jointLabel(replacement.number), reason, holdsVoided: voided, ...(state !== before ? { state } : {}) },
  }, t);
  return replacement.id;
}

/**
 * Cuts a joint out: marks it for redo with the reason, voids its holds, and makes the task that
 * replaces it (the next number of the order, the same fitting, size and fitter). The caller holds
 * the order's row lock, moves its state and writes the audit entry.
 */
export async function cutOutJoint(me: Me, order: WorkOrder, task: JointTask, reason: string, t: Transaction): Promise<{ replacement: JointTask; voided: number }> {
  const at = now();
  const label = jointLabel(task.number);
  await task.update({ redoReason: reason, redoneAt: at, redoneById: me.id }, { transaction: t });
  const [voided] = await Hold.update(
    { status: 'void', voidReason: `${label} cut out for redo: ${reason}` },
    { where: { jointTaskId: task.id, status: { [Op.in]: ['running', 'awaiting-engineering'] } }, transaction: t },
  );
  const number = order.lastJointNumber + 1;
  const replacement = await JointTask.create({
    workOrderId: order.id, number, lineId: task.lineId, fittingKind: task.fittingKind, nominalSize: task.nominalSize, nominalSizeIn: task.nominalSizeIn,
    reducingSize: task.reducingSize, reducingSizeIn: task.reducingSizeIn, fitterId: task.fitterId, replacesTaskId: task.id,
  }, { transaction: t });
  await order.update({ lastJointNumber: number }, { transaction: t });
  return { replacement, voided };
}
