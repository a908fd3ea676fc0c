// One joint as the tablet shows it (JointDetailDto), and the pieces the shift view shares: the
// recorded steps, the next step, what blocks it, its holds and photos. Read in bulk for many joints.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { JointTask } from '@server/db/models/joint-task';
import { DryFitRetry, Hold, JointStepRecord, Photo } from '@server/db/models/joint-record';
import { Line } from '@server/db/models/line';
import type { WorkOrder } from '@server/db/models/work-order';
import { AppError } from '@server/errors';
import { namesOf } from '@server/services/lockout/board';
import { readProtection, WORK_OPEN, type Protection } from '@server/services/lockout/protection';
import { findOrder, jointLabel } from '@server/services/work-orders/order-facts';
import { stateWords } from '@server/services/work-orders/states';
import { JOINT_STEP_LABELS, JOINT_STEPS, type BlockerDto, type HoldDto, type JointDetailDto, type JointStep, type PhotoDto } from '@shared/schemas/joint-steps';
import { jointEngine, stepCautions } from './engine';

export const NO_SUCH_JOINT = 'There is no such joint task.';
type Names = Map<string, string>;
const ref = (names: Names, id: string) => ({ id, name: names.get(id) ?? 'someone no longer listed' });

export function nextStepOf(recorded: readonly JointStep[], redone: boolean): JointStep | null {
  if (redone) return null;
  return JOINT_STEPS.find((s) => !recorded.includes(s)) ?? null;
}

export function toHoldDto(h: Hold, names: Names = new Map()): HoldDto {
  return {
    id: h.id, kind: h.kind, jointTaskId: h.jointTaskId, status: h.status, startsAt: h.startsAt.toISOString(), endsAt: h.endsAt?.toISOString() ?? null,
    temperatureF: h.temperatureF, relativeHumidity: h.relativeHumidity, pressurePsi: h.pressurePsi, schedule: h.schedule, basis: h.basis, source: h.source, voidReason: h.voidReason ?? null,
    engineering: h.engineeringById && h.engineeringReason && h.engineeringMinutes
      ? { by: ref(names, h.engineeringById), reason: h.engineeringReason, minutes: h.engineeringMinutes }
      : null,
  };
}

/** Holds as the API shows them, with the names of the supervisors who entered engineering cure times. */
export async function holdDtos(holds: Hold[], t?: Transaction): Promise<HoldDto[]> {
  const names = await namesOf(holds.map((h) => h.engineeringById), t);
  return holds.map((h) => toHoldDto(h, names));
}

const HOLD_WORDS = { set: 'do not handle the joint', cure: 'no pressure on the joint' } as const;

/** Why the person cannot record the next step of this joint now (empty: nothing stops them). */
export function blockersFor(input: {
  order: Pick<WorkOrder, 'number' | 'state'>;
  protection: Pick<Protection, 'isolated' | 'missing' | 'locks'>;
  personId: string;
  redone: boolean;
  replacedByLabel: string | null;
  holds: HoldDto[];
  nextStep: JointStep | null;
}): BlockerDto[] {
  const out: BlockerDto[] = [];
  const { order, protection } = input;
  if (input.redone) out.push({ kind: 'redone', message: `Cut out for redo${input.replacedByLabel ? `; ${input.replacedByLabel} replaces it` : ''}.`, until: null });
  if (input.nextStep) {
    if (order.state === 'planned' || (WORK_OPEN.includes(order.state) && !protection.isolated)) {
      out.push({ kind: 'isolation', message: `Isolation not verified: ${protection.missing.join(' ')}`, until: null });
    } else if (!WORK_OPEN.includes(order.state)) {
      out.push({ kind: 'order-state', message: `${order.number} is ${stateWords(order.state)}; joint steps are recorded while the section is isolated.`, until: null });
    }
    if (!protection.locks.some((l) => l.personId === input.personId) && order.state !== 'draft') {
      out.push({ kind: 'my-lock', message: `You have no lock on ${order.number}: put your own lock on before working on the section.`, until: null });
    }
  }
  const t = now().getTime();
  for (const h of input.holds) {
    if (h.status === 'running' && h.endsAt && new Date(h.endsAt).getTime() > t) {
      out.push({ kind: 'hold', message: `${h.kind === 'set' ? 'Set' : 'Cure'} hold: ${HOLD_WORDS[h.kind]}.`, until: h.endsAt });
    } else if (h.status === 'awaiting-engineering') {
      out.push({ kind: 'hold', message: `${h.kind === 'set' ? 'Set' : 'Cure'} hold waits for a supervisor's engineering cure time: ${h.basis}`, until: null });
    }
  }
  return out;
}

