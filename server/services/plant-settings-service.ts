import { sequelize } from '@server/db/sequelize';
import { PlantSetting } from '@server/db/models/plant-setting';
import { Person } from '@server/db/models/person';
import { recordAudit } from '@server/services/audit-service';
import { DEFAULT_CURE_SCHEDULE_ID, listCureSchedules } from '@shared/trade';
import type { PlantSettings, PlantSettingsBody } from '@shared/schemas/plant-settings';
import type { Me } from '@shared/schemas/roles';

const SETTINGS_ID = 1;

/** The row's schedule, described; a stored id the code no longer lists is shown as unknown, not hidden. */
function describeSchedule(id: string) {
  return listCureSchedules().find((s) => s.id === id) ?? { id, name: `Unknown schedule ${id}`, source: 'not in this version of Linewright' };
}

async function toDto(row: PlantSetting | null): Promise<PlantSettings> {
  const cureScheduleId = row?.cureScheduleId ?? DEFAULT_CURE_SCHEDULE_ID;
  const who = row?.updatedById ? await Person.findByPk(row.updatedById) : null;
  return {
    cureScheduleId,
    testCap: row?.testCap ?? 'rating',
    schedule: describeSchedule(cureScheduleId),
    updatedAt: row?.updatedById ? row.updatedAt.toISOString() : null,
    updatedBy: who ? { id: who.id, name: who.name } : null,
  };
}

export async function currentPlantSettings(): Promise<PlantSettings> {
  return toDto(await PlantSetting.findByPk(SETTINGS_ID));
}

/** Writes the plant's choices and the audit entry in one transaction; the body is already validated. */
export async function setPlantSettings(actor: Me, body: PlantSettingsBody): Promise<PlantSettings> {
  const row = await sequelize.transaction(async (transaction) => {
    const [setting] = await PlantSetting.findOrCreate({ where: { id: SETTINGS_ID }, defaults: { id: SETTINGS_ID, updatedById: null }, transaction, lock: transaction.LOCK.UPDATE });
    const before = { cureScheduleId: setting.cureScheduleId, testCap: setting.testCap };
    await setting.update({ cureScheduleId: body.cureScheduleId, testCap: body.testCap, updatedById: actor.id }, { transaction });
    const after = { cureScheduleId: setting.cureScheduleId, testCap: setting.testCap };
    await recordAudit({ actorId: actor.id, action: 'plant-settings-set', entity: 'plant-settings', entityId: String(SETTINGS_ID), before, after }, transaction);
    return setting;
  });
  return toDto(row);
}
