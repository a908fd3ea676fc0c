// Who hears that a hold ended, or that the test is ready, and what the mail says: read from the
// database when the worker sends, so the mail says what is true then.

import { Op } from 'sequelize';
import { config } from '@server/config';
import { Hold } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { Person } from '@server/db/models/person';
import { WorkOrder } from '@server/db/models/work-order';
import { effectiveRoles } from '@server/services/people-service';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { compute, jointLabel, loadFacts, orderLines } from '@server/services/work-orders/order-facts';
import { plantTime } from '@server/services/work-orders/plant-time';
import type { Role } from '@shared/schemas/roles';
import type { OutgoingMail } from './send-mail';
import { holdLifted, testReady, windowAtRisk } from './templates/hold-mail';
import { AuditEntry } from '@server/db/models/audit-entry';

/** The order's fitters and its planner, with addresses. */
async function fittersAndPlanner(order: WorkOrder): Promise<string[]> {
  const fitterIds = (await JointTask.findAll({ where: { workOrderId: order.id }, attributes: ['fitterId'] })).map((j) => j.fitterId).filter((x): x is string => !!x);
  const people = await Person.findAll({ where: { id: { [Op.in]: [...new Set([...fitterIds, order.createdById])] }, email: { [Op.ne]: null } } });
  return people.map((p) => p.email!);
}

/** Everyone holding one of `roles`, with an address. */
export async function holdersOf(roles: readonly Role[]): Promise<string[]> {
  const people = await Person.findAll({ where: { email: { [Op.ne]: null } }, order: [['name', 'ASC']] });
  return people.filter((p) => effectiveRoles(p).some((r) => roles.includes(r))).map((p) => p.email!);
}

/** Record id: the hold's id. Only an ended cure hold is mailed. */
export async function holdLiftedMail(holdId: string): Promise<OutgoingMail | null> {
  const hold = await Hold.findByPk(holdId);
  if (!hold || hold.status !== 'ended' || hold.kind !== 'cure' || !hold.endedAt || !hold.jointTaskId) return null;
  const [order, task] = await Promise.all([WorkOrder.findByPk(hold.workOrderId), JointTask.findByPk(hold.jointTaskId)]);
  if (!order || !task) return null;
  const [to, lines, plant, remaining] = await Promise.all([
    fittersAndPlanner(order), orderLines(order.id), currentPlantSettings(),
    Hold.count({ where: { workOrderId: order.id, kind: 'cure', status: { [Op.in]: ['running', 'awaiting-engineering'] } } }),
  ]);
  if (!to.length) return null;
  const content = holdLifted({ orderId: order.id, number: order.number, lines: lines.map((l) => l.lineNumber), joint: jointLabel(task.number), endedAt: plantTime(hold.endedAt, plant.timeZone), remaining }, config.origin);
  return { to: [...new Set(to)].join(', '), ...content };
}

/** Record id: `<order id>.<version>` (the order as it became testing). To operations and supervisors (the witnesses), the order's fitters and its planner. */
export async function testReadyMail(recordId: string): Promise<OutgoingMail | null> {
  const order = await WorkOrder.findByPk(recordId.split('.')[0]!);
  if (!order) return null;
  const facts = await loadFacts(order.id);
  const { testPressure } = compute(facts);
  const to = [...new Set([...(await holdersOf(['operations', 'supervisor'])), ...(await fittersAndPlanner(order))])];
  if (!to.length) return null;
  const content = testReady({ orderId: order.id, number: order.number, lines: facts.lines.map((l) => l.lineNumber), testPsi: testPressure.testPsi, holdMinutes: testPressure.holdMinutes }, config.origin);
  return { to: to.join(', '), ...content };
}

/** Record id: the order's id. To its planner and everyone holding the operations role, from the watch's audit entry. */
export async function windowAtRiskMail(orderId: string): Promise<OutgoingMail | null> {
  const order = await WorkOrder.findByPk(orderId);
  const entry = await AuditEntry.findOne({ where: { entity: 'work-order', entityId: orderId, action: 'window-at-risk' } });
  const seen = entry?.after as { earliestRelease: string; windowEnd: string } | undefined;
  if (!order || !seen) return null;
  const [planner, operations, lines, plant] = await Promise.all([Person.findByPk(order.createdById), holdersOf(['operations']), orderLines(order.id), currentPlantSettings()]);
  const to = [...new Set([...(planner?.email ? [planner.email] : []), ...operations])];
  if (!to.length) return null;
  const content = windowAtRisk({ orderId: order.id, number: order.number, lines: lines.map((l) => l.lineNumber), windowEnd: plantTime(seen.windowEnd, plant.timeZone), earliestRelease: plantTime(seen.earliestRelease, plant.timeZone) }, config.origin);
  return { to: to.join(', '), ...content };
}
