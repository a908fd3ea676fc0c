// Writing and listing work orders: create with its readable number, edit (draft or planned only),
// and the list page. Joint tasks, the isolation plan, planning and cancelling have files of their own.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { sequelize } from '@server/db/sequelize';
import { Line } from '@server/db/models/line';
import { WorkOrder, WorkOrderLine } from '@server/db/models/work-order';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { JointTask } from '@server/db/models/joint-task';
import { currentSnapshot, keptEntry, untilChanged, type ChangeView, type KeptAnswer } from '@server/db/change-log';
import { countOrders, nextOrderNumber, orderPage } from '@server/db/queries/work-orders';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import type { Me } from '@shared/schemas/roles';
import type { WorkOrderCreate, WorkOrderDto, WorkOrderListQuery, WorkOrderListResponse, WorkOrderUpdate } from '@shared/schemas/work-orders';
import { AUDIT_ENTITY, getOrder } from './order-dto';
import { jointLabel, orderLines, type LineRow } from './order-facts';
import { editOrder } from './order-writes';
import { raisedTestProblem, testPressureFor } from './test-pressure';

const FIELDS = ['kind', 'priority', 'scope', 'requestedBy', 'windowStart', 'windowEnd', 'forecastLowF', 'forecastHighRh', 'testPressurePsi', 'componentRatingPsi'] as const;
type Field = (typeof FIELDS)[number];
type Values = Pick<WorkOrder, Field>;

const plain = (v: unknown) => (v instanceof Date ? v.toISOString() : v);
const same = (a: unknown, b: unknown) => plain(a) === plain(b);

/** The order's values from a body: instants as Dates. */
function valuesOf(body: Partial<WorkOrderCreate>): Partial<Values> {
  const out: Partial<Values> = {};
  for (const f of FIELDS) {
    const v = body[f];
    if (v === undefined) continue;
    Object.assign(out, { [f]: (f === 'windowStart' || f === 'windowEnd') && typeof v === 'string' ? new Date(v) : v });
  }
  return out;
}

async function linesOrRefuse(ids: string[], t: Transaction): Promise<LineRow[]> {
  const lines = await Line.findAll({ where: { id: { [Op.in]: ids } }, order: [['lineNumber', 'ASC']], transaction: t });
  const unknown = ids.filter((id) => !lines.some((l) => l.id === id));
  if (unknown.length) throw AppError.badRequest('Some of the lines are not in the register.', { lineIds: [`not in the register: ${unknown.join(', ')}`] });
  return lines.map((l) => l.get({ plain: true }));
}

/** 400 on the field when a raised test pressure is below the engine's minimum or above its cap for these lines. */
async function checkRaisedTest(lines: LineRow[], raised: number | null, componentRatingPsi: number | null): Promise<void> {
  if (raised === null) return;
  const { testCap } = await currentPlantSettings();
  const engine = testPressureFor({ lines, componentRatingPsi, raisedPsi: null, cap: testCap });
  if (!engine.ok || engine.minimumPsi === null || engine.capPsi === null) return; // the engine's refusal shows on the order and blocks the plan
  const problem = raisedTestProblem(raised, engine.minimumPsi, engine.capPsi);
  if (problem) throw AppError.badRequest(problem, { testPressurePsi: [problem] });
}

/** 400 when an edit leaves half a window, or one that ends before it starts. */
function checkWindow(v: Pick<Values, 'windowStart' | 'windowEnd'>): void {
  if ((v.windowStart === null) !== (v.windowEnd === null)) {
    throw AppError.badRequest('Give both the start and the end of the window, or neither.', { [v.windowStart ? 'windowEnd' : 'windowStart']: ['give both the start and the end of the window, or neither'] });
  }
  if (v.windowStart && v.windowEnd && v.windowEnd <= v.windowStart) {
    throw AppError.badRequest('The window must end after it starts.', { windowEnd: ['the window must end after it starts'] });
  }
}

/** The year of `at` in the plant's time zone: an order written on New Year's Eve evening belongs to that year. */
function plantYear(at: Date, timeZone: string): number {
  return Number(new Intl.DateTimeFormat('en', { timeZone, year: 'numeric' }).format(at));
}

