// Recording the hydrostatic test (DESIGN.md section 10; TRADE-REFERENCE.md section 6). Refused unless
// the order is testing, every cure hold of its live joints has ended by the clock, and — the (f)(1)
// sequence — no lock is on the test boundary. Water only, within the engine's minimum and cap, held
// at least the minimum time for a pass. A pass makes the order ready; a failure cuts out each
// leaking joint for redo and puts the order back in work, where locks and a new verification come
// before anyone touches the line.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { IsolationVerification } from '@server/db/models/lockout';
import { JointTask } from '@server/db/models/joint-task';
import { PressureTest } from '@server/db/models/release';
import { AppError } from '@server/errors';
import { logger } from '@server/logger';
import { enqueueMail } from '@server/queues/mail';
import { recordAudit } from '@server/services/audit-service';
import { cutOutJoint } from '@server/services/joints/redo';
import { readProtection } from '@server/services/lockout/protection';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { compute, findOrder, jointLabel, loadFacts } from '@server/services/work-orders/order-facts';
import { moveTo, stateWords } from '@server/services/work-orders/states';
import { checkTestMedium, MIN_TEST_HOLD_MINUTES } from '@shared/trade';
import type { PressureTestBody } from '@shared/schemas/release';
import type { Me } from '@shared/schemas/roles';
import { activeHolds } from './blockers';

const refused = (message: string) => new AppError(409, 'test_refused', message);

export async function recordPressureTest(me: Me, orderId: string, body: PressureTestBody, t: Transaction): Promise<string> {
  const order = await findOrder(orderId, t, { lock: true });
  if (order.state !== 'testing') throw new AppError(409, 'state_conflict', `${order.number} is ${stateWords(order.state)}; it is tested once every cure hold of its joints has ended.`);
  const at = now();
  const holds = await activeHolds(order.id, at, t);
  if (holds.length) throw refused(`Pressure may not go on yet: ${holds.map(({ hold, joint }) => `${joint}'s ${hold.kind} hold ${hold.endsAt ? `runs until ${hold.endsAt.toISOString()}` : 'waits for an engineering cure time'}`).join('; ')}.`);
  const p = await readProtection(order.id, t);
  if (p.locks.length) {
    throw refused(`Before pressurising, each person removes their own lock from the test boundary (OSHA 29 CFR 1910.147(f)(1)); still on: ${p.locks.map((l) => l.lockNumber).join(', ')}.`);
  }
  const medium = checkTestMedium(body.medium);
  if (medium) throw refused(medium.reason);
  const { testPressure } = compute(await loadFacts(order.id, t));
  if (!testPressure.required) throw refused(`${order.number}'s lines carry no pressure (design 0 psi): no hydrostatic test is required.`);
  if (testPressure.minimumPsi === null || testPressure.capPsi === null) throw refused(`The test pressure cannot be worked out: ${testPressure.problems.join(' ')}`);
  if (body.testPressurePsi < testPressure.minimumPsi || body.testPressurePsi > testPressure.capPsi) {
    throw refused(`The test pressure must be between ${testPressure.minimumPsi} psi (1.5 × design) and ${testPressure.capPsi} psi (the weakest component's cap); ${body.testPressurePsi} psi was recorded.`);
  }
  const started = new Date(body.startedAt);
  const ended = new Date(body.endedAt);
  if (ended.getTime() > at.getTime() + 60_000) throw AppError.badRequest('The test cannot end in the future.', { endedAt: ['in the future'] });
  const holdMinutes = Math.floor((ended.getTime() - started.getTime()) / 60_000);
  if (body.result === 'passed') {
    const problems: string[] = [];
    if (holdMinutes < MIN_TEST_HOLD_MINUTES) problems.push(`a passed test is held at least ${MIN_TEST_HOLD_MINUTES} min (ASME B31.3 345.2.2(a)); this one ${holdMinutes} min`);
    if (body.startReadingPsi < testPressure.minimumPsi || body.endReadingPsi < testPressure.minimumPsi) {
      problems.push(`both readings must stay at or above ${testPressure.minimumPsi} psi for a pass (${body.startReadingPsi} → ${body.endReadingPsi} psi)`);
    }
    if (problems.length) throw refused(`Not a pass: ${problems.join('; ')}. Record it as failed, naming the leaking joints, or test again.`);
  }
  const live = await JointTask.findAll({ where: { workOrderId: order.id, redoneAt: { [Op.is]: null } }, transaction: t });
  const leaking = body.leakingJointIds.map((id) => live.find((j) => j.id === id));
  if (leaking.some((j) => !j)) throw AppError.badRequest('A leaking joint named is not a joint of this order still in the line.', { leakingJointIds: ['not a live joint of this order'] });
  const test = await PressureTest.create({
    workOrderId: order.id, result: body.result, medium: body.medium, testPressurePsi: body.testPressurePsi, gauge: body.gauge, startedAt: started, startReadingPsi: body.startReadingPsi,
    endedAt: ended, endReadingPsi: body.endReadingPsi, leakingJointIds: body.leakingJointIds, pipingIdentified: body.pipingIdentified, examiner: body.examiner, notes: body.notes ?? null,
    witnessId: me.id, recordedAt: at,
  }, { transaction: t });
  // The locks came off for the test: the verification no longer stands; locks and a new one come before any more work.
  await IsolationVerification.update({ supersededAt: at }, { where: { workOrderId: order.id, supersededAt: { [Op.is]: null } }, transaction: t });
  const before = order.state;
  const redone: string[] = [];
  if (body.result === 'failed') {
    for (const task of leaking) {
      const { replacement } = await cutOutJoint(me, order, task!, `leaked at the hydrostatic test of ${at.toISOString().slice(0, 10)}`, t);
      redone.push(`${jointLabel(task!.number)} → ${jointLabel(replacement.number)}`);
    }
  }
  const state = moveTo(order, body.result === 'passed' ? 'ready' : 'in-work');
  await order.update({ state, version: order.version + 1 }, { transaction: t });
  await recordAudit({
    actorId: me.id, action: body.result === 'passed' ? 'pressure-test-passed' : 'pressure-test-failed', entity: AUDIT_ENTITY, entityId: order.id,
    before: { state: before },
    after: { state, testPsi: body.testPressurePsi, medium: body.medium, readings: `${body.startReadingPsi} → ${body.endReadingPsi} psi`, holdMinutes, witness: me.name, examiner: body.examiner, ...(redone.length ? { redone } : {}) },
  }, t);
  if (state === 'ready') t.afterCommit(() => void enqueueMail({ purpose: 'ready-for-release', recordId: order.id }).catch((err) => logger.error({ err }, 'could not queue the ready-for-release mail')));
  return test.id;
}
