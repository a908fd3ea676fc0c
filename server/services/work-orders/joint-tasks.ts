// Joint tasks: added `count` at a time on one of the order's lines, each its own task numbered
// J1, J2 … within the order (numbers are never reused, so a removed J2 stays gone on paper too),
// removed one at a time, and assigned to a person who holds the fitter role.

import { sequelize } from '@server/db/sequelize';
import { JointTask } from '@server/db/models/joint-task';
import { Person } from '@server/db/models/person';
import { Line } from '@server/db/models/line';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { effectiveRoles } from '@server/services/people-service';
import { nominalSizeLabel, parseNominalSize } from '@shared/trade';
import type { JointTaskDto, JointTasksAdd } from '@shared/schemas/joint-tasks';
import type { Me } from '@shared/schemas/roles';
import { AUDIT_ENTITY, toJointTaskDto } from './order-dto';
import { findOrder, jointLabel, loadFacts, orderLines } from './order-facts';
import { editOrder } from './order-writes';
import { stateWords } from './states';

const NO_SUCH_TASK = 'There is no such joint task.';
/** Fitters may be (re)assigned until the joints are made; after that the record stands. */
const ASSIGNABLE = ['draft', 'planned', 'isolated', 'in-work'];

async function taskDtos(orderId: string, ids: string[]): Promise<JointTaskDto[]> {
  const facts = await loadFacts(orderId);
  return facts.joints.filter((j) => ids.includes(j.id)).map((j) => toJointTaskDto(j));
}

export async function addJointTasks(me: Me, orderId: string, body: JointTasksAdd): Promise<JointTaskDto[]> {
  const ids = await editOrder(me, orderId, {}, async (order, t) => {
    const line = (await orderLines(order.id, t)).find((l) => l.id === body.lineId);
    if (!line) throw AppError.badRequest('That line is not on this order; add it to the order first.', { lineId: ['not a line of this order'] });
    const reducingIn = body.reducingSize === undefined ? null : parseNominalSize(body.reducingSize);
    const reducing = reducingIn === null ? null : nominalSizeLabel(reducingIn); // as the trade writes it: "1 1/2" → "1-1/2"
    if (reducingIn !== null && reducingIn >= line.nominalSizeIn) {
      throw AppError.badRequest(`A reducing size must be smaller than the line's ${line.nominalSize}".`, { reducingSize: [`must be smaller than ${line.nominalSize}"`] });
    }
    const first = order.lastJointNumber + 1;
    const tasks = await JointTask.bulkCreate(
      Array.from({ length: body.count }, (_, i) => ({
        workOrderId: order.id, number: first + i, lineId: line.id, fittingKind: body.fittingKind,
        nominalSize: line.nominalSize, nominalSizeIn: line.nominalSizeIn, reducingSize: reducing, reducingSizeIn: reducingIn,
      })),
      { transaction: t },
    );
    await order.update({ lastJointNumber: first + body.count - 1 }, { transaction: t });
    const labels = tasks.map((j) => jointLabel(j.number));
    const after = { jointTasks: labels, line: line.lineNumber, fittingKind: body.fittingKind, size: line.nominalSize, reducingSize: reducing };
    return { audit: { action: 'joint-tasks-added', after }, result: tasks.map((j) => j.id) };
  });
  return taskDtos(orderId, ids);
}

async function taskOrRefuse(id: string): Promise<JointTask> {
  const task = await JointTask.findByPk(id);
  if (!task) throw AppError.notFound(NO_SUCH_TASK);
  return task;
}

export async function removeJointTask(me: Me, id: string): Promise<void> {
  const { workOrderId } = await taskOrRefuse(id);
  await editOrder(me, workOrderId, {}, async (_order, t) => {
    const task = await JointTask.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!task) throw AppError.notFound(NO_SUCH_TASK);
    const line = await Line.findByPk(task.lineId, { transaction: t });
    await task.destroy({ transaction: t });
    const before = { jointTask: jointLabel(task.number), line: line?.lineNumber, fittingKind: task.fittingKind, size: task.reducingSize ?? task.nominalSize };
    return { audit: { action: 'joint-task-removed', before }, result: undefined };
  });
}

/** 400 unless `personId` names a person who holds the fitter role now. */
async function fitterOrRefuse(personId: string): Promise<Person> {
  const person = await Person.findByPk(personId);
  if (!person) throw AppError.badRequest('There is no such person.', { personId: ['no such person'] });
  if (!effectiveRoles(person).includes('fitter')) {
    throw AppError.badRequest(`${person.name} does not hold the pipefitter role, so cannot be given a joint to make.`, { personId: ['not a pipefitter'] });
  }
  return person;
}

/**
 * Assigns the joint to a fitter (or takes it back, with null). It changes who makes the joint, not
 * the plan, so a planned order stays planned; the window plan counts the crews anew.
 */
export async function setFitter(me: Me, id: string, personId: string | null): Promise<JointTaskDto> {
  const { workOrderId } = await taskOrRefuse(id);
  const fitter = personId ? await fitterOrRefuse(personId) : null;
  await sequelize.transaction(async (t) => {
    const order = await findOrder(workOrderId, t, { lock: true });
    if (!ASSIGNABLE.includes(order.state)) throw AppError.conflict(`${order.number} is ${stateWords(order.state)}; its joints are no longer assigned.`);
    const task = await JointTask.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!task) throw AppError.notFound(NO_SUCH_TASK);
    if (task.fitterId === (fitter?.id ?? null)) return;
    const previous = task.fitterId ? await Person.findByPk(task.fitterId, { transaction: t }) : null;
    await task.update({ fitterId: fitter?.id ?? null }, { transaction: t });
    await order.update({ version: order.version + 1 }, { transaction: t });
    await recordAudit(
      {
        actorId: me.id, action: 'joint-task-fitter-set', entity: AUDIT_ENTITY, entityId: order.id,
        before: { jointTask: jointLabel(task.number), fitter: previous?.name ?? null }, after: { jointTask: jointLabel(task.number), fitter: fitter?.name ?? null },
      },
      t,
    );
  });
  const [dto] = await taskDtos(workOrderId, [id]);
  return dto!;
}
