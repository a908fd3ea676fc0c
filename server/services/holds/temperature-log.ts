// A temperature log uploaded during the cure (DESIGN.md section 4): read and previewed, then
// applied. Each running set or cure hold of the order's live joints is recomputed through the
// engine's cureCompleteAt from its start, at its humidity, pressure and schedule; the log only
// ever lengthens a hold (the engine never returns an end before the planned one). A log that falls
// outside the published tables leaves the hold waiting for a supervisor's engineering entry.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { sequelize } from '@server/db/sequelize';
import { Hold, TemperatureLog } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { Line } from '@server/db/models/line';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { namesOf } from '@server/services/lockout/board';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { findOrder, jointLabel } from '@server/services/work-orders/order-facts';
import { stateWords } from '@server/services/work-orders/states';
import { cureCompleteAt } from '@shared/trade';
import type { TemperatureLogDto } from '@shared/schemas/joint-steps';
import type { Me } from '@shared/schemas/roles';
import { scheduleLifts } from './lift';
import { readTemperatureLog } from './temperature-csv';

const LOGGABLE = ['in-work', 'curing'];
const MINUTE = 60_000;

interface HoldChange { hold: Hold; joint: string; newEndsAt: Date | null; lengthenedMinutes: number; refusal: string | null }

/** What the log makes of each running hold of the order's live joints (engineering entries are left as entered). */
async function holdChanges(orderId: string, readings: TemperatureLog['readings'], t?: Transaction): Promise<HoldChange[]> {
  const live = await JointTask.findAll({ where: { workOrderId: orderId, redoneAt: { [Op.is]: null } }, transaction: t });
  const holds = await Hold.findAll({ where: { jointTaskId: { [Op.in]: live.map((j) => j.id) }, status: 'running', engineeringById: { [Op.is]: null } }, order: [['endsAt', 'ASC']], transaction: t });
  const lines = new Map((await Line.findAll({ where: { id: { [Op.in]: [...new Set(live.map((j) => j.lineId))] } }, transaction: t })).map((l) => [l.id, l]));
  return holds.map((hold) => {
    const task = live.find((j) => j.id === hold.jointTaskId)!;
    const line = lines.get(task.lineId)!;
    const result = cureCompleteAt({
      material: line.material, nominalSize: task.reducingSize ?? task.nominalSize, relativeHumidity: hold.relativeHumidity, pressurePsi: hold.pressurePsi,
      schedule: hold.schedule ?? undefined, cureStart: hold.startsAt, plannedEnd: hold.endsAt!, phase: hold.kind,
      readings: readings.map((r) => ({ at: new Date(r.at), temperatureF: r.temperatureF, relativeHumidity: r.relativeHumidity })),
    });
    const joint = jointLabel(task.number);
    if (!result.ok) return { hold, joint, newEndsAt: null, lengthenedMinutes: 0, refusal: result.reason };
    const later = Math.max(result.completeAt.getTime(), hold.endsAt!.getTime()); // never shorter
    return { hold, joint, newEndsAt: new Date(later), lengthenedMinutes: Math.round((later - hold.endsAt!.getTime()) / MINUTE), refusal: null };
  });
}

/** A hold's end now and by the log, as the API shows it (read before the hold is changed). */
const changeDto = (c: HoldChange): TemperatureLogDto['holds'][number] => ({ holdId: c.hold.id, joint: c.joint, kind: c.hold.kind, endsAt: c.hold.endsAt!.toISOString(), newEndsAt: c.newEndsAt?.toISOString() ?? null, lengthenedMinutes: c.lengthenedMinutes, refusal: c.refusal });

