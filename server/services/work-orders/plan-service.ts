// Submitting a plan (draft → planned) and cancelling an order (draft or planned → cancelled).
// The plan is checked from the facts and the engine in the same transaction that moves the state;
// a plan that does not fit its window needs a written reason, and operations and the requester
// are told by mail once it is committed.

import { Op } from 'sequelize';
import { now } from '@server/clock';
import { Hold } from '@server/db/models/joint-record';
import { Line } from '@server/db/models/line';
import { WorkOrderLine } from '@server/db/models/work-order';
import { sequelize } from '@server/db/sequelize';
import { AppError } from '@server/errors';
import { logger } from '@server/logger';
import { enqueueMail } from '@server/queues/mail';
import { recordAudit } from '@server/services/audit-service';
import { readProtection } from '@server/services/lockout/protection';
import { may, refusalFor } from '@shared/permissions';
import type { Me } from '@shared/schemas/roles';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { AUDIT_ENTITY, getOrder } from './order-dto';
import { compute, findOrder, loadFacts, type Computed, type OrderFacts } from './order-facts';
import { plantTime } from './plant-time';
import { moveTo } from './states';

/** What keeps the plan from being submitted, each as a sentence; empty when it is complete. */
export function planGaps(f: OrderFacts, c: Computed): string[] {
  const { order } = f;
  const gaps: string[] = [];
  if (!f.lines.length) gaps.push('It has no lines.');
  if (!f.joints.length) gaps.push('It has no joint tasks.');
  if (!f.plan.length) gaps.push('It has no isolation plan.');
  else if (!f.plan.some((e) => e.isolationPointId)) gaps.push('Its isolation plan has drain and vent points only: it needs a valve, blind or disconnect.');
  if (!order.windowStart) gaps.push('No repair window is booked.');
  if (order.forecastLowF === null || order.forecastHighRh === null) gaps.push('The cure conditions are not given (forecast lowest temperature and highest humidity).');
  gaps.push(...c.materials.problems.map((p) => `Materials: ${p}`));
  gaps.push(...c.testPressure.problems.map((p) => `Test pressure: ${p}`));
  const whoDecides = { supervisor: 'a supervisor decides', planner: 'the planner decides' } as const;
  gaps.push(...c.windowPlan.refusals.map((r) => `Cure: ${r.reason} (${whoDecides[r.whoMayDecide]})`));
  return gaps;
}

/** Record id of the late-plan mail: the order and the version planning gave it, so each late plan is told once. */
export const lateMailRecord = (orderId: string, version: number) => `${orderId}.${version}`;

export async function submitPlan(me: Me, id: string, body: { lateReason?: string }): Promise<WorkOrderDto> {
  const told = await sequelize.transaction(async (t) => {
    const order = await findOrder(id, t, { lock: true });
    const state = moveTo(order, 'planned');
    const facts = await loadFacts(id, t);
    const computed = compute(facts);
    const gaps = planGaps(facts, computed);
    if (gaps.length) throw new AppError(409, 'plan_incomplete', `${order.number} cannot be planned yet. ${gaps.join(' ')}`, { plan: gaps });
    const plan = computed.windowPlan;
    const late = plan.fits === false;
    if (late && !body.lateReason) {
      const at = (iso: string | null | undefined) => (iso ? plantTime(iso, plan.timeZone) : '?');
      const why = `The plan does not fit the window: the earliest release is ${at(plan.earliestRelease)}, after the window's end at ${at(plan.window?.end)}` +
        ` (${plan.late?.stepLabel.toLowerCase()} runs past it). Give a written reason to plan it anyway, or change the window.`;
      throw new AppError(409, 'plan_late', why, { lateReason: ['a plan that does not fit its window needs a written reason'] });
    }
    const lateReason = late ? body.lateReason! : null;
    await order.update({ state, plannedAt: now(), lateReason, version: order.version + 1 }, { transaction: t });
    const after = {
      state, version: order.version, fits: plan.fits, earliestRelease: plan.earliestRelease, windowEnd: plan.window?.end ?? null, lateReason,
      lateStep: plan.late?.step ?? null, neededWindowEnd: plan.late?.neededWindowEnd ?? null, testPsi: computed.testPressure.testPsi,
    };
    await recordAudit({ actorId: me.id, action: 'work-order-planned', entity: AUDIT_ENTITY, entityId: id, before: { state: 'draft' }, after }, t);
    return late ? lateMailRecord(id, order.version) : null;
  });
  // After the commit: the mail is about a plan that exists. A lost enqueue costs a mail, not the plan.
  if (told) await enqueueMail({ purpose: 'work-order-planned-late', recordId: told }).catch((err) => logger.error({ err, orderId: id }, 'could not queue the late-plan mail'));
  return getOrder(id);
}

export async function cancelOrder(me: Me, id: string, reason: string): Promise<WorkOrderDto> {
  await sequelize.transaction(async (t) => {
    const order = await findOrder(id, t, { lock: true });
    const before = order.state;
    const afterIsolation = before !== 'draft' && before !== 'planned' && before !== 'cancelled' && before !== 'closed';
    if (afterIsolation && !may(me, 'workOrders.cancelAfterIsolation')) throw AppError.forbidden(refusalFor('workOrders.cancelAfterIsolation', me.roles));
    const state = moveTo(order, 'cancelled');
    const { locks, entries, box } = await readProtection(order.id, t);
    if (locks.length) {
      const where = (l: (typeof locks)[number]) => (l.lockBoxId ? `lock box ${box?.label ?? ''}`.trim() : (entries.find((e) => e.id === l.isolationPlanEntryId)?.tag ?? '?'));
      throw AppError.conflict(`${order.number} is cancelled only once every lock is off; still on: ${locks.map((l) => `${l.lockNumber} on ${where(l)}`).join(', ')}.`);
    }
    await order.update({ state, cancelReason: reason, cancelledAt: now(), version: order.version + 1 }, { transaction: t });
    if (afterIsolation) {
      // The section was opened and is not released: its lines stay out of service until someone puts them back.
      const lineIds = (await WorkOrderLine.findAll({ where: { workOrderId: order.id }, transaction: t })).map((l) => l.lineId);
      await Line.update({ status: 'out-of-service' }, { where: { id: { [Op.in]: lineIds } }, transaction: t });
      await Hold.update({ status: 'void', voidReason: `${order.number} cancelled: ${reason}` }, { where: { workOrderId: order.id, status: { [Op.in]: ['running', 'awaiting-engineering'] } }, transaction: t });
    }
    await recordAudit({ actorId: me.id, action: 'work-order-cancelled', entity: AUDIT_ENTITY, entityId: id, before: { state: before }, after: { state, reason } }, t);
  });
  return getOrder(id);
}
