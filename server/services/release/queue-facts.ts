// What the release queue and the line status board say about each open order — its lines, its
// active holds and every reason against its release — read for all the orders at once: one query per
// table with `workOrderId in (…)`, grouped here and worded by the same `blockersFrom` the release
// uses. The number of queries does not grow with the number of orders. The release itself does not
// come here: it reads its one order inside its transaction (`releaseBlockers`).

import { Op, col, fn } from 'sequelize';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { Hold } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { Line } from '@server/db/models/line';
import { Lock, LockBox } from '@server/db/models/lockout';
import { PressureTest } from '@server/db/models/release';
import { WorkOrderLine, type WorkOrder } from '@server/db/models/work-order';
import { namesOf } from '@server/services/lockout/board';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { jointLabel, type LineRow } from '@server/services/work-orders/order-facts';
import { testPressureFor } from '@server/services/work-orders/test-pressure';
import type { ReleaseBlocker } from '@shared/schemas/release';
import { blockersFrom } from './blockers';

export interface QueueFacts {
  /** The order's lines by line number, as `orderLines` reads them. */
  lines: LineRow[];
  /** As `activeHolds` answers for the order at `at`: soonest end first. */
  holds: { hold: Hold; joint: string }[];
  blockers: ReleaseBlocker[];
}

/** Rows grouped by their order, keeping the order the query returned them in. */
function byOrder<T>(rows: readonly T[], orderOf: (row: T) => string | undefined): Map<string, T[]> {
  const out = new Map<string, T[]>();
  for (const row of rows) {
    const id = orderOf(row);
    if (id === undefined) continue;
    const list = out.get(id);
    if (list) list.push(row);
    else out.set(id, [row]);
  }
  return out;
}

/**
 * Rows by `at`, earliest first, no time last (as SQL's `order by … asc`). Rows of the same time keep
 * the order the table gave them, as PostgreSQL's sort of the few rows of one order does; its sort
 * of every order's rows at once would not, so the sort is done here, stably.
 */
function inTimeOrder<T>(rows: readonly T[], at: (row: T) => Date | null): T[] {
  const time = (row: T) => at(row)?.getTime() ?? Number.MAX_VALUE;
  return [...rows].sort((a, b) => time(a) - time(b));
}

/** Each order's lines and active holds at `at`, read for all `ids` at once. */
async function linesAndHolds(ids: string[], at: Date) {
  const links = await WorkOrderLine.findAll({ where: { workOrderId: { [Op.in]: ids } } });
  const lines = await Line.findAll({ where: { id: { [Op.in]: [...new Set(links.map((l) => l.lineId))] } }, order: [['lineNumber', 'ASC']] });
  const live = await JointTask.findAll({ where: { workOrderId: { [Op.in]: ids }, redoneAt: { [Op.is]: null } }, attributes: ['id', 'number', 'workOrderId'] });
  const holds = await Hold.findAll({
    where: {
      jointTaskId: { [Op.in]: live.map((j) => j.id) },
      [Op.or]: [{ status: 'awaiting-engineering' }, { status: 'running', endsAt: { [Op.gt]: at } }],
    },
  });
  const joint = new Map(live.map((j) => [j.id, j]));
  const linkedTo = byOrder(links, (l) => l.workOrderId);
  const plainLines = lines.map((l) => l.get({ plain: true }));
  const holdsByOrder = byOrder(inTimeOrder(holds, (h) => h.endsAt), (h) => joint.get(h.jointTaskId!)?.workOrderId);
  return {
    linesOf: (id: string) => {
      const mine = new Set((linkedTo.get(id) ?? []).map((l) => l.lineId));
      return plainLines.filter((l) => mine.has(l.id));
    },
    holdsOf: (id: string) => (holdsByOrder.get(id) ?? []).map((hold) => ({ hold, joint: jointLabel(joint.get(hold.jointTaskId!)!.number) })),
  };
}

/** The lockout of each order: its plan's points, its lock box, its locks still on and their owners' names. */
async function lockouts(ids: string[]) {
  const entries = await IsolationPlanEntry.findAll({ where: { workOrderId: { [Op.in]: ids } }, attributes: ['id', 'tag', 'workOrderId'] });
  const boxes = await LockBox.findAll({ where: { workOrderId: { [Op.in]: ids } } });
  // Locks applied in one request share their time. The per-order read leaves such ties to the query
  // plan (the index on lower(lock number), or table order); here they go by lock number, always.
  const locks = await Lock.findAll({
    where: { workOrderId: { [Op.in]: ids }, removedAt: { [Op.is]: null } },
    order: [['appliedAt', 'ASC'], [fn('lower', col('lock_number')), 'ASC']],
  });
  const names = await namesOf(locks.map((l) => l.personId));
  const [entriesOf, boxesOf, locksOf] = [byOrder(entries, (e) => e.workOrderId), byOrder(boxes, (b) => b.workOrderId), byOrder(locks, (l) => l.workOrderId)];
  return (id: string) => ({ entries: entriesOf.get(id) ?? [], box: boxesOf.get(id)?.[0] ?? null, locks: locksOf.get(id) ?? [], names });
}

/** Lines, active holds at `at` and the reasons against release of every order in `orders`, by order id. */
export async function queueFacts(orders: readonly WorkOrder[], at: Date): Promise<Map<string, QueueFacts>> {
  const ids = orders.map((o) => o.id);
  if (!ids.length) return new Map();
  const { linesOf, holdsOf } = await linesAndHolds(ids, at);
  const lockoutOf = await lockouts(ids);
  const plant = await currentPlantSettings();
  const tests = await PressureTest.findAll({ where: { workOrderId: { [Op.in]: ids } }, order: [['recordedAt', 'DESC']], attributes: ['workOrderId', 'result', 'endedAt', 'recordedAt'] });
  const lastTest = new Map<string, PressureTest>();
  for (const test of tests) if (!lastTest.has(test.workOrderId)) lastTest.set(test.workOrderId, test);

  return new Map(orders.map((order) => {
    const [lines, holds] = [linesOf(order.id), holdsOf(order.id)];
    const testRequired = testPressureFor({ lines, componentRatingPsi: order.componentRatingPsi, raisedPsi: order.testPressurePsi, cap: plant.testCap }).required;
    const blockers = blockersFrom({ order, ...lockoutOf(order.id), holds, testRequired, lastTest: testRequired ? (lastTest.get(order.id) ?? null) : null });
    return [order.id, { lines, holds, blockers }];
  }));
}
