import type { Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { PlantSetting } from '@server/db/models/plant-setting';
import { Person } from '@server/db/models/person';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import { DEFAULT_CURE_SCHEDULE_ID, listCureSchedules } from '@shared/trade';
import { DEFAULT_LOCK_LEFT_ON_MINUTES, DEFAULT_TIME_ZONE, effectiveWindowPlan, type PlantSettings, type PlantSettingsBody } from '@shared/schemas/plant-settings';
import type { Me } from '@shared/schemas/roles';

const SETTINGS_ID = 1;

/** The row's schedule, described; a stored id the code no longer lists is shown as unknown, not hidden. */
function describeSchedule(id: string) {
  return listCureSchedules().find((s) => s.id === id) ?? { id, name: `Unknown schedule ${id}`, source: 'not in this version of Linewright' };
}

async function toDto(row: PlantSetting | null): Promise<PlantSettings> {
  const cureScheduleId = row?.cureScheduleId ?? DEFAULT_CURE_SCHEDULE_ID;
  const who = row?.updatedById ? await Person.findByPk(row.updatedById) : null;
  const windowPlan = effectiveWindowPlan(row?.windowPlan);
  return {
    cureScheduleId,
    testCap: row?.testCap ?? 'rating',
    version: row?.version ?? 0,
    schedule: describeSchedule(cureScheduleId),
    updatedAt: row?.updatedById ? row.updatedAt.toISOString() : null,
    updatedBy: who ? { id: who.id, name: who.name } : null,
    timeZone: row?.timeZone ?? DEFAULT_TIME_ZONE,
    windowPlan: windowPlan.values,
    lockLeftOnMinutes: row?.lockLeftOnMinutes ?? DEFAULT_LOCK_LEFT_ON_MINUTES,
    atDefault: [...(row?.timeZone ? [] : ['timeZone']), ...windowPlan.defaults.map((k) => `windowPlan.${k}`), ...(row?.lockLeftOnMinutes ? [] : ['lockLeftOnMinutes'])],
  };
}

/** A time zone as the runtime names it ("america/chicago" → "America/Chicago"). */
const canonicalZone = (tz: string) => new Intl.DateTimeFormat('en', { timeZone: tz }).resolvedOptions().timeZone;

/** The plant's settings; inside a transaction, read on its connection (a second one could wait on a full pool). */
export async function currentPlantSettings(t?: Transaction): Promise<PlantSettings> {
  return toDto(await PlantSetting.findByPk(SETTINGS_ID, { transaction: t }));
}

const minuteUtc = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** 409 naming who saved the settings after the form was opened, and when. */
async function staleSave(setting: PlantSetting): Promise<AppError> {
  const who = setting.updatedById ? await Person.findByPk(setting.updatedById) : null;
  return new AppError(
    409,
    'stale_settings',
    `${who?.name ?? 'Someone'} changed the plant settings at ${minuteUtc(setting.updatedAt)}, after you opened them. ` +
      'Look at what they chose, then save again if your choice should stand.',
  );
}

/**
 * Writes the plant's choices and the audit entry in one transaction; the body is already
 * validated. Refused (409) when the row moved past the version the form was opened at.
 */
export async function setPlantSettings(actor: Me, body: PlantSettingsBody): Promise<PlantSettings> {
  const row = await sequelize.transaction(async (transaction) => {
    const [setting, created] = await PlantSetting.findOrCreate({ where: { id: SETTINGS_ID }, defaults: { id: SETTINGS_ID, updatedById: null, version: 0 }, transaction, lock: transaction.LOCK.UPDATE });
    if (!created && setting.version !== body.version) throw await staleSave(setting);
    const before = { cureScheduleId: setting.cureScheduleId, testCap: setting.testCap, timeZone: setting.timeZone, windowPlan: setting.windowPlan, lockLeftOnMinutes: setting.lockLeftOnMinutes };
    await setting.update(
      {
        cureScheduleId: body.cureScheduleId,
        testCap: body.testCap,
        ...(body.timeZone === undefined ? {} : { timeZone: body.timeZone === null ? null : canonicalZone(body.timeZone) }),
        ...(body.windowPlan === undefined ? {} : { windowPlan: body.windowPlan }),
        ...(body.lockLeftOnMinutes === undefined ? {} : { lockLeftOnMinutes: body.lockLeftOnMinutes }),
        updatedById: actor.id,
        version: setting.version + 1,
      },
      { transaction },
    );
    const after = { cureScheduleId: setting.cureScheduleId, testCap: setting.testCap, timeZone: setting.timeZone, windowPlan: setting.windowPlan, lockLeftOnMinutes: setting.lockLeftOnMinutes };
    await recordAudit({ actorId: actor.id, action: 'plant-settings-set', entity: 'plant-settings', entityId: String(SETTINGS_ID), before, after }, transaction);
    return setting;
  });
  return toDto(row);
}
