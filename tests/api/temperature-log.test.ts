// A data logger's temperature record uploaded during the cure: previewed, then applied; it
// lengthens a hold that ran colder than planned (and moves its lift), never shortens one, and a
// reading outside the published tables leaves the hold waiting for an engineering entry.
import { describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Hold } from '@server/db/models/joint-record';
import { holdJobId, holdsQueue } from '@server/queues/holds';
import { cureSchedule } from '@shared/trade';
import type { Browserless } from '../helpers/browserless';
import { useTestApp } from '../helpers/app';
import { isolatedOrder, recordStepsThrough } from '../helpers/lockout';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });

/** A logger file: two metadata lines, then readings every 30 min from the cure's start at `temperatureF`. */
function loggerCsv(from: Date, hours: number, temperatureF: number) {
  const rows = Array.from({ length: hours * 2 + 1 }, (_, i) => `${new Date(from.getTime() + i * 30 * 60_000).toISOString()},${temperatureF},50`);
  return `Logger,Riser rack T3\nSerial,TL-77120\nTimestamp,Temperature (°F),RH (%)\n${rows.join('\n')}\n`;
}

async function curingOrder() {
  const { order, jointIds } = await isolatedOrder(users, { joints: 1 });
  await recordStepsThrough(users.fitter, jointIds[0]!, 'assembly'); // recorded at 70 °F
  const cure = (await Hold.findOne({ where: { jointTaskId: jointIds[0], kind: 'cure' } }))!;
  return { order, cure };
}

const upload = (b: Browserless, orderId: string, csv: string) => b.upload(`/api/work-orders/${orderId}/temperature-logs`, 'logger.csv', csv);

describe('a temperature log', () => {
  it('that ran colder lengthens the cure by the engine, previewed first, and moves the hold\'s lift', async () => {
    const { order, cure } = await curingOrder();
    const hours = Math.ceil((cure.endsAt!.getTime() - cure.startsAt.getTime()) / 3_600_000) * 3;
    const res = await upload(users.fitter, order.id, loggerCsv(cure.startsAt, hours, 45));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'previewed', unit: 'F', problems: [] });
    const preview = res.body.holds.find((h: { holdId: string }) => h.holdId === cure.id);
    // at 45 °F (the 40–60 °F band) the engine asks longer than the 60–100 °F band the hold was planned at
    const cold = cureSchedule({ material: 'PVC', nominalSize: '2', temperatureF: 45, relativeHumidity: 50, pressurePsi: cure.pressurePsi, schedule: 'A' });
    if (!cold.ok) throw new Error(cold.reason);
    expect(Date.parse(preview.newEndsAt)).toBe(cure.startsAt.getTime() + cold.cureMinutes * 60_000);
    expect(preview.lengthenedMinutes).toBeGreaterThan(0);
    expect((await Hold.findByPk(cure.id))!.endsAt!.getTime()).toBe(cure.endsAt!.getTime()); // a preview changes nothing

    expect((await users.operations.post(`/api/temperature-logs/${res.body.id}/apply`)).status).toBe(403);
    const applied = await users.fitter.post(`/api/temperature-logs/${res.body.id}/apply`);
    expect(applied.status).toBe(200);
    // the answer shows the end before the log and the end by it
    expect(applied.body.holds.find((h: { holdId: string }) => h.holdId === cure.id)).toMatchObject({ endsAt: cure.endsAt!.toISOString(), newEndsAt: preview.newEndsAt });
    const after = (await Hold.findByPk(cure.id))!;
    expect(after.endsAt!.toISOString()).toBe(preview.newEndsAt);
    expect(after.basis).toContain('lengthened');
    await new Promise((r) => setTimeout(r, 300)); // the lift is moved after the commit
    const job = await holdsQueue().getJob(holdJobId(cure.id));
    expect(Math.abs(job!.timestamp + job!.delay - after.endsAt!.getTime())).toBeLessThan(2000);
    expect(await AuditEntry.count({ where: { entityId: order.id, action: 'temperature-log-applied' } })).toBe(1);
    expect((await users.fitter.post(`/api/temperature-logs/${res.body.id}/apply`)).status).toBe(409); // once
  });

  it('that ran warmer never shortens a hold', async () => {
    const { order, cure } = await curingOrder();
    const res = await upload(users.fitter, order.id, loggerCsv(cure.startsAt, 48, 95));
    expect(res.body.holds.find((h: { holdId: string }) => h.holdId === cure.id)).toMatchObject({ lengthenedMinutes: 0, newEndsAt: cure.endsAt!.toISOString() });
    await users.fitter.post(`/api/temperature-logs/${res.body.id}/apply`);
    expect((await Hold.findByPk(cure.id))!.endsAt!.getTime()).toBe(cure.endsAt!.getTime());
  });

  it('below the published tables leaves the hold waiting for an engineering entry', async () => {
    const { order, cure } = await curingOrder();
    const res = await upload(users.fitter, order.id, loggerCsv(cure.startsAt, 6, -5));
    expect(res.body.holds.find((h: { holdId: string }) => h.holdId === cure.id).refusal).toMatch(/Engineering judgement needed/);
    await users.fitter.post(`/api/temperature-logs/${res.body.id}/apply`);
    expect(await Hold.findByPk(cure.id)).toMatchObject({ status: 'awaiting-engineering', endsAt: null });
  });

  it('without a unit in the temperature header is refused with the reason', async () => {
    const { order } = await curingOrder();
    const res = await upload(users.fitter, order.id, 'Time,Temperature\n2026-12-02 08:00,61\n');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/does not say °F or °C/);
  });
});
