// The window plan's minutes and the plant's time zone: defaults marked as defaults until an admin sets the plant's own.
import { afterEach, describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { PlantSetting } from '@server/db/models/plant-setting';
import { WINDOW_PLAN_DEFAULTS } from '@shared/schemas/plant-settings';
import { useTestApp } from '../helpers/app';
import { makeIsolationPoint, makeLines, uniquePrefix } from '../helpers/line-rows';
import { plannableOrder, plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['admin', 'planner'], before: plantForWorkOrders });
afterEach(plantForWorkOrders);
const reset = () => PlantSetting.update({ windowPlan: {}, timeZone: null, lockLeftOnMinutes: null }, { where: { id: 1 } });

describe('the window-plan settings', () => {
  it('every default is marked as a default, and so is the time zone until one is set', async () => {
    await reset();
    const res = await users.planner.get('/api/plant-settings');
    expect(res.body).toMatchObject({ timeZone: 'UTC', windowPlan: WINDOW_PLAN_DEFAULTS });
    expect(res.body.atDefault).toEqual(['timeZone', ...Object.keys(WINDOW_PLAN_DEFAULTS).map((k) => `windowPlan.${k}`), 'lockLeftOnMinutes']);
  });

  it("an admin sets the plant's own minutes and time zone: written, audited, no longer marked, and the window plan uses them", async () => {
    const { version } = (await users.admin.get('/api/plant-settings')).body;
    const res = await users.admin.put('/api/plant-settings', {
      cureScheduleId: 'A', testCap: 'rating', version, timeZone: 'america/denver', windowPlan: { isolationPerOrderMinutes: 60, releaseMinutes: 90 },
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ timeZone: 'America/Denver', windowPlan: { ...WINDOW_PLAN_DEFAULTS, isolationPerOrderMinutes: 60, releaseMinutes: 90 } });
    expect(res.body.atDefault).toEqual(['windowPlan.isolationPerPointMinutes', 'windowPlan.jointMinutesBySize', 'windowPlan.fillAndVentMinutes', 'lockLeftOnMinutes']);
    expect(await PlantSetting.findByPk(1)).toMatchObject({ timeZone: 'America/Denver', windowPlan: { isolationPerOrderMinutes: 60, releaseMinutes: 90 } });
    const audit = await AuditEntry.findOne({ where: { action: 'plant-settings-set' }, order: [['id', 'DESC']] });
    expect(audit?.after).toMatchObject({ timeZone: 'America/Denver', windowPlan: { isolationPerOrderMinutes: 60, releaseMinutes: 90 } });

    const p = uniquePrefix('WPS');
    const lines = await makeLines(p, [{}]);
    await makeIsolationPoint(lines[0]!, `${p}-HV-1`);
    const order = await plannableOrder(users.planner, lines);
    const [isolation, , , , release] = order.windowPlan.steps;
    expect(isolation).toMatchObject({ minutes: 60 + 10 * 2, source: 'plant settings: 60 min per order + 10 min per point (default) × 2 points' });
    expect(release).toMatchObject({ minutes: 90, source: 'plant settings: inspection and slow refill 90 min' });
    expect(order.windowPlan.timeZone).toBe('America/Denver');
  });

  it('a time zone the runtime does not know, or size bands out of order, are a 400 on the field and nothing changes', async () => {
    const { version } = (await users.admin.get('/api/plant-settings')).body;
    const res = await users.admin.put('/api/plant-settings', {
      cureScheduleId: 'A', testCap: 'rating', version, timeZone: 'Mars/Olympus', windowPlan: { jointMinutesBySize: [{ upToIn: 4, minutes: 30 }, { upToIn: 2, minutes: 20 }] },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details.timeZone).toEqual(['not a time zone name (e.g. America/Chicago)']);
    expect(res.body.error.details['windowPlan.jointMinutesBySize']).toContain('list the size bands from small to large');
    expect((await PlantSetting.findByPk(1))?.version).toBe(version);
  });
});
