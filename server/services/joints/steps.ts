// Recording a joint's step (DESIGN.md section 9). Inside the write's transaction, holding the
// order's row lock: the section must be isolated by the database (every point locked, zero energy
// verified), the person must have their own lock on, the steps go in order, a step recorded
// differently by another tablet is a conflict, and each value is checked by the trade engine.
// Assembly creates the holds; the first step moves the order to in work, the last assembly to curing.

import { Op, type Transaction } from 'sequelize';
import { isDeepStrictEqual } from 'node:util';
import { now } from '@server/clock';
import { JointTask } from '@server/db/models/joint-task';
import { DryFitRetry, JointStepRecord } from '@server/db/models/joint-record';
import { Line } from '@server/db/models/line';
import { Person } from '@server/db/models/person';
import type { WorkOrder } from '@server/db/models/work-order';
import { AppError } from '@server/errors';
import { errorBody, type WriteResult } from '@server/middleware/idempotency';
import { recordAudit } from '@server/services/audit-service';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { readProtection, WORK_OPEN } from '@server/services/lockout/protection';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { findOrder, jointLabel } from '@server/services/work-orders/order-facts';
import { moveTo, stateWords } from '@server/services/work-orders/states';
import { assemblyHoldSeconds, cementCheck, cementShelfLife, crewAndTools, cToF, dryFitCheck, mmToIn, primerCheck } from '@shared/trade';
import { JOINT_STEPS, type StepRecord } from '@shared/schemas/joint-steps';
import type { Me } from '@shared/schemas/roles';
import { onPressureService, socketSchedule } from './engine';
import { createJointHolds, cureConditions } from './holds';
import { findTask, jointDetail, nextStepOf, stepLabel } from './joint-view';

const refused = (message: string) => new AppError(409, 'step_refused', message);
const minuteUtc = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** A recorded step's values in a few words, for a conflict message. */
function valuesInWords(values: Record<string, unknown>): string {
  return Object.entries(values).map(([k, v]) => `${k} ${String(v)}`).join(', ');
}

/** 409 unless the section is isolated by the database and the person has their own lock on it. */
async function assertMayWork(me: Me, order: WorkOrder, t: Transaction): Promise<void> {
  const p = await readProtection(order.id, t);
  if (order.state === 'planned' || order.state === 'draft') {
    throw new AppError(409, 'state_conflict', `No joint step can be recorded on ${order.number} before its section is isolated: ${p.missing.join(' ')}`);
  }
  if (!WORK_OPEN.includes(order.state)) throw new AppError(409, 'state_conflict', `${order.number} is ${stateWords(order.state)}; joint steps are recorded while the section is isolated and worked on.`);
  if (!p.isolated) throw new AppError(409, 'state_conflict', `${order.number}'s section is not isolated now: ${p.missing.join(' ')}`);
  if (!p.locks.some((l) => l.personId === me.id)) {
    throw new AppError(409, 'my_lock_missing', `You have no lock on ${order.number}. Put your own lock on a point or the lock box before working on the section (OSHA 29 CFR 1910.147(d)(4)).`);
  }
}

/** Checks a step's values with the engine; a dry fit outside the window is answered, not thrown, so its retry is kept. */
async function checkValues(body: StepRecord, ctx: { task: JointTask; line: Line; jointSize: string; t: Transaction }): Promise<{ values: Record<string, unknown>; dryFitRefusal?: { insertionIn: number; message: string } }> {
  const { line, jointSize, task, t } = ctx;
  switch (body.step) {
    case 'dry-fit': {
      const insertionIn = body.values.unit === 'mm' ? mmToIn(body.values.insertion) : body.values.insertion;
      const fit = dryFitCheck({ nominalSize: jointSize, schedule: socketSchedule(line).schedule, dryInsertionIn: insertionIn });
      if (!fit.ok) throw refused(fit.reason);
      const values = { ...body.values, insertionIn: Math.round(insertionIn * 1000) / 1000, socketDepthIn: fit.socketDepthIn, fit: fit.fit };
      if (fit.fit !== 'ok') {
        const window = `${fit.minIn.toFixed(3)}–${fit.maxIn.toFixed(3)} in`;
        return { values, dryFitRefusal: { insertionIn, message: `${fit.message} It entered ${insertionIn.toFixed(3)} in; a ${jointSize}" socket ${fit.socketDepthIn} in deep takes ${window} dry. Re-cut the pipe or take another fitting, then record the dry fit again.` } };
      }
      return { values };
    }
    case 'primer': {
      const check = primerCheck({ pipeMaterial: line.material, primerStandard: body.values.standard });
      if (!check.ok) throw refused(check.problems.join(' '));
      return { values: body.values };
    }
    case 'cement': {
      const v = body.values;
      const problems = cementCheck({ pipeMaterial: line.material, cementStandard: v.standard, nominalSize: jointSize, pressureService: onPressureService(line) }).problems;
      const life = cementShelfLife({ manufacturedOn: `${v.manufacturedOn}T00:00:00Z`, now: now() });
      if (!life.ok) problems.push(life.reason);
      else if (life.expired) problems.push(`Cement lot ${v.lot} made ${v.manufacturedOn} expired on ${life.expiresAt.toISOString().slice(0, 10)} (about two years from its stamped date): do not use it.`);
      if (problems.length) throw refused(problems.join(' '));
      const temperatureF = v.temperatureUnit === 'C' ? cToF(v.ambientTemperature) : v.ambientTemperature;
      return { values: { ...v, temperatureF: Math.round(temperatureF * 10) / 10, expiresOn: life.ok ? life.expiresAt.toISOString().slice(0, 10) : null } };
    }
    case 'assembly': {
      const cement = await JointStepRecord.findOne({ where: { jointTaskId: task.id, step: 'cement' }, transaction: t });
      const temperatureF = Number((cement?.values as { temperatureF?: number } | undefined)?.temperatureF ?? 73);
      const hold = assemblyHoldSeconds(temperatureF);
      const crew = crewAndTools(jointSize);
      const problems: string[] = [];
      if (crew.ok && crew.mechanicalJoiningDevice && !body.values.joiningDeviceUsed) problems.push(`A ${jointSize}" joint needs a mechanical joining device to bottom the pipe evenly; cut it out and remake it with one.`);
      if (hold.ok && body.values.heldSeconds < hold.seconds) problems.push(`Hold the joint still at least ${hold.seconds} s at ${temperatureF} °F; it was held ${body.values.heldSeconds} s.`);
      if (problems.length) throw refused(problems.join(' '));
      return { values: { ...body.values, requiredHoldSeconds: hold.ok ? hold.seconds : null } };
    }
    default:
      return { values: body.values };
  }
}

