// An order's isolation plan: the points that must stand in their isolating position while the
// section is worked on. The pre-fill offers the register's points of the order's lines; a PUT
// replaces the whole plan. A valve, blind or disconnect the register lacks joins the register
// (audited) in the same transaction; drain and vent points stay on the plan only.

import { Op, type Transaction } from 'sequelize';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { IsolationPoint } from '@server/db/models/isolation-point';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import {
  IN_SERVICE_POSITION, REQUIRED_POSITION, type IsolationPlanBody, type IsolationPlanEntryInput, type IsolationPlanResponse, type PlanPointKind,
} from '@shared/schemas/isolation-plans';
import type { Me } from '@shared/schemas/roles';
import { toPlanEntryDto } from './order-dto';
import { loadFacts, orderLines, type LineRow } from './order-facts';
import { editOrder } from './order-writes';

type NewPoint = Extract<IsolationPlanEntryInput, { kind: 'valve' | 'blind' | 'disconnect' }>;
type DrainOrVent = Extract<IsolationPlanEntryInput, { kind: 'drain' | 'vent' }>;
const isDrainOrVent = (e: NewPoint | DrainOrVent): e is DrainOrVent => e.kind === 'drain' || e.kind === 'vent';

interface Resolved {
  isolationPointId: string | null;
  lineId: string;
  tag: string;
  kind: PlanPointKind;
}

export async function getIsolationPlan(orderId: string): Promise<IsolationPlanResponse> {
  const facts = await loadFacts(orderId);
  const points = await IsolationPoint.findAll({ where: { lineId: { [Op.in]: facts.lines.map((l) => l.id) } }, order: [['tag', 'ASC']] });
  const lineNumber = new Map(facts.lines.map((l) => [l.id, l.lineNumber]));
  const inPlan = new Set(facts.plan.map((e) => e.isolationPointId));
  return {
    entries: facts.plan.map(toPlanEntryDto),
    suggested: points.map((p) => ({
      isolationPointId: p.id, lineId: p.lineId, lineNumber: lineNumber.get(p.lineId) ?? '?', tag: p.tag, kind: p.kind, requiredPosition: REQUIRED_POSITION[p.kind], inPlan: inPlan.has(p.id),
    })),
  };
}

const lineOf = (lines: LineRow[], lineId: string, field: string) => {
  const line = lines.find((l) => l.id === lineId);
  if (!line) throw AppError.badRequest('A point is on a line that is not on this order.', { [field]: ['not a line of this order'] });
  return line;
};

/** A new valve, blind or disconnect joins the register; a tag the register has on that line already is that point. */
async function registerPoint(me: Me, orderNumber: string, line: LineRow, e: NewPoint, t: Transaction) {
  const existing = await IsolationPoint.findOne({ where: { tag: e.tag }, transaction: t });
  if (existing) {
    if (existing.lineId === line.id && existing.kind === e.kind) return existing;
    throw AppError.conflict(`Tag ${e.tag} is already in the register as a ${existing.kind} on another line or of another kind; choose it from the register or use another tag.`);
  }
  const point = await IsolationPoint.create(
    { lineId: line.id, tag: e.tag, kind: e.kind, normalPosition: e.normalPosition ?? IN_SERVICE_POSITION[e.kind], notes: e.notes ?? null },
    { transaction: t },
  );
  await recordAudit(
    {
      actorId: me.id, action: 'isolation-point-added', entity: 'isolation-point', entityId: point.id,
      after: { tag: point.tag, line: line.lineNumber, kind: point.kind, normalPosition: point.normalPosition, notes: point.notes, workOrder: orderNumber },
    },
    t,
  );
  return point;
}

async function resolve(me: Me, orderNumber: string, lines: LineRow[], entries: IsolationPlanEntryInput[], t: Transaction): Promise<Resolved[]> {
  const out: Resolved[] = [];
  for (const [i, e] of entries.entries()) {
    if ('isolationPointId' in e) {
      const point = await IsolationPoint.findByPk(e.isolationPointId, { transaction: t });
      if (!point) throw AppError.badRequest('A point is not in the register.', { [`entries.${i}.isolationPointId`]: ['not in the register'] });
      const line = lines.find((l) => l.id === point.lineId);
      if (!line) throw AppError.badRequest(`${point.tag} is on a line that is not on this order.`, { [`entries.${i}.isolationPointId`]: ['on a line that is not on this order'] });
      out.push({ isolationPointId: point.id, lineId: line.id, tag: point.tag, kind: point.kind });
    } else if (isDrainOrVent(e)) {
      out.push({ isolationPointId: null, lineId: lineOf(lines, e.lineId, `entries.${i}.lineId`).id, tag: e.tag, kind: e.kind });
    } else {
      const point = await registerPoint(me, orderNumber, lineOf(lines, e.lineId, `entries.${i}.lineId`), e, t);
      out.push({ isolationPointId: point.id, lineId: point.lineId, tag: point.tag, kind: point.kind });
    }
  }
  const tags = out.map((r) => r.tag.toUpperCase());
  const twice = tags.find((tag, i) => tags.indexOf(tag) !== i);
  if (twice) throw AppError.badRequest(`${twice} is in the plan twice.`, { entries: [`${twice} is in the plan twice`] });
  return out;
}

const summary = (r: Pick<Resolved, 'tag' | 'kind'>) => `${r.tag} (${r.kind}: ${REQUIRED_POSITION[r.kind]})`;

export async function setIsolationPlan(me: Me, orderId: string, body: IsolationPlanBody): Promise<IsolationPlanResponse> {
  await editOrder(me, orderId, {}, async (order, t) => {
    const lines = await orderLines(order.id, t);
    const resolved = await resolve(me, order.number, lines, body.entries, t);
    const old = await IsolationPlanEntry.findAll({ where: { workOrderId: order.id }, order: [['sortOrder', 'ASC']], transaction: t });
    const [before, after] = [old.map(summary), resolved.map(summary)];
    if (JSON.stringify(before) === JSON.stringify(after)) return { audit: null, result: undefined };
    await IsolationPlanEntry.destroy({ where: { workOrderId: order.id }, transaction: t });
    await IsolationPlanEntry.bulkCreate(
      resolved.map((r, i) => ({ ...r, workOrderId: order.id, requiredPosition: REQUIRED_POSITION[r.kind], sortOrder: i })),
      { transaction: t },
    );
    return { audit: { action: 'isolation-plan-set', before: { isolationPlan: before }, after: { isolationPlan: after } }, result: undefined };
  });
  return getIsolationPlan(orderId);
}
