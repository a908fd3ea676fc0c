// A work order as the API shows it: the order, its lines, joint tasks and isolation plan, what the
// engine computes for it, the orders it overlaps, and its history from the audit log.

import { Op } from 'sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Hold, JointStepRecord } from '@server/db/models/joint-record';
import { Person } from '@server/db/models/person';
import { overlapsOf } from '@server/db/queries/work-orders';
import { toLineDto } from '@server/services/line-service';
import { holdDtos } from '@server/services/joints/joint-view';
import type { IsolationPlanEntryDto } from '@shared/schemas/isolation-plans';
import type { JointTaskDto } from '@shared/schemas/joint-tasks';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { compute, loadFacts, type JointRow, type OrderFacts, type PlanRow } from './order-facts';

/** The audit entries of a work order are written with this entity name, the order's id as entity id. */
export const AUDIT_ENTITY = 'work-order';

export function toJointTaskDto(j: JointRow, stepsDone = 0): JointTaskDto {
  return {
    id: j.id,
    label: j.label,
    number: j.number,
    lineId: j.lineId,
    lineNumber: j.lineNumber,
    fittingKind: j.fittingKind,
    nominalSize: j.nominalSize,
    reducingSize: j.reducingSize,
    jointSize: j.jointSize,
    fitter: j.fitterId ? { id: j.fitterId, name: j.fitterName ?? '' } : null,
    replacesTaskId: j.replacesTaskId,
    stepsDone,
    redone: !!j.redoneAt,
  };
}

export function toPlanEntryDto(e: PlanRow): IsolationPlanEntryDto {
  return { id: e.id, isolationPointId: e.isolationPointId, lineId: e.lineId, lineNumber: e.lineNumber, tag: e.tag, kind: e.kind, requiredPosition: e.requiredPosition };
}

async function history(orderId: string): Promise<WorkOrderDto['history']> {
  const entries = await AuditEntry.findAll({ where: { entity: AUDIT_ENTITY, entityId: orderId }, order: [['id', 'ASC']] });
  const ids = [...new Set(entries.map((e) => e.actorId).filter((x): x is string => !!x))];
  const names = new Map((await Person.findAll({ where: { id: { [Op.in]: ids } } })).map((p) => [p.id, p.name]));
  return entries.map((e) => ({
    at: e.at.toISOString(),
    action: e.action,
    actor: e.actorId ? { id: e.actorId, name: names.get(e.actorId) ?? '' } : null,
    before: e.before,
    after: e.after,
  }));
}

export async function toOrderDto(f: OrderFacts): Promise<WorkOrderDto> {
  const { order } = f;
  const taskIds = f.joints.map((j) => j.id);
  const [creator, overlaps, past, steps, holds] = await Promise.all([
    Person.findByPk(order.createdById), overlapsOf([order.id]), history(order.id),
    JointStepRecord.count({ where: { jointTaskId: { [Op.in]: taskIds } }, group: ['jointTaskId'] }),
    Hold.findAll({ where: { workOrderId: order.id }, order: [['createdAt', 'ASC'], ['kind', 'DESC']] }),
  ]);
  const done = new Map(steps.map((s) => [String(s.jointTaskId), Number(s.count)]));
  return {
    id: order.id,
    number: order.number,
    kind: order.kind,
    priority: order.priority,
    state: order.state,
    scope: order.scope,
    requestedBy: order.requestedBy,
    windowStart: order.windowStart?.toISOString() ?? null,
    windowEnd: order.windowEnd?.toISOString() ?? null,
    forecastLowF: order.forecastLowF,
    forecastHighRh: order.forecastHighRh,
    testPressurePsi: order.testPressurePsi,
    componentRatingPsi: order.componentRatingPsi,
    lateReason: order.lateReason,
    cancelReason: order.cancelReason,
    plannedAt: order.plannedAt?.toISOString() ?? null,
    cancelledAt: order.cancelledAt?.toISOString() ?? null,
    createdBy: { id: order.createdById, name: creator?.name ?? '' },
    version: order.version,
    createdAt: order.createdAt.toISOString(),
    updatedAt: order.updatedAt.toISOString(),
    lines: f.lines.map((l) => toLineDto(l)),
    jointTasks: f.joints.map((j) => toJointTaskDto(j, done.get(j.id) ?? 0)),
    isolationPlan: f.plan.map(toPlanEntryDto),
    ...compute(f),
    overlaps: overlaps.get(order.id) ?? [],
    history: past,
    holds: await holdDtos(holds),
  };
}

/** One order with everything the order's page shows; 404 when there is none. */
export async function getOrder(id: string): Promise<WorkOrderDto> {
  return toOrderDto(await loadFacts(id));
}
