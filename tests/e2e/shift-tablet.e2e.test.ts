// The shift tablet end to end, in Chromium at tablet size: the fitter puts their locks on in the
// browser and operations verifies zero energy on another tablet; the fitter opens the joint from the
// shift view and records its steps, the depth marks with a photo; the network drops, cement and
// assembly are kept on the tablet (the header counts them), the page is reloaded with no network
// (the service worker serves the app shell, the tablet's store the joint and its writes), and once
// the network is back every step reaches the server exactly once and the order is curing.
import { Op } from 'sequelize';
import sharp from 'sharp';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { Line } from '@server/db/models/line';
import { JointStepRecord, Photo } from '@server/db/models/joint-record';
import { WorkOrder } from '@server/db/models/work-order';
import { APP } from '../helpers/browserless';
import { applyMyLocksInBrowser, verifyZeroEnergyInBrowser } from '../helpers/lock-board-page';
import type { Route } from 'playwright-core';
import { useBrowserApp } from '../helpers/browser-app';
import { plannedOrder } from '../helpers/lockout';
import { plantForWorkOrders } from '../helpers/work-orders';

const { pageAs, users } = useBrowserApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
const madeOrders: string[] = [];
const madeLines: string[] = [];
afterAll(async () => {
  await WorkOrder.destroy({ where: { id: madeOrders } }); // its joints, locks, steps, holds and photos go with it
  await Line.destroy({ where: { id: madeLines } });
});

/** The heading of one step in the joint's stepper, e.g. "Dry fit · recorded". */
const stepHeading = (page: Page, label: string, status: string) => page.getByRole('heading', { name: `${label} · ${status}`, exact: true });
const stepsOf = (jointId: string) => JointStepRecord.findAll({ where: { jointTaskId: jointId }, order: [['recordedAt', 'ASC']] });
const isoDay = (msAgo: number) => new Date(Date.now() - msAgo).toISOString().slice(0, 10);