async function toDto(log: TemperatureLog, t?: Transaction): Promise<TemperatureLogDto> {
  const names = await namesOf([log.uploadedById], t);
  const changes = log.status === 'previewed' ? await holdChanges(log.workOrderId, log.readings, t) : [];
  return {
    id: log.id, workOrderId: log.workOrderId, fileName: log.fileName, uploadedBy: { id: log.uploadedById, name: names.get(log.uploadedById) ?? '' }, uploadedAt: log.uploadedAt.toISOString(),
    unit: log.unit, readings: log.readings, problems: log.problems, status: log.status, appliedAt: log.appliedAt?.toISOString() ?? null,
    holds: changes.map(changeDto),
  };
}

export async function uploadTemperatureLog(me: Me, orderId: string, fileName: string, buffer: Buffer): Promise<TemperatureLogDto> {
  const order = await findOrder(orderId);
  if (!LOGGABLE.includes(order.state)) throw AppError.conflict(`${order.number} is ${stateWords(order.state)}; a temperature log is read while its joints cure.`);
  const { timeZone } = await currentPlantSettings();
  const read = readTemperatureLog(buffer.toString('utf8'), timeZone);
  if (!read.readings.length) throw AppError.badRequest(`No readings could be taken from "${fileName}": ${read.problems.slice(0, 5).join(' ')}`);
  const log = await TemperatureLog.create({
    workOrderId: order.id, fileName, uploadedById: me.id, uploadedAt: now(), unit: read.unit,
    readings: read.readings.map((r) => ({ at: r.at.toISOString(), temperatureF: r.temperatureF, ...(r.relativeHumidity === undefined ? {} : { relativeHumidity: r.relativeHumidity }) })),
    problems: read.problems, status: 'previewed',
  });
  return toDto(log);
}

export async function applyTemperatureLog(me: Me, logId: string): Promise<TemperatureLogDto> {
  return sequelize.transaction(async (t) => {
    const found = await TemperatureLog.findByPk(logId, { transaction: t });
    if (!found) throw AppError.notFound('There is no such temperature log.');
    const order = await findOrder(found.workOrderId, t, { lock: true });
    const log = (await TemperatureLog.findByPk(logId, { transaction: t, lock: t.LOCK.UPDATE }))!;
    if (log.status === 'applied') throw AppError.conflict(`"${log.fileName}" was already applied.`);
    if (!LOGGABLE.includes(order.state)) throw AppError.conflict(`${order.number} is ${stateWords(order.state)}; a temperature log is applied while its joints cure.`);
    const changes = await holdChanges(order.id, log.readings, t);
    // the answer shows each hold's end before the log, so it is taken before the holds change
    const before = changes.map(changeDto);
    const moved: Hold[] = [];
    for (const c of changes) {
      if (c.refusal) {
        await c.hold.update({ status: 'awaiting-engineering', endsAt: null, basis: `${c.refusal} (temperature log "${log.fileName}")`, source: null }, { transaction: t });
      } else if (c.lengthenedMinutes > 0) {
        await c.hold.update({ endsAt: c.newEndsAt, basis: `${c.hold.basis}; lengthened ${c.lengthenedMinutes} min by the temperature log "${log.fileName}"` }, { transaction: t });
        moved.push(c.hold);
      }
    }
    scheduleLifts(moved, t);
    await log.update({ status: 'applied', appliedById: me.id, appliedAt: now() }, { transaction: t });
    await recordAudit({
      actorId: me.id, action: 'temperature-log-applied', entity: AUDIT_ENTITY, entityId: order.id,
      after: { file: log.fileName, readings: log.readings.length, lengthened: changes.filter((c) => c.lengthenedMinutes > 0).map((c) => `${c.joint} ${c.hold.kind} +${c.lengthenedMinutes} min`), refused: changes.filter((c) => c.refusal).map((c) => `${c.joint} ${c.hold.kind}`) },
    }, t);
    return { ...(await toDto(log, t)), holds: before };
  });
}

export async function listTemperatureLogs(orderId: string): Promise<TemperatureLogDto[]> {
  await findOrder(orderId);
  const logs = await TemperatureLog.findAll({ where: { workOrderId: orderId }, order: [['uploadedAt', 'ASC']] });
  return Promise.all(logs.map((l) => toDto(l)));
}
