// Why an order's lines may not go back into service yet — by the database and the clock, never by
// the worker's word: any lock still on, any hold still active (running past now, or awaiting an
// engineering cure time), no passed hydrostatic test where one is required, or a state short of
// ready. The release itself and the order's page ask `releaseBlockers`; the release queue reads the
// same facts for all open orders at once (queue-facts.ts) — both word them with `blockersFrom`.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { Hold } from '@server/db/models/joint-record';
import type { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import type { Lock, LockBox } from '@server/db/models/lockout';
import { JointTask } from '@server/db/models/joint-task';
import { PressureTest } from '@server/db/models/release';
import type { WorkOrder } from '@server/db/models/work-order';
import { namesOf } from '@server/services/lockout/board';
import { readProtection } from '@server/services/lockout/protection';
import { compute, jointLabel, loadFacts } from '@server/services/work-orders/order-facts';
import { stateWords } from '@server/services/work-orders/states';
import type { ReleaseBlocker } from '@shared/schemas/release';

const minuteUtc = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** The holds of the order's live joints that still forbid pressure or release at `at`. */
export async function activeHolds(orderId: string, at: Date, t?: Transaction) {
  const live = await JointTask.findAll({ where: { workOrderId: orderId, redoneAt: { [Op.is]: null } }, attributes: ['id', 'number'], transaction: t });
  const holds = await Hold.findAll({
    where: {
      jointTaskId: { [Op.in]: live.map((j) => j.id) },
      [Op.or]: [{ status: 'awaiting-engineering' }, { status: 'running', endsAt: { [Op.gt]: at } }],
    },
    order: [['endsAt', 'ASC']],
    transaction: t,
  });
  const label = new Map(live.map((j) => [j.id, jointLabel(j.number)]));
  return holds.map((h) => ({ hold: h, joint: label.get(h.jointTaskId!) ?? '?' }));
}

/** What the reasons against one order's release are made from; read per order or for many at once. */
export interface BlockerFacts {
  order: Pick<WorkOrder, 'number' | 'state'>;
  /** The order's locks still on, oldest first; its plan's points and its lock box name where each is. */
  locks: readonly Lock[];
  entries: readonly Pick<IsolationPlanEntry, 'id' | 'tag'>[];
  box: Pick<LockBox, 'label'> | null;
  names: ReadonlyMap<string, string>;
  /** `activeHolds` of the order, soonest end first. */
  holds: readonly { hold: Hold; joint: string }[];
  testRequired: boolean;
  /** The latest hydrostatic test; only asked for when one is required. */
  lastTest: Pick<PressureTest, 'result' | 'endedAt'> | null;
}

/** Every reason against the release, as sentences, in the order the release names them. */
export function blockersFrom(f: BlockerFacts): ReleaseBlocker[] {
  const { order } = f;
  const out: ReleaseBlocker[] = [];
  if (order.state !== 'ready') {
    out.push({ kind: 'state', message: `${order.number} is ${stateWords(order.state)}; its lines go back into service once the test has passed and every lock is off.`, until: null });
  }
  for (const l of f.locks) {
    const place = l.lockBoxId ? `lock box ${f.box?.label ?? ''}`.trim() : (f.entries.find((e) => e.id === l.isolationPlanEntryId)?.tag ?? 'a point');
    out.push({ kind: 'lock', message: `Lock ${l.lockNumber} (${f.names.get(l.personId) ?? 'someone'}) is still on ${place}.`, until: null });
  }
  for (const { hold, joint } of f.holds) {
    out.push(hold.status === 'awaiting-engineering'
      ? { kind: 'hold', message: `${joint}'s ${hold.kind} hold waits for a supervisor's engineering cure time.`, until: null }
      : { kind: 'hold', message: `${joint}'s ${hold.kind} hold runs until ${minuteUtc(hold.endsAt!)}.`, until: hold.endsAt!.toISOString() });
  }
  if (f.testRequired) {
    const last = f.lastTest;
    if (!last) out.push({ kind: 'test', message: 'No hydrostatic test is recorded.', until: null });
    else if (last.result !== 'passed') out.push({ kind: 'test', message: `The last hydrostatic test failed (${minuteUtc(last.endedAt)}); the redone joints must cure and be tested again.`, until: null });
  }
  return out;
}

/** One order's reasons, every fact read inside `t` (the release reads them after the order's row lock). */
export async function releaseBlockers(order: WorkOrder, t?: Transaction): Promise<ReleaseBlocker[]> {
  const at = now();
  const p = await readProtection(order.id, t);
  const names = await namesOf(p.locks.map((l) => l.personId), t);
  const holds = await activeHolds(order.id, at, t);
  const { testPressure } = compute(await loadFacts(order.id, t));
  const lastTest = testPressure.required
    ? await PressureTest.findOne({ where: { workOrderId: order.id }, order: [['recordedAt', 'DESC']], transaction: t })
    : null;
  return blockersFrom({ order, locks: p.locks, entries: p.entries, box: p.box, names, holds, testRequired: testPressure.required, lastTest });
}