describe('the shift tablet', () => {
  it('locks on and verified in the browser, a joint recorded step by step, cement and assembly kept offline through a reload, sent once when the network is back, and the order curing', { timeout: 240_000 }, async () => {
    const { order, lines, jointIds } = await plannedOrder(users, { word: 'E2ESHIFT', joints: 1 });
    madeOrders.push(order.id);
    madeLines.push(...lines.map((l) => l.id));
    const jointId = jointIds[0]!;
    const number = order.number as string;

    // ── The fitter's locks, on the order's lock board ─────────────────────────────────────────
    const fitter = await pageAs('fitter', `/work-orders/${order.id}`);
    await fitter.getByRole('heading', { name: number }).waitFor();
    await fitter.getByText('Not isolated: nobody works on the section until it is').waitFor();
    await applyMyLocksInBrowser(fitter, 2); // the register's valve and the plan's drain
    const points = fitter.getByRole('list', { name: 'Isolation points' });
    expect(await points.getByText('No lock: not protected').count()).toBe(0);

    // ── Operations, on a tablet of its own, verifies zero energy ──────────────────────────────
    const ops = await pageAs('operations', `/work-orders/${order.id}`);
    await verifyZeroEnergyInBrowser(ops, 2);
    await ops.getByRole('heading', { name: number }).getByText('Isolated').waitFor();
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('isolated');

    // ── The fitter's shift view, and the joint ────────────────────────────────────────────────
    await fitter.goto(`${APP}/shift`);
    await fitter.getByRole('heading', { name: 'My shift' }).waitFor();
    const lockout = fitter.getByRole('list', { name: `Lockout of ${number}` });
    await lockout.getByText('Section isolated and verified').waitFor();
    await lockout.getByText('Your lock is on').waitFor();
    const jointRow = fitter.getByRole('region', { name: number }).getByRole('link', { name: /^J1\b/ }); // the fitter may have other orders' J1s on the shift
    await jointRow.getByText('Next: Prepare the ends').waitFor();
    await jointRow.click();
    await fitter.waitForURL(`${APP}/joints/${jointId}`);
    await fitter.getByRole('heading', { name: 'J1', exact: true }).waitFor();

    // The app shell's service worker: registered once someone is signed in; it must control the page before the network goes.
    const workerReady = await fitter.evaluate(() =>
      Promise.race([navigator.serviceWorker.ready.then(() => true), new Promise<boolean>((resolve) => setTimeout(() => resolve(false), 30_000))]),
    );
    expect(workerReady, 'the service worker did not become active').toBe(true);
    if (!(await fitter.evaluate(() => !!navigator.serviceWorker.controller))) {
      await fitter.reload();
      await fitter.getByRole('heading', { name: 'J1', exact: true }).waitFor();
    }
    await fitter.waitForFunction(() => !!navigator.serviceWorker.controller);

    // Prepare the ends
    await stepHeading(fitter, 'Prepare the ends', 'to record now').waitFor();
    for (const box of ['The cut is square', 'Inside and outside are deburred', 'The end is chamfered', 'The surfaces are clean and dry']) await fitter.getByLabel(box).check();
    await fitter.getByRole('button', { name: 'Record: prepare the ends' }).click();
    await stepHeading(fitter, 'Prepare the ends', 'recorded').waitFor();

    // Dry fit: 2" Sch 80 takes 0.500–1.000 in dry
    await stepHeading(fitter, 'Dry fit', 'to record now').waitFor();
    await fitter.getByLabel('Measured dry insertion').fill('0.75');
    await fitter.getByText('✓ Inside the window.').waitFor();
    await fitter.getByRole('button', { name: 'Record: dry fit' }).click();
    await stepHeading(fitter, 'Dry fit', 'recorded').waitFor();
    await fitter.getByText('Entered 0.75 in dry').waitFor();

    // Depth marks, with a photo taken with the tablet's camera
    await stepHeading(fitter, 'Depth marks', 'to record now').waitFor();
    await fitter.getByLabel('The insertion mark is on the pipe').check();
    await fitter.getByLabel('The check mark is on the pipe').check();
    const marks = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#b45a1e' } }).jpeg().toBuffer();
    await fitter.getByLabel('Photo of the marks').setInputFiles({ name: 'marks.jpg', mimeType: 'image/jpeg', buffer: marks });
    await fitter.getByText('1 photo taken').waitFor();
    await fitter.getByRole('button', { name: 'Record: depth marks' }).click();
    await stepHeading(fitter, 'Depth marks', 'recorded').waitFor();
    await fitter.getByRole('img', { name: /^Photo by / }).waitFor(); // the recorded photo, from the server

    // Primer: the engine's standard is filled in
    await stepHeading(fitter, 'Primer', 'to record now').waitFor();
    expect(await fitter.getByLabel('Primer standard').inputValue()).toBe('ASTM F656');
    await fitter.getByLabel('Lot number (on the can)').fill('P-2291');
    await fitter.getByLabel('The primer softened a scrap of the pipe').check();
    await fitter.getByRole('button', { name: 'Record: primer' }).click();
    await stepHeading(fitter, 'Primer', 'recorded').waitFor();
    expect((await stepsOf(jointId)).map((s) => s.step)).toEqual(['prep', 'dry-fit', 'depth-marks', 'primer']);
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('in-work');

    // ── The network drops ─────────────────────────────────────────────────────────────────────
    // setOffline does not reach requests the service worker passes on, so the API is cut off too,
    // as a dropped network would: nothing the tablet sends may arrive until it is back.
    const cutOff = (route: Route) => route.abort('internetdisconnected');
    await fitter.context().route('**/api/**', cutOff);
    await fitter.context().setOffline(true);
    const pill = fitter.getByRole('status').filter({ hasText: 'Offline' });
    await pill.waitFor();

    // Cement: the engine's standard is filled in; a can made half a year ago, 70 °F, 50 % RH
    await stepHeading(fitter, 'Cement', 'to record now').waitFor();
    expect(await fitter.getByLabel('Cement standard').inputValue()).toBe('ASTM D2564');
    await fitter.getByLabel('Lot number (on the can)').fill('C-7710');
    await fitter.getByLabel('Date stamped on the can').fill(isoDay(182 * 86_400_000));
    await fitter.getByLabel('Ambient temperature').fill('70');
    await fitter.getByLabel('Relative humidity (%)').fill('50');
    expect(await fitter.getByText('The server will likely refuse this cement').count()).toBe(0);
    await fitter.getByRole('button', { name: 'Record: cement' }).click();
    await stepHeading(fitter, 'Cement', 'waiting to send').waitFor();
    await pill.filter({ hasText: '1 waiting to send' }).waitFor();

    // Assembly: the hold counts down (30 s at 70 °F), and only then may it be recorded
    await stepHeading(fitter, 'Assemble and hold', 'to record now').waitFor();
    await fitter.getByLabel('The pipe went in while the cement was wet').check();
    const notYet = fitter.getByRole('button', { name: 'Record: once the hold has run out' });
    expect(await notYet.isDisabled()).toBe(true);
    await fitter.getByRole('button', { name: 'Start the hold' }).click();
    await fitter.getByText('Holding…').waitFor();
    const recordAssembly = fitter.getByRole('button', { name: /^Record: assembled, held \d+:\d\d$/ });
    await recordAssembly.waitFor({ timeout: 150_000 });
    expect(await recordAssembly.isEnabled()).toBe(true);
    await recordAssembly.click();
    await stepHeading(fitter, 'Assemble and hold', 'waiting to send').waitFor();
    await pill.filter({ hasText: 'Offline · 2 waiting to send' }).waitFor();
    expect((await stepsOf(jointId)).length).toBe(4); // nothing reached the server

    // A reload with no network: the service worker serves the app, the tablet's store the joint and its two writes
    expect(await fitter.evaluate(() => fetch('/api/me').then(() => 'reached the server', () => 'no network'))).toBe('no network');
    const reloaded = await fitter.reload();
    expect(reloaded?.fromServiceWorker()).toBe(true);
    await fitter.getByRole('heading', { name: 'J1', exact: true }).waitFor();
    await fitter.getByText('Shown as this tablet last saw it.').waitFor();
    await stepHeading(fitter, 'Primer', 'recorded').waitFor();
    await stepHeading(fitter, 'Cement', 'waiting to send').waitFor();
    await stepHeading(fitter, 'Assemble and hold', 'waiting to send').waitFor();
    await fitter.getByRole('status').filter({ hasText: 'Offline · 2 waiting to send' }).waitFor();
    expect((await stepsOf(jointId)).length).toBe(4);

    // ── The network is back: the two writes go, in order, once ────────────────────────────────
    await fitter.context().unroute('**/api/**', cutOff);
    await fitter.context().setOffline(false);
    await stepHeading(fitter, 'Cement', 'recorded').waitFor({ timeout: 30_000 });
    await stepHeading(fitter, 'Assemble and hold', 'recorded').waitFor({ timeout: 30_000 });
    await fitter.getByRole('status').filter({ hasText: /waiting to send|Offline|not recorded/ }).waitFor({ state: 'detached' });
    await fitter.getByRole('heading', { name: 'Holds', exact: true }).waitFor();

    const steps = await stepsOf(jointId);
    expect(steps.map((s) => s.step)).toEqual(['prep', 'dry-fit', 'depth-marks', 'primer', 'cement', 'assembly']);
    expect(steps.find((s) => s.step === 'cement')!.values).toMatchObject({ lot: 'C-7710', ambientTemperature: 70, temperatureUnit: 'F', temperatureF: 70, relativeHumidity: 50 });
    expect(Number(steps.find((s) => s.step === 'assembly')!.values.heldSeconds)).toBeGreaterThanOrEqual(30);
    expect(await Photo.count({ where: { jointTaskId: jointId, step: 'depth-marks' } })).toBe(1);
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('curing');

    // The bead wiped, with a photo of the finished joint, online: the seventh step
    await stepHeading(fitter, 'Wipe the bead', 'to record now').waitFor();
    await fitter.getByLabel('The bead is wiped').check();
    await fitter.getByLabel('Photo of the finished joint').setInputFiles({ name: 'joint.jpg', mimeType: 'image/jpeg', buffer: marks });
    await fitter.getByText('1 photo taken').waitFor();
    await fitter.getByRole('button', { name: 'Record: wipe the bead' }).click();
    await stepHeading(fitter, 'Wipe the bead', 'recorded').waitFor();
    const all = await stepsOf(jointId);
    expect(all.map((s) => s.step)).toEqual(['prep', 'dry-fit', 'depth-marks', 'primer', 'cement', 'assembly', 'wipe']);
    expect(new Set(all.map((s) => s.step)).size).toBe(7);
    expect(await Photo.count({ where: { jointTaskId: jointId } })).toBe(2);

    // ── The order: curing, its holds counting down ────────────────────────────────────────────
    await fitter.goto(`${APP}/work-orders/${order.id}`);
    await fitter.getByRole('heading', { name: number }).getByText('Curing').waitFor();
    const holds = fitter.locator('section').filter({ has: fitter.getByRole('heading', { name: /^Holds \(\d+\)$/ }) });
    await holds.getByText('J1 Set').waitFor();
    await holds.getByText('J1 Cure').waitFor();
    const holdText = (await holds.textContent()) ?? '';
    expect(holdText).toMatch(/left · ends/);
    expect((await WorkOrder.findByPk(order.id, { attributes: ['state'] }))!.state).toBe('curing');
    expect(await JointStepRecord.count({ where: { jointTaskId: jointId, step: { [Op.in]: ['cement', 'assembly'] } } })).toBe(2);
  });
});
