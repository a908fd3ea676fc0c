// Fills the bench database with work orders and joint tasks THROUGH THE SERVICES (createOrder,
// addJointTasks, cancelOrder), a few at a time in parallel, on the demo plant's lines (imported
// through the line import, as `npm start` loads them). Import only after the environment is set.

import { confirmImport, uploadImport } from '../server/services/line-imports/import-service';
import { addJointTasks } from '../server/services/work-orders/joint-tasks';
import { createOrder } from '../server/services/work-orders/order-service';
import { cancelOrder } from '../server/services/work-orders/plan-service';
import { Line } from '../server/db/models/line';
import { Person } from '../server/db/models/person';
import { jointTasksAddSchema } from '../shared/schemas/joint-tasks';
import type { Me } from '../shared/schemas/roles';
import { workOrderCreateSchema, PRIORITIES, WORK_ORDER_KINDS } from '../shared/schemas/work-orders';
import { demoPlant, toCsv } from '../scripts/demo-plant';

/** Joints per order, by order index: 20, 14, 6, 0 in turn, so 10 on average (100,000 for 10,000 orders). */
export const JOINTS = [20, 14, 6, 0];
/** One order in ten is cancelled after its joints are added. */
export const cancelled = (i: number) => i % 10 === 9;

export async function benchPlanner(): Promise<Me> {
  const p = await Person.create({ issuer: 'bench', subject: 'planner', name: 'Bench Planner', email: null, rolesFromIdp: ['planner'], lastSignInAt: null });
  return { id: p.id, name: p.name, email: null, roles: ['planner'] };
}

export async function importDemoLines(me: Me): Promise<Line[]> {
  const { lines, points } = demoPlant();
  for (const [filename, rows] of [['lines.csv', lines], ['points.csv', points]] as const) {
    const preview = await uploadImport(me, { filename, buffer: Buffer.from(toCsv(rows)) }, { inline: true });
    await confirmImport(me, preview.id, { inline: true });
  }
  return Line.findAll({ order: [['lineNumber', 'ASC']] });
}

const HOUR = 3_600_000;

/** Milliseconds spent in each service over the fill (summed over the parallel calls). */
export const spent: Record<string, number> = { createOrder: 0, addJointTasks: 0, cancelOrder: 0 };
async function timed<T>(what: string, fn: () => Promise<T>): Promise<T> {
  const start = performance.now();
  try {
    return await fn();
  } finally {
    spent[what] = (spent[what] ?? 0) + performance.now() - start;
  }
}

/** Order `i`: on line i mod lines, a 12-hour window 53 minutes after the previous order's (about a year in all). */
async function makeOrder(me: Me, lines: Line[], i: number, from: number): Promise<string> {
  const line = lines[i % lines.length]!;
  const start = from + i * 53 * 60_000;
  const order = await timed('createOrder', () => createOrder(me, workOrderCreateSchema.parse({
    kind: WORK_ORDER_KINDS[i % WORK_ORDER_KINDS.length], priority: PRIORITIES[i % PRIORITIES.length],
    scope: `Bench order ${i}: replace the fittings listed in the joint tasks.`, requestedBy: 'Operations shift lead', lineIds: [line.id],
    windowStart: new Date(start).toISOString(), windowEnd: new Date(start + 12 * HOUR).toISOString(), forecastLowF: 65, forecastHighRh: 50,
  })));
  const joints = JOINTS[i % JOINTS.length]!;
  if (joints > 0) await timed('addJointTasks', () => addJointTasks(me, order.id, jointTasksAddSchema.parse({ lineId: line.id, fittingKind: 'coupling', count: Math.min(joints, 12) })));
  if (joints > 12) await timed('addJointTasks', () => addJointTasks(me, order.id, jointTasksAddSchema.parse({ lineId: line.id, fittingKind: 'elbow-90', count: joints - 12 })));
  if (cancelled(i)) await timed('cancelOrder', () => cancelOrder(me, order.id, 'Bench: the repair was folded into another order.'));
  return order.id;
}

/** Makes `count` orders with `concurrency` in flight; returns the ids by index. */
export async function fillOrders(me: Me, lines: Line[], count: number, concurrency: number, log: (msg: string) => void): Promise<string[]> {
  const ids: string[] = new Array(count);
  const from = Date.now() + 24 * HOUR;
  let next = 0;
  const started = performance.now();
  const worker = async () => {
    for (let i = next++; i < count; i = next++) {
      ids[i] = await makeOrder(me, lines, i, from);
      if ((i + 1) % 1000 === 0) log(`  ${i + 1} orders (${((performance.now() - started) / 1000).toFixed(0)} s)`);
    }
  };
  await Promise.all(Array.from({ length: concurrency }, worker));
  return ids;
}