/** Every live joint (not cut out for redo) of the order has its assembly recorded. */
async function everyJointAssembled(orderId: string, t: Transaction): Promise<boolean> {
  const live = await JointTask.findAll({ where: { workOrderId: orderId, redoneAt: { [Op.is]: null } }, attributes: ['id'], transaction: t });
  if (!live.length) return false;
  const assembled = await JointStepRecord.count({ where: { jointTaskId: { [Op.in]: live.map((j) => j.id) }, step: 'assembly' }, transaction: t });
  return assembled === live.length;
}

export async function recordStep(me: Me, taskId: string, body: StepRecord, t: Transaction): Promise<WriteResult> {
  const found = await findTask(taskId, t);
  const order = await findOrder(found.workOrderId, t, { lock: true });
  const task = await findTask(taskId, t, true);
  const label = jointLabel(task.number);
  if (task.redoneAt) throw new AppError(409, 'state_conflict', `${label} was cut out for redo; record the steps on the joint that replaces it.`);
  const existing = await JointStepRecord.findAll({ where: { jointTaskId: task.id }, transaction: t });
  const same = existing.find((s) => s.step === body.step);
  const line = (await Line.findByPk(task.lineId, { transaction: t }))!;
  const jointSize = task.reducingSize ?? task.nominalSize;
  if (same) {
    const by = await Person.findByPk(same.recordedById, { transaction: t });
    const wanted = await checkValues(body, { task, line, jointSize, t }).catch(() => null);
    if (wanted && isDeepStrictEqual(wanted.values, same.values) && same.recordedById === me.id) return { status: 200, body: await jointDetail(task.id, me.id, t) };
    throw new AppError(409, 'step_conflict',
      `${label}'s ${stepLabel(body.step)} was already recorded by ${by?.name ?? 'someone'} at ${minuteUtc(same.recordedAt)} (${valuesInWords(same.values)}). Yours was not recorded.`);
  }
  await assertMayWork(me, order, t);
  const next = nextStepOf(existing.map((s) => s.step), false);
  if (next !== body.step) {
    const i = JOINT_STEPS.indexOf(body.step);
    const missing = JOINT_STEPS.slice(0, i).filter((s) => !existing.some((e) => e.step === s));
    throw new AppError(409, 'step_out_of_order', `Record ${label}'s ${missing.map(stepLabel).join(', ')} before its ${stepLabel(body.step)}.`);
  }
  const checked = await checkValues(body, { task, line, jointSize, t });
  const at = now();
  if (checked.dryFitRefusal) {
    await DryFitRetry.create({ jointTaskId: task.id, insertionIn: checked.dryFitRefusal.insertionIn, message: checked.dryFitRefusal.message, recordedById: me.id, recordedAt: at }, { transaction: t });
    await recordAudit({ actorId: me.id, action: 'dry-fit-refused', entity: AUDIT_ENTITY, entityId: order.id, after: { jointTask: label, ...checked.values } }, t);
    return { status: 409, body: errorBody('dry_fit_outside', checked.dryFitRefusal.message) };
  }
  await JointStepRecord.create({ jointTaskId: task.id, step: body.step, values: checked.values, recordedById: me.id, recordedAt: at }, { transaction: t });
  const before = order.state;
  let state = order.state;
  if (state === 'isolated') state = moveTo(order, 'in-work');
  if (body.step === 'assembly') {
    const cement = existing.find((s) => s.step === 'cement')!.values as { temperatureF: number; relativeHumidity: number };
    const conditions = await cureConditions(order, { temperatureF: cement.temperatureF, relativeHumidity: cement.relativeHumidity }, t);
    const plant = await currentPlantSettings(t);
    await createJointHolds({ order, task, line, jointSize, at, conditions, cureScheduleId: plant.cureScheduleId }, t);
    if (await everyJointAssembled(order.id, t)) state = moveTo({ number: order.number, state }, 'curing');
  }
  if (state !== before) await order.update({ state, version: order.version + 1 }, { transaction: t });
  await recordAudit({
    actorId: me.id, action: 'joint-step-recorded', entity: AUDIT_ENTITY, entityId: order.id,
    before: state !== before ? { state: before } : null, after: { jointTask: label, step: body.step, ...checked.values, ...(state !== before ? { state } : {}) },
  }, t);
  return { status: 201, body: await jointDetail(task.id, me.id, t) };
}
