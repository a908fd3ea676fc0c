import { Op } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { Line } from '@server/db/models/line';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { JointTask } from '@server/db/models/joint-task';
import { WorkOrder } from '@server/db/models/work-order';
import { duration } from '@/lib/format';
import { APP } from '../helpers/browserless';
import { useBrowserApp } from '../helpers/browser-app';
import { makeIsolationPoint, makeLines, uniquePrefix } from '../helpers/line-rows';
import { plannableOrder, plantForWorkOrders } from '../helpers/work-orders';

const { pageAs, users } = useBrowserApp({ signIn: ['planner'], before: plantForWorkOrders });
const prefix = uniquePrefix('E2EWO');
const madeOrders: string[] = [];
afterAll(async () => {
  await WorkOrder.destroy({ where: { id: madeOrders } }); // its joints and plan go with it
  await Line.destroy({ where: { lineNumber: { [Op.like]: `${prefix}-%` } } });
});

describe('planning a work order in the browser', () => {
  it('a planner writes an order with two joints of different sizes and an isolation plan, finds it does not fit a short window, lengthens the window, plans it, and finds it on the schedule and the line', async () => {
    const [line] = await makeLines(prefix, [{ nominalSize: '4', service: 'Sulfuric acid 93%', designPressurePsi: 100 }]);
    await makeIsolationPoint(line!, `${prefix}-HV-1`);

    // The window is typed in the viewer's zone (Chicago, UTC−5 in April) and stored as the instant it means.
    const page = await pageAs('planner', '/work-orders', { timezoneId: 'America/Chicago' });
    await page.getByRole('heading', { name: 'Work orders' }).waitFor();
    await page.getByRole('main').getByRole('link', { name: 'New work order' }).first().click();
    await page.getByRole('heading', { name: 'New work order' }).waitFor();

    // The order: a 4-hour window (in the browser's zone), a forecast low typed in °C.
    await page.getByLabel('Scope: what is cut out, what is made').fill('Cut out the weeping coupling; tee in a 2" sample branch.');
    await page.getByLabel('Requested by').fill('Maud Okafor');
    await page.getByLabel('Find a line to add').fill(prefix);
    await page.getByRole('button', { name: `Add ${line!.lineNumber}` }).click();
    await page.getByRole('list', { name: 'Chosen lines' }).getByRole('button', { name: new RegExp(`^${line!.lineNumber} .*take it off the order$`) }).waitFor();
    await page.getByLabel('Window start').fill('2027-04-05T06:00');
    await page.getByLabel('Window end').fill('2027-04-05T10:00');
    await page.getByText('°C', { exact: true }).click();
    await page.getByLabel('Lowest temperature (°C)').fill('20');
    await page.getByLabel('Highest relative humidity (%)').fill('40');
    await page.getByRole('button', { name: 'Create the order' }).click();
    await page.waitForURL(/\/work-orders\/[0-9a-f-]{36}$/);
    const orderId = page.url().split('/').pop()!;
    madeOrders.push(orderId);
    const order = await WorkOrder.findByPk(orderId);
    expect(order).toMatchObject({ state: 'draft', forecastLowF: 68, forecastHighRh: 40, requestedBy: 'Maud Okafor' });
    expect(order!.windowStart!.toISOString()).toBe('2027-04-05T11:00:00.000Z');
    expect(order!.windowEnd!.toISOString()).toBe('2027-04-05T15:00:00.000Z');
    await page.getByRole('heading', { name: order!.number }).waitFor();
    await page.getByText('Chemical service: Sulfuric acid 93%').waitFor();

    // Two joints: a coupling at the line's 4", a tee's 2" branch.
    const addJoints = page.getByRole('form', { name: 'Add joints' });
    await addJoints.getByLabel('Fitting kind').selectOption('coupling');
    await addJoints.getByRole('button', { name: 'Add' }).click();
    await page.getByRole('heading', { name: 'Joint tasks (1)' }).waitFor();
    await addJoints.getByLabel('Fitting kind').selectOption('tee');
    await addJoints.getByLabel('Reducing size').selectOption('2');
    await addJoints.getByRole('button', { name: 'Add' }).click();
    await page.getByRole('heading', { name: 'Joint tasks (2)' }).waitFor();
    const joints = await page.locator('table').filter({ hasText: 'Fitting' }).locator('tbody tr').allTextContents();
    expect(joints[0]).toMatch(/J1.*Coupling.*4"/);
    expect(joints[1]).toMatch(/J2.*Tee.*2" \(on 4"\)/);

    // The isolation plan starts from the register's valve; a drain is added.
    await page.getByRole('button', { name: 'Make the plan' }).click();
    await page.getByRole('checkbox', { name: new RegExp(`${prefix}-HV-1`) }).waitFor();
    expect(await page.getByRole('checkbox', { name: new RegExp(`${prefix}-HV-1`) }).isChecked()).toBe(true);
    await page.getByRole('button', { name: 'Add a drain' }).click();
    await page.getByLabel('Tag of added point 1').fill(`${prefix}-DR-1`);
    await page.getByRole('button', { name: 'Save the isolation plan' }).click();
    await page.getByRole('heading', { name: 'Isolation plan (2)' }).waitFor();

    // Materials and the window plan: it does not fit four hours.
    const materials = page.locator('section').filter({ has: page.getByRole('heading', { name: 'Materials' }) });
    await materials.getByText('Cement to bring').waitFor();
    expect(await materials.textContent()).toMatch(/PVC.*ASTM D2564/);
    await page.getByText('The plan does not fit the window').waitFor();
    const verdict = await page.getByRole('note').filter({ hasText: 'The plan does not fit the window' }).textContent();
    // The page says what the server's window plan says: the step that runs past the end, and the end it needs.
    const plan = (await users.planner.get(`/api/work-orders/${orderId}/window-plan`)).body;
    expect(plan.fits).toBe(false);
    expect(verdict).toContain(`${plan.late.stepLabel} makes it late. To fit, the window must end at`);
    expect(verdict).toContain(`${duration(plan.late.lateByMinutes)} after the window ends`);
    await page.locator('svg').filter({ hasText: 'window ends' }).waitFor();

    // Lengthen the window to two days and plan it.
    await page.getByRole('link', { name: 'Edit the order' }).click();
    await page.getByLabel('Window end').fill('2027-04-07T06:00');
    await page.getByRole('button', { name: 'Save the changes' }).click();
    await page.waitForURL(`${APP}/work-orders/${orderId}`);
    await page.getByText('The plan fits the window').waitFor();
    await page.getByRole('button', { name: 'Submit the plan' }).click();
    await page.getByRole('button', { name: 'Plan the order' }).click();
    await page.getByRole('heading', { name: order!.number }).getByText('Planned').waitFor();

    const planned = await WorkOrder.findByPk(orderId);
    expect(planned).toMatchObject({ state: 'planned', lateReason: null });
    expect(planned!.windowEnd!.toISOString()).toBe('2027-04-07T11:00:00.000Z');
    const tasks = await JointTask.findAll({ where: { workOrderId: orderId }, order: [['number', 'ASC']] });
    expect(tasks.map((t) => [t.fittingKind, t.nominalSize, t.reducingSize])).toEqual([['coupling', '4', null], ['tee', '4', '2']]);
    const entries = await IsolationPlanEntry.findAll({ where: { workOrderId: orderId }, order: [['sortOrder', 'ASC']] });
    expect(entries.map((e) => [e.tag, e.kind, e.requiredPosition])).toEqual([[`${prefix}-HV-1`, 'valve', 'closed'], [`${prefix}-DR-1`, 'drain', 'open']]);

    // On the schedule for its week, and on the line's page.
    await page.goto(`${APP}/schedule?week=2027-04-05`);
    await page.getByRole('link', { name: new RegExp(`^${planned!.number}, Planned`) }).waitFor();
    await page.getByRole('link', { name: line!.lineNumber }).click();
    await page.getByRole('heading', { name: line!.lineNumber }).waitFor();
    const card = page.locator('section').filter({ has: page.getByRole('heading', { name: 'Work orders (1)' }) });
    await card.getByRole('link', { name: planned!.number }).waitFor();
    expect(await card.textContent()).toContain('Planned');
  });

  it('a cure outside the published table is shown as a refusal that names the supervisor, with no figure and no verdict', async () => {
    // 12" at a 150 psi test: schedule A's 10"–15" band prints only up to 100 psi.
    const [line] = await makeLines(`${prefix}-R`, [{ nominalSize: '12', designPressurePsi: 100 }]);
    await makeIsolationPoint(line!, `${prefix}-R-HV-1`);
    const order = await plannableOrder(users.planner, [line!]);
    madeOrders.push(order.id);

    const page = await pageAs('planner', `/work-orders/${order.id}`);
    const refusal = page.getByRole('alert').filter({ hasText: 'Set and cure: the trade engine gives no figure' });
    await refusal.waitFor();
    expect(await refusal.textContent()).toMatch(/Pressure 150 psi is above the highest column.*A supervisor decides/);
    const cure = page.getByRole('listitem').filter({ hasText: 'Set and cure' }).filter({ hasText: 'cannot be computed' });
    await cure.waitFor();
    expect(await page.getByText(/The plan (fits|does not fit) the window/).count()).toBe(0);
    expect(await page.getByText('Earliest release').count()).toBe(0);
  });

  it('a pipefitter sees the orders but is offered no new order, edit or plan', async () => {
    const page = await pageAs('fitter', '/work-orders');
    await page.getByRole('heading', { name: 'Work orders' }).waitFor();
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Schedule' }).waitFor();
    expect(await page.getByRole('link', { name: 'New work order' }).count()).toBe(0);
  });
});
