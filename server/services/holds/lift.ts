// Lifting a timed hold when its end has come, by the database and the clock: the delayed job and
// the sweep both call liftHold, which changes nothing for a hold not yet due, already ended or
// void. When the last cure hold of the order's live joints ends, a curing order moves to testing,
// in the same transaction; the fitters and planner hear that holds ended, and the test is ready.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { sequelize } from '@server/db/sequelize';
import { Hold } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { WorkOrder } from '@server/db/models/work-order';
import { logger } from '@server/logger';
import { scheduleHoldLift } from '@server/queues/holds';
import { enqueueMail } from '@server/queues/mail';
import { recordAudit } from '@server/services/audit-service';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { jointLabel } from '@server/services/work-orders/order-facts';
import { moveTo } from '@server/services/work-orders/states';

export type LiftedBy = 'worker' | 'sweep';

/** Whether every cure hold of the order's live joints (those not cut out) has ended: the test may start. */
export async function everyCureEnded(orderId: string, t: Transaction): Promise<boolean> {
  const live = await JointTask.findAll({ where: { workOrderId: orderId, redoneAt: { [Op.is]: null } }, attributes: ['id'], transaction: t });
  if (!live.length) return false;
  const ids = live.map((j) => j.id);
  const ended = await Hold.count({ where: { jointTaskId: { [Op.in]: ids }, kind: 'cure', status: 'ended' }, transaction: t });
  const open = await Hold.count({ where: { jointTaskId: { [Op.in]: ids }, kind: 'cure', status: { [Op.in]: ['running', 'awaiting-engineering'] } }, transaction: t });
  return open === 0 && ended >= ids.length;
}

/**
 * Lifts hold `holdId` if it is running and due by the clock. Returns what happened; a hold not yet
 * due comes back as `notYet` with its end, so the job can be put back for then.
 */
export async function liftHold(holdId: string, by: LiftedBy): Promise<{ lifted: boolean; notYet?: Date; orderMoved?: boolean }> {
  const result = await sequelize.transaction(async (t) => {
    const first = await Hold.findByPk(holdId, { transaction: t });
    if (!first || first.status !== 'running' || !first.endsAt) return { lifted: false };
    // The order's row lock first, as every writer of the order takes it: lifts and releases queue behind each other.
    const order = await WorkOrder.findByPk(first.workOrderId, { transaction: t, lock: t.LOCK.UPDATE });
    const hold = await Hold.findByPk(holdId, { transaction: t, lock: t.LOCK.UPDATE });
    if (!order || !hold || hold.status !== 'running' || !hold.endsAt) return { lifted: false };
    const at = now();
    if (hold.endsAt.getTime() > at.getTime()) return { lifted: false, notYet: hold.endsAt };
    await hold.update({ status: 'ended', endedAt: at, endedBy: by }, { transaction: t });
    const task = hold.jointTaskId ? await JointTask.findByPk(hold.jointTaskId, { transaction: t }) : null;
    const before = order.state;
    const moved = order.state === 'curing' && hold.kind === 'cure' && (await everyCureEnded(order.id, t));
    if (moved) await order.update({ state: moveTo(order, 'testing'), version: order.version + 1 }, { transaction: t });
    await recordAudit({
      actorId: null, action: 'hold-ended', entity: AUDIT_ENTITY, entityId: order.id,
      before: moved ? { state: before } : null,
      after: { jointTask: task ? jointLabel(task.number) : null, hold: hold.kind, endedAt: at.toISOString(), due: hold.endsAt.toISOString(), by, ...(moved ? { state: 'testing' } : {}) },
    }, t);
    if (hold.kind === 'cure') t.afterCommit(() => void enqueueMail({ purpose: 'hold-lifted', recordId: hold.id }).catch((err) => logger.error({ err, holdId }, 'could not queue the hold mail')));
    // record id <order>.<version>: an order tested again after a failed test is told again
    if (moved) t.afterCommit(() => void enqueueMail({ purpose: 'test-ready', recordId: `${order.id}.${order.version}` }).catch((err) => logger.error({ err, orderId: order.id }, 'could not queue the test-ready mail')));
    return { lifted: true, orderMoved: moved };
  });
  return result;
}

/** The sweep's part: every running hold due by the clock, lifted; PostgreSQL is the truth. */
export async function liftDueHolds(): Promise<{ lifted: string[] }> {
  const due = await Hold.findAll({ where: { status: 'running', endsAt: { [Op.lte]: now() } }, attributes: ['id'], order: [['endsAt', 'ASC']], limit: 500 });
  const lifted: string[] = [];
  for (const h of due) if ((await liftHold(h.id, 'sweep')).lifted) lifted.push(h.id);
  return { lifted };
}

/** Queues the lift of each running hold at its end (after the transaction that made them commits). */
export function scheduleLifts(holds: readonly Pick<Hold, 'id' | 'status' | 'endsAt'>[], t?: Transaction): void {
  const schedule = () => {
    for (const h of holds) {
      if (h.status !== 'running' || !h.endsAt) continue;
      void scheduleHoldLift(h.id, h.endsAt.getTime() - now().getTime()).catch((err) => logger.error({ err, holdId: h.id }, 'could not queue the hold lift; the sweep will lift it'));
    }
  };
  if (t) t.afterCommit(schedule);
  else schedule();
}
