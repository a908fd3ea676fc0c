// Closing an order (DESIGN.md section 7): the planner closes a released order once its record is
// complete — every live joint with all its steps and its photos (depth marks and the finished
// joint), and a passed hydrostatic test where one is required. What is missing is named.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { sequelize } from '@server/db/sequelize';
import { JointStepRecord, Photo } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { PressureTest } from '@server/db/models/release';
import type { WorkOrder } from '@server/db/models/work-order';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { compute, findOrder, jointLabel, loadFacts } from '@server/services/work-orders/order-facts';
import { moveTo } from '@server/services/work-orders/states';
import { JOINT_STEPS, JOINT_STEP_LABELS, PHOTO_STEPS } from '@shared/schemas/joint-steps';
import type { Me } from '@shared/schemas/roles';

/** Sentences naming what the order's record still lacks; empty when it is complete. */
export async function recordGaps(order: WorkOrder, t?: Transaction): Promise<string[]> {
  const gaps: string[] = [];
  const live = await JointTask.findAll({ where: { workOrderId: order.id, redoneAt: { [Op.is]: null } }, order: [['number', 'ASC']], transaction: t });
  const ids = live.map((j) => j.id);
  const steps = await JointStepRecord.findAll({ where: { jointTaskId: { [Op.in]: ids } }, attributes: ['jointTaskId', 'step'], transaction: t });
  const photos = await Photo.findAll({ where: { jointTaskId: { [Op.in]: ids } }, attributes: ['jointTaskId', 'step'], transaction: t });
  for (const j of live) {
    const missing = JOINT_STEPS.filter((s) => !steps.some((r) => r.jointTaskId === j.id && r.step === s));
    if (missing.length) gaps.push(`${jointLabel(j.number)} lacks ${missing.map((s) => JOINT_STEP_LABELS[s].toLowerCase()).join(', ')}.`);
    const noPhoto = PHOTO_STEPS.filter((s) => !photos.some((p) => p.jointTaskId === j.id && p.step === s));
    if (noPhoto.length) gaps.push(`${jointLabel(j.number)} has no photo of ${noPhoto.map((s) => (s === 'wipe' ? 'the finished joint' : 'the depth marks')).join(' or ')}.`);
  }
  const { testPressure } = compute(await loadFacts(order.id, t));
  if (testPressure.required) {
    const passed = await PressureTest.count({ where: { workOrderId: order.id, result: 'passed' }, transaction: t });
    if (!passed) gaps.push('No passed hydrostatic test is recorded.');
  }
  return gaps;
}

export async function closeOrder(me: Me, orderId: string): Promise<void> {
  await sequelize.transaction(async (t) => {
    const order = await findOrder(orderId, t, { lock: true });
    const state = moveTo(order, 'closed');
    const gaps = await recordGaps(order, t);
    if (gaps.length) throw new AppError(409, 'record_incomplete', `${order.number}'s record is not complete: ${gaps.join(' ')}`, { gaps });
    await order.update({ state, version: order.version + 1 }, { transaction: t });
    await recordAudit({ actorId: me.id, action: 'work-order-closed', entity: AUDIT_ENTITY, entityId: order.id, before: { state: 'released' }, after: { state, closedAt: now().toISOString() } }, t);
  });
}

/** What the order's record lacks, for its page. */
export async function orderRecordGaps(orderId: string): Promise<string[]> {
  return recordGaps(await findOrder(orderId));
}
