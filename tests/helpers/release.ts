// The path from a curing order to a released one, as the release and mail tests walk it.
import { expect } from 'vitest';
import { setClockOffsetForTests } from '@server/clock';
import { Hold } from '@server/db/models/joint-record';
import { WorkOrder } from '@server/db/models/work-order';
import { liftDueHolds } from '@server/services/holds/lift';
import type { Browserless } from './browserless';
import { isolatedOrder, recordStepsThrough } from './lockout';

export const CHECKLIST = { areaInspected: true, peopleClear: true, affectedTold: true, ventsDrainsSet: true, slowRefill: true };
export const release = (b: Browserless, id: string) => b.post(`/api/work-orders/${id}/release`, CHECKLIST);

/** An order whose one joint is assembled and wiped: curing, the fitter's locks on. */
export async function curingOrder(users: Parameters<typeof isolatedOrder>[0]) {
  const made = await isolatedOrder(users, { joints: 1 });
  await recordStepsThrough(users.fitter, made.jointIds[0]!, 'wipe');
  return made;
}

/** Moves the clock `afterMs` past every hold of the order and lifts them: the order is testing. Returns the last hold's end. */
export async function cureEnds(orderId: string, afterMs = 60_000): Promise<Date> {
  const holds = await Hold.findAll({ where: { workOrderId: orderId, status: 'running' } });
  const last = Math.max(...holds.map((h) => h.endsAt!.getTime()));
  setClockOffsetForTests(last - Date.now() + afterMs);
  await liftDueHolds();
  expect((await WorkOrder.findByPk(orderId))!.state).toBe('testing');
  return new Date(last);
}

export async function removeMyLocks(b: Browserless, orderId: string) {
  const board = (await b.get(`/api/work-orders/${orderId}/lockout`)).body;
  for (const l of board.myLocks) expect((await b.tablet(`/api/locks/${l.id}/removal`, {})).status).toBe(200);
}

/** A passed hydrostatic test at the order's test pressure, 15 minutes ending just before the (moved) clock's now; `over` changes any field. */
export async function testBody(planner: Browserless, orderId: string, over: Record<string, unknown> = {}) {
  const o = (await planner.get(`/api/work-orders/${orderId}`)).body;
  const psi = o.testPressure.testPsi as number;
  const end = new Date(Date.now() + 60_000 - 1000); // within the moved clock's now (the clock runs ahead in these tests)
  return {
    toolsClear: true, peopleClear: true, medium: 'water', testPressurePsi: psi, gauge: 'PI-T3, 0–600 psi, calibrated 2026-09',
    startedAt: new Date(end.getTime() - 15 * 60_000).toISOString(), startReadingPsi: psi, endedAt: end.toISOString(), endReadingPsi: psi,
    result: 'passed', pipingIdentified: `${o.lines[0].lineNumber}, the repaired section between the isolation points`, examiner: 'R. Adeyemi, plant inspector',
    ...over,
  };
}