export async function createOrder(me: Me, body: WorkOrderCreate): Promise<WorkOrderDto> {
  const { timeZone } = await currentPlantSettings();
  const id = await sequelize.transaction(async (t) => {
    const lines = await linesOrRefuse(body.lineIds, t);
    await checkRaisedTest(lines, body.testPressurePsi, body.componentRatingPsi);
    const year = plantYear(now(), timeZone);
    const number = `WO-${year}-${String(await nextOrderNumber(year, t)).padStart(4, '0')}`;
    const values = valuesOf(body) as Values;
    const order = await WorkOrder.create({ ...values, number, createdById: me.id }, { transaction: t });
    await WorkOrderLine.bulkCreate(lines.map((l) => ({ workOrderId: order.id, lineId: l.id })), { transaction: t });
    const after = { number, ...Object.fromEntries(FIELDS.map((f) => [f, plain(order[f])])), lines: lines.map((l) => l.lineNumber) };
    await recordAudit({ actorId: me.id, action: 'work-order-created', entity: AUDIT_ENTITY, entityId: order.id, after }, t);
    return order.id;
  });
  return getOrder(id);
}

/** 409 when a line leaving the order still has joint tasks or isolation points of the order on it. */
async function checkLinesLeaving(orderId: string, leaving: LineRow[], t: Transaction): Promise<void> {
  for (const line of leaving) {
    const joints = await JointTask.findAll({ where: { workOrderId: orderId, lineId: line.id }, order: [['number', 'ASC']], transaction: t });
    const points = await IsolationPlanEntry.findAll({ where: { workOrderId: orderId, lineId: line.id }, transaction: t });
    if (!joints.length && !points.length) continue;
    const what = [
      ...(joints.length ? [`joint tasks ${joints.map((j) => jointLabel(j.number)).join(', ')}`] : []),
      ...(points.length ? [`isolation points ${points.map((p) => p.tag).join(', ')}`] : []),
    ].join(' and ');
    throw AppError.conflict(`Line ${line.lineNumber} still has ${what} on this order; remove them before taking the line off the order.`);
  }
}

export async function updateOrder(me: Me, id: string, body: WorkOrderUpdate): Promise<WorkOrderDto> {
  await editOrder(me, id, { version: body.version }, async (order, t) => {
    const current = await orderLines(order.id, t);
    const lines = body.lineIds ? await linesOrRefuse(body.lineIds, t) : current;
    const values = valuesOf(body);
    const changed = FIELDS.filter((f) => f in values && !same(values[f], order[f]));
    const before: Record<string, unknown> = Object.fromEntries(changed.map((f) => [f, plain(order[f])]));
    const after: Record<string, unknown> = Object.fromEntries(changed.map((f) => [f, plain(values[f])]));
    const leaving = current.filter((l) => !lines.some((n) => n.id === l.id));
    const joining = lines.filter((l) => !current.some((c) => c.id === l.id));
    if (leaving.length || joining.length) {
      await checkLinesLeaving(order.id, leaving, t);
      await WorkOrderLine.destroy({ where: { workOrderId: order.id, lineId: { [Op.in]: leaving.map((l) => l.id) } }, transaction: t });
      await WorkOrderLine.bulkCreate(joining.map((l) => ({ workOrderId: order.id, lineId: l.id })), { transaction: t });
      Object.assign(before, { lines: current.map((l) => l.lineNumber) });
      Object.assign(after, { lines: lines.map((l) => l.lineNumber) });
    }
    if (!changed.length && !leaving.length && !joining.length) return { audit: null, result: undefined };
    const next = { ...order.get({ plain: true }), ...values };
    checkWindow(next);
    if (changed.includes('testPressurePsi') || changed.includes('componentRatingPsi') || joining.length || leaving.length) {
      await checkRaisedTest(lines, next.testPressurePsi, next.componentRatingPsi);
    }
    await order.update(Object.fromEntries(changed.map((f) => [f, values[f]])), { transaction: t });
    return { audit: { action: 'work-order-updated', before, after }, result: undefined };
  });
  return getOrder(id);
}

/**
 * One page of orders, kept until an order, its lines or its fitters change (the request's freshness
 * view, server/db/change-log.ts); the count is kept per filter, so paging costs only the page.
 */
export function listOrders(q: WorkOrderListQuery, view?: ChangeView): Promise<KeptAnswer<WorkOrderListResponse>> {
  const { page: _page, pageSize: _pageSize, sort: _sort, dir: _dir, ...filters } = q;
  return keptEntry(`work-orders-page:${JSON.stringify(q)}`, ['work-orders', 'lines'], async () => {
    const snapshot = await currentSnapshot(); // before both reads: the older snapshot of the two
    const [total, rows] = await Promise.all([
      untilChanged(`work-orders:${JSON.stringify(filters)}`, ['work-orders', 'lines'], () => countOrders(q), { view }),
      orderPage(q),
    ]);
    return { snapshot, value: { rows, total, page: q.page, pageSize: q.pageSize } };
  }, { view });
}
