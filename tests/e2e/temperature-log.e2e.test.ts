// A fitter reads a data logger's CSV on a curing order's page at tablet width: the preview names
// the cure hold the cold log lengthens (and by how much) and changes nothing; applying it moves the
// hold's end in the database and on the page, and the plot draws the readings against the cure
// bands with the joint's cure end.
import { afterAll, describe, expect, it } from 'vitest';
import { Hold } from '@server/db/models/joint-record';
import { WorkOrder } from '@server/db/models/work-order';
import { useBrowserApp } from '../helpers/browser-app';
import { isolatedOrder, recordStepsThrough } from '../helpers/lockout';
import { plantForWorkOrders } from '../helpers/work-orders';

const { pageAs, users } = useBrowserApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
const madeOrders: string[] = [];
afterAll(async () => void (await WorkOrder.destroy({ where: { id: madeOrders } })));

/** Two metadata lines, then a reading every 30 min at `temperatureF` from `from`, local times as a logger writes them. */
function loggerCsv(from: Date, hours: number, temperatureF: number) {
  const rows = Array.from({ length: hours * 2 + 1 }, (_, i) => `${new Date(from.getTime() + i * 30 * 60_000).toISOString().slice(0, 16).replace('T', ' ')},${temperatureF},48`);
  return `Logger,Pipe rack T4\nSerial,TL-55102\nTime,Temp (°F),RH (%)\n${rows.join('\n')}\n`;
}

describe('the temperature log on the order page', () => {
  it('is read, previewed (nothing changes), applied (the cure hold ends later) and plotted', async () => {
    const { order, jointIds } = await isolatedOrder(users, { joints: 1 });
    madeOrders.push(order.id);
    await recordStepsThrough(users.fitter, jointIds[0]!, 'assembly'); // planned at 70 °F
    const cure = (await Hold.findOne({ where: { jointTaskId: jointIds[0], kind: 'cure' } }))!;
    const hours = Math.ceil((cure.endsAt!.getTime() - cure.startsAt.getTime()) / 3_600_000) * 3;

    const page = await pageAs('fitter', `/work-orders/${order.id}`, { timezoneId: 'UTC' });
    const card = page.locator('section').filter({ has: page.getByRole('heading', { level: 2, name: 'Temperature logs', exact: true }) });
    await card.getByLabel("The data logger's CSV").setInputFiles({ name: 'rack-t4.csv', mimeType: 'text/csv', buffer: Buffer.from(loggerCsv(cure.startsAt, hours, 45)) });
    await card.getByRole('button', { name: 'Read the log' }).click();

    const preview = card.getByRole('region', { name: 'Preview of rack-t4.csv' });
    await preview.waitFor();
    await expect(preview.getByText(/read in °F/).isVisible()).resolves.toBe(true);
    const row = preview.getByRole('row').filter({ hasText: 'cure' });
    await expect(row.getByText(/\(\+\d+ min\)/).textContent()).resolves.toMatch(/\+\d+ min/);
    expect((await Hold.findByPk(cure.id))!.endsAt!.getTime()).toBe(cure.endsAt!.getTime()); // a preview changes nothing
    await expect(card.getByRole('img', { name: /cure end by the log/ }).isVisible()).resolves.toBe(true);

    await preview.getByRole('button', { name: 'Apply to the holds' }).click();
    await card.getByText('"rack-t4.csv" applied').waitFor();
    const after = (await Hold.findByPk(cure.id))!;
    expect(after.endsAt!.getTime()).toBeGreaterThan(cure.endsAt!.getTime());
    await card.getByRole('heading', { name: 'Applied' }).waitFor();
    await expect(card.getByRole('img').getAttribute('aria-label')).resolves.toMatch(/J1 cure end/);
  });
});