export interface JointRows {
  steps: Map<string, JointStepRecord[]>;
  holds: Map<string, Hold[]>;
  photos: Map<string, Photo[]>;
  retries: Map<string, DryFitRetry[]>;
  replacedBy: Map<string, JointTask>;
}

const group = <T extends { jointTaskId: string | null }>(rows: T[]) => {
  const m = new Map<string, T[]>();
  for (const r of rows) if (r.jointTaskId) (m.get(r.jointTaskId) ?? m.set(r.jointTaskId, []).get(r.jointTaskId)!).push(r);
  return m;
};

export async function jointRows(taskIds: string[], t?: Transaction): Promise<JointRows> {
  const where = { jointTaskId: { [Op.in]: taskIds } };
  const steps = await JointStepRecord.findAll({ where, order: [['recordedAt', 'ASC']], transaction: t });
  const holds = await Hold.findAll({ where, order: [['kind', 'DESC'], ['createdAt', 'ASC']], transaction: t });
  const photos = await Photo.findAll({ where, attributes: { exclude: ['content'] }, order: [['createdAt', 'ASC']], transaction: t });
  const retries = await DryFitRetry.findAll({ where, order: [['recordedAt', 'ASC']], transaction: t });
  const replacements = await JointTask.findAll({ where: { replacesTaskId: { [Op.in]: taskIds } }, transaction: t });
  return { steps: group(steps), holds: group(holds), photos: group(photos), retries: group(retries), replacedBy: new Map(replacements.map((r) => [r.replacesTaskId!, r])) };
}

export const photoDto = (p: Photo, names: Names): PhotoDto => ({
  id: p.id, step: p.step, url: `/api/photos/${p.id}`, width: p.width, height: p.height, takenBy: ref(names, p.takenById), takenAt: p.createdAt.toISOString(),
});

export async function findTask(id: string, t?: Transaction, lock = false): Promise<JointTask> {
  const task = await JointTask.findByPk(id, { transaction: t, ...(lock && t ? { lock: t.LOCK.UPDATE } : {}) });
  if (!task) throw AppError.notFound(NO_SUCH_JOINT);
  return task;
}

export async function jointDetail(taskId: string, personId: string, t?: Transaction): Promise<JointDetailDto> {
  const task = await findTask(taskId, t);
  const order = await findOrder(task.workOrderId, t);
  const line = (await Line.findByPk(task.lineId, { transaction: t }))!;
  const protection = await readProtection(order.id, t);
  const rows = await jointRows([task.id], t);
  const steps = rows.steps.get(task.id) ?? [];
  const holds = await holdDtos(rows.holds.get(task.id) ?? [], t);
  const photos = rows.photos.get(task.id) ?? [];
  const retries = rows.retries.get(task.id) ?? [];
  const replacedBy = rows.replacedBy.get(task.id) ?? null;
  const names = await namesOf([task.fitterId, task.redoneById, ...steps.map((s) => s.recordedById), ...photos.map((p) => p.takenById), ...retries.map((r) => r.recordedById)], t);
  const redone = task.redoneAt !== null && task.redoneAt !== undefined;
  const nextStep = nextStepOf(steps.map((s) => s.step), redone);
  const jointSize = task.reducingSize ?? task.nominalSize;
  return {
    id: task.id,
    label: jointLabel(task.number),
    workOrder: { id: order.id, number: order.number, state: order.state },
    line: { id: line.id, lineNumber: line.lineNumber, service: line.service, material: line.material, schedule: line.schedule, designPressurePsi: line.designPressurePsi },
    fittingKind: task.fittingKind,
    jointSize,
    fitter: task.fitterId ? ref(names, task.fitterId) : null,
    replacesTaskId: task.replacesTaskId ?? null,
    replacedByTaskId: replacedBy?.id ?? null,
    redo: redone && task.redoneById ? { reason: task.redoReason ?? '', by: ref(names, task.redoneById), at: task.redoneAt!.toISOString() } : null,
    engine: jointEngine(line, jointSize, order.forecastLowF),
    steps: steps.map((s) => ({ step: s.step, values: s.values, recordedBy: ref(names, s.recordedById), recordedAt: s.recordedAt.toISOString() })),
    nextStep,
    blockers: blockersFor({ order, protection, personId, redone, replacedByLabel: replacedBy ? jointLabel(replacedBy.number) : null, holds, nextStep }),
    holds,
    photos: photos.map((p) => photoDto(p, names)),
    dryFitRetries: retries.map((r) => ({ insertionIn: r.insertionIn, message: r.message, at: r.recordedAt.toISOString(), by: ref(names, r.recordedById) })),
    cautions: stepCautions(line.service),
  };
}

export const stepLabel = (s: JointStep) => JOINT_STEP_LABELS[s].toLowerCase();
