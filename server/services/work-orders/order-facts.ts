// Everything the rules need to know about one order, read once: the order, its lines, its joint
// tasks, its isolation plan and the plant settings; and what the engine makes of them (materials,
// test pressure, window plan). The detail page, the window-plan route and plan submission share it.

import { Op, type InferAttributes, type Transaction } from 'sequelize';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { JointTask } from '@server/db/models/joint-task';
import { Line } from '@server/db/models/line';
import { Person } from '@server/db/models/person';
import { WorkOrder, WorkOrderLine } from '@server/db/models/work-order';
import { AppError } from '@server/errors';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import type { PlantSettings, WindowPlanSettings } from '@shared/schemas/plant-settings';
import type { MaterialsDto, TestPressureDto, WindowPlanDto } from '@shared/schemas/work-order-plan';
import { materialsFor } from './materials';
import { testPressureFor } from './test-pressure';
import { windowPlan } from './window-plan';

export type OrderRow = InferAttributes<WorkOrder>;
export type LineRow = InferAttributes<Line>;
export type JointRow = InferAttributes<JointTask> & { label: string; jointSize: string; lineNumber: string; fitterName: string | null };
export type PlanRow = InferAttributes<IsolationPlanEntry> & { lineNumber: string };

export interface OrderFacts {
  order: OrderRow;
  lines: LineRow[];
  joints: JointRow[];
  plan: PlanRow[];
  plant: PlantSettings;
}

export const NO_SUCH_ORDER = 'There is no such work order.';
export const jointLabel = (n: number) => `J${n}`;

/** Reads order `id` (locked for update inside `t` when `lock`), or 404. */
export async function findOrder(id: string, t?: Transaction, opts: { lock?: boolean } = {}): Promise<WorkOrder> {
  const order = await WorkOrder.findByPk(id, { transaction: t, ...(opts.lock && t ? { lock: t.LOCK.UPDATE } : {}) });
  if (!order) throw AppError.notFound(NO_SUCH_ORDER);
  return order;
}

export async function orderLines(orderId: string, t?: Transaction): Promise<LineRow[]> {
  const links = await WorkOrderLine.findAll({ where: { workOrderId: orderId }, transaction: t });
  const lines = await Line.findAll({ where: { id: { [Op.in]: links.map((l) => l.lineId) } }, order: [['lineNumber', 'ASC']], transaction: t });
  return lines.map((l) => l.get({ plain: true }));
}

export async function loadFacts(id: string, t?: Transaction): Promise<OrderFacts> {
  const order = (await findOrder(id, t)).get({ plain: true });
  // One after another: inside a transaction the queries share one connection.
  const lines = await orderLines(id, t);
  const tasks = await JointTask.findAll({ where: { workOrderId: id }, order: [['number', 'ASC']], transaction: t });
  const entries = await IsolationPlanEntry.findAll({ where: { workOrderId: id }, order: [['sortOrder', 'ASC']], transaction: t });
  const plant = await currentPlantSettings(t);
  const lineNumber = new Map(lines.map((l) => [l.id, l.lineNumber]));
  const fitterIds = [...new Set(tasks.map((j) => j.fitterId).filter((x): x is string => !!x))];
  const fitters = new Map((await Person.findAll({ where: { id: { [Op.in]: fitterIds } }, transaction: t })).map((p) => [p.id, p.name]));
  const joints = tasks.map((j) => ({
    ...j.get({ plain: true }),
    label: jointLabel(j.number),
    jointSize: j.reducingSize ?? j.nominalSize,
    lineNumber: lineNumber.get(j.lineId) ?? '?',
    fitterName: j.fitterId ? (fitters.get(j.fitterId) ?? null) : null,
  }));
  const plan = entries.map((e) => ({ ...e.get({ plain: true }), lineNumber: lineNumber.get(e.lineId) ?? '?' }));
  return { order, lines, joints, plan, plant };
}

export interface Computed {
  materials: MaterialsDto;
  testPressure: TestPressureDto;
  windowPlan: WindowPlanDto;
}

/** What the trade engine and the plant's minutes make of the facts. */
export function compute(f: OrderFacts): Computed {
  const materials = materialsFor(f.lines, f.joints);
  const testPressure = testPressureFor({ lines: f.lines, componentRatingPsi: f.order.componentRatingPsi, raisedPsi: f.order.testPressurePsi, cap: f.plant.testCap });
  const { order } = f;
  const defaults = f.plant.atDefault.filter((k) => k.startsWith('windowPlan.')).map((k) => k.slice('windowPlan.'.length) as keyof WindowPlanSettings);
  const plan = windowPlan({
    window: order.windowStart && order.windowEnd ? { start: order.windowStart, end: order.windowEnd } : null,
    forecast: { lowF: order.forecastLowF, highRh: order.forecastHighRh },
    material: materials.material,
    joints: f.joints,
    isolationPoints: f.plan.length,
    fitters: new Set(f.joints.map((j) => j.fitterId).filter(Boolean)).size,
    test: { required: testPressure.required, psi: testPressure.testPsi, problem: testPressure.problems.join(' ') || null },
    settings: f.plant.windowPlan,
    defaults,
    cureScheduleId: f.plant.cureScheduleId,
    timeZone: f.plant.timeZone,
  });
  return { materials, testPressure, windowPlan: plan };
}
