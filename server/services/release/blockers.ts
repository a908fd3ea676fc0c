// Why an order's lines may not go back into service yet — by the database and the clock, never by
// the worker's word: any lock still on, any hold still active (running past now, or awaiting an
// engineering cure time), no passed hydrostatic test where one is required, or a state short of
// ready. The release itself, the release queue and the order's page all ask this one function.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { Hold } from '@server/db/models/joint-record';
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

export async function releaseBlockers(order: WorkOrder, t?: Transaction): Promise<ReleaseBlocker[]> {
  const at = now();
  const out: ReleaseBlocker[] = [];
  if (order.state !== 'ready') {
    out.push({ kind: 'state', message: `${order.number} is ${stateWords(order.state)}; its lines go back into service once the test has passed and every lock is off.`, until: null });
  }
  const p = await readProtection(order.id, t);
  const names = await namesOf(p.locks.map((l) => l.personId), t);
  for (const l of p.locks) {
    const place = l.lockBoxId ? `lock box ${p.box?.label ?? ''}`.trim() : (p.entries.find((e) => e.id === l.isolationPlanEntryId)?.tag ?? 'a point');
    out.push({ kind: 'lock', message: `Lock ${l.lockNumber} (${names.get(l.personId) ?? 'someone'}) is still on ${place}.`, until: null });
  }
  for (const { hold, joint } of await activeHolds(order.id, at, t)) {
    out.push(hold.status === 'awaiting-engineering'
      ? { kind: 'hold', message: `${joint}'s ${hold.kind} hold waits for a supervisor's engineering cure time.`, until: null }
      : { kind: 'hold', message: `${joint}'s ${hold.kind} hold runs until ${minuteUtc(hold.endsAt!)}.`, until: hold.endsAt!.toISOString() });
  }
  const { testPressure } = compute(await loadFacts(order.id, t));
  if (testPressure.required) {
    const last = await PressureTest.findOne({ where: { workOrderId: order.id }, order: [['recordedAt', 'DESC']], transaction: t });
    if (!last) out.push({ kind: 'test', message: 'No hydrostatic test is recorded.', until: null });
    else if (last.result !== 'passed') out.push({ kind: 'test', message: `The last hydrostatic test failed (${minuteUtc(last.endedAt)}); the redone joints must cure and be tested again.`, until: null });
  }
  return out;
}
