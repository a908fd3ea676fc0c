// From the register to a closed record, end to end in Chromium at tablet width, with the server's
// clock moved past the cure: the planner imports a line and its valve through /imports/new, writes
// an order on it with one coupling, an isolation plan (the register's valve and a drain) and the
// fitter, and plans it; the fitter and a second fitter put their locks on, operations verifies zero
// energy; the fitter records the joint's seven steps (photos of the marks and the finished joint, the
// assembly hold counted down); while the order cures, operations' release check names every reason
// it may not go back (the state, each lock, the holds, no test) and the server refuses a release;
// the clock moves past the cure end and the sweep's lift moves the order to testing; each fitter
// takes their own locks off ((f)(1)); operations records the hydrostatic test, finds the order
// ready on /release and releases it with the five-item checklist; the line is back in service;
// the planner closes the order and downloads its record, a PDF with the joint's QR code.
import { readFileSync } from 'node:fs';
import { Op } from 'sequelize';
import sharp from 'sharp';
import type { Page } from 'playwright-core';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { setClockOffsetForTests } from '@server/clock';
import { IsolationPoint } from '@server/db/models/isolation-point';
import { Hold, JointStepRecord, Photo } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { Line } from '@server/db/models/line';
import { WorkOrder } from '@server/db/models/work-order';
import { liftDueHolds } from '@server/services/holds/lift';
import { APP } from '../helpers/browserless';
import { applyMyLocksInBrowser, verifyZeroEnergyInBrowser } from '../helpers/lock-board-page';
import { useBrowserApp } from '../helpers/browser-app';
import { waitFor } from '../helpers/import-csv';
import { lockNo } from '../helpers/lockout';
import { plantForWorkOrders } from '../helpers/work-orders';

// The fitters sign in once first: a person exists in Linewright (and in the planner's fitter list) from their first sign-in.
const { pageAs, users } = useBrowserApp({ signIn: ['operations', 'fitter', 'fitter2'], before: plantForWorkOrders });
// Line numbers and tags of this run only.
const prefix = `RF${Date.now().toString(36).toUpperCase()}`;
const lineNumber = `${prefix}-001`;
const valveTag = `${prefix}-HV-1`;
const drainTag = `${prefix}-DR-1`;
const madeOrders: string[] = [];

afterEach(() => setClockOffsetForTests(0));
afterAll(async () => {
  setClockOffsetForTests(0);
  await WorkOrder.destroy({ where: { id: madeOrders } }); // its joints, plan, locks, steps, holds, photos and tests go with it
  await IsolationPoint.destroy({ where: { tag: { [Op.like]: `${prefix}-%` } } });
  await Line.destroy({ where: { lineNumber: { [Op.like]: `${prefix}-%` } } });
});

// Every page in one zone, so the times typed into datetime-local fields mean what the test computes.
const ZONE = { timezoneId: 'UTC' } as const;
/** A moment as a `datetime-local` value in UTC ("2027-03-01T06:00"). */
const localUtc = (ms: number) => new Date(ms).toISOString().slice(0, 16);
const stepHeading = (page: Page, label: string, status: string) => page.getByRole('heading', { name: `${label} · ${status}`, exact: true });
const card = (page: Page, title: string | RegExp) => page.locator('section').filter({ has: page.getByRole('heading', { level: 2, name: title, exact: typeof title === 'string' }) });
const stateIs = (page: Page, number: string, label: string) => page.getByRole('heading', { name: number }).getByText(label).waitFor();
const orderState = async (id: string) => (await WorkOrder.findByPk(id, { attributes: ['state'] }))!.state;

async function importCsv(page: Page, name: string, csv: string, write: string, written: string) {
  await page.goto(`${APP}/imports/new`);
  await page.getByRole('heading', { name: 'Import lines' }).waitFor();
  await page.locator('input[type=file]').setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await page.getByRole('heading', { name: 'Import preview' }).waitFor();
  await page.getByRole('button', { name: write }).click();
  await page.getByText(written).waitFor({ timeout: 30_000 });
}

describe('from lockout to release', () => {
  it('imported line → planned order → two fitters lock on → verified → joint recorded → release refused while curing → clock past the cure → locks off → test → released → closed, with the record as a PDF', { timeout: 300_000 }, async () => {
    // ── The planner imports the line, then its valve, through /imports/new ────────────────────
    const planner = await pageAs('planner', '/lines', ZONE);
    await importCsv(
      planner,
      'lines.csv',
      ['line_number,area,service,material,schedule,nominal_size,design_pressure_psi,design_temperature_f,drawing,notes', `${lineNumber},Neutralisation,Caustic soda 25%,PVC,80,2,100,73,P&ID-310,`].join('\n') + '\n',
      'Write 1 new and 0 changed line to the register',
      'Written to the register: 1 new and 0 changed line.',
    );
    await importCsv(
      planner,
      'points.csv',
      ['tag,line_number,kind,normal_position,notes', `${valveTag},${lineNumber},valve,open,Block valve upstream`].join('\n') + '\n',
      'Write 1 new and 0 changed isolation point to the register',
      'Written to the register: 1 new and 0 changed isolation point.',
    );
    const line = await Line.findOne({ where: { lineNumber } });
    expect(line).toMatchObject({ material: 'PVC', schedule: '80', nominalSize: '2', designPressurePsi: 100, status: 'in-service' });
    expect(await IsolationPoint.count({ where: { tag: valveTag, lineId: line!.id } })).toBe(1);

    // ── The planner writes the order in the browser ───────────────────────────────────────────
    await planner.goto(`${APP}/work-orders/new`);
    await planner.getByRole('heading', { name: 'New work order' }).waitFor();
    await planner.getByLabel('Scope: what is cut out, what is made').fill('Cut out the weeping coupling and make a new one.');
    await planner.getByLabel('Requested by').fill('Maud Okafor');
    await planner.getByLabel('Find a line to add').fill(prefix);
    await planner.getByRole('button', { name: `Add ${lineNumber}` }).click();
    await planner.getByRole('list', { name: 'Chosen lines' }).getByRole('button', { name: new RegExp(`^${lineNumber} .*take it off the order$`) }).waitFor();
    await planner.getByLabel('Window start').fill('2027-03-01T06:00');
    await planner.getByLabel('Window end').fill('2027-03-04T06:00');
    await planner.getByText('°C', { exact: true }).click();
    await planner.getByLabel('Lowest temperature (°C)').fill('21');
    await planner.getByLabel('Highest relative humidity (%)').fill('50');
    await planner.getByRole('button', { name: 'Create the order' }).click();
    await planner.waitForURL(/\/work-orders\/[0-9a-f-]{36}$/);
    const orderId = planner.url().split('/').pop()!;
    madeOrders.push(orderId);
    const number = (await WorkOrder.findByPk(orderId))!.number;
    await stateIs(planner, number, 'Draft');

    // One coupling on the line.
    const addJoints = planner.getByRole('form', { name: 'Add joints' });
    await addJoints.getByLabel('Fitting kind').selectOption('coupling');
    await addJoints.getByRole('button', { name: 'Add' }).click();
    await planner.getByRole('heading', { name: 'Joint tasks (1)' }).waitFor();
    const joint = await JointTask.findOne({ where: { workOrderId: orderId } });
    expect(joint).toMatchObject({ fittingKind: 'coupling', nominalSize: '2' });
    const jointId = joint!.id;

    // The isolation plan starts from the register's valve; a drain is added.
    await planner.getByRole('button', { name: 'Make the plan' }).click();
    const valveBox = planner.getByRole('checkbox', { name: new RegExp(valveTag) });
    await valveBox.waitFor();
    expect(await valveBox.isChecked()).toBe(true);
    await planner.getByRole('button', { name: 'Add a drain' }).click();
    await planner.getByLabel('Tag of added point 1').fill(drainTag);
    await planner.getByRole('button', { name: 'Save the isolation plan' }).click();
    await planner.getByRole('heading', { name: 'Isolation plan (2)' }).waitFor();

    // The joint goes to the fitter (Tomas Lind).
    await planner.getByLabel('Fitter for joint J1').selectOption({ label: 'Tomas Lind' });
    await waitFor('the fitter on the joint', () => JointTask.findByPk(jointId), (j) => !!j?.fitterId);
    await planner.getByText('The plan fits the window').waitFor();

    // Submitted: planned.
    await planner.getByRole('button', { name: 'Submit the plan' }).click();
    await planner.getByRole('button', { name: 'Plan the order' }).click();
    await stateIs(planner, number, 'Planned');
    expect(await orderState(orderId)).toBe('planned');

    // ── The fitter's locks, on the order's lock board ─────────────────────────────────────────
    const fitter = await pageAs('fitter', `/work-orders/${orderId}`, ZONE);
    await fitter.getByRole('heading', { name: number }).waitFor();
    await fitter.getByText('Not isolated: nobody works on the section until it is').waitFor();
    const fitterLocks = await applyMyLocksInBrowser(fitter, 2); // the register's valve and the plan's drain

    // ── A second fitter (Noor Haddad) puts a lock of her own on the valve ─────────────────────
    const fitter2 = await pageAs('fitter2', `/work-orders/${orderId}`, ZONE);
    await fitter2.getByRole('heading', { name: number }).waitFor();
    await fitter2.getByRole('button', { name: 'Apply my locks' }).click();
    const apply2 = fitter2.getByRole('form', { name: 'Apply my locks' });
    const fitter2Lock = lockNo('G');
    await apply2.getByLabel(`Your lock number on ${valveTag}`).fill(fitter2Lock);
    await apply2.getByRole('button', { name: 'Record my locks' }).click();
    await apply2.waitFor({ state: 'detached' });
    await fitter2.getByRole('list', { name: `Locks on ${valveTag}` }).getByText(`Noor Haddad (you) · lock ${fitter2Lock}`, { exact: false }).waitFor();

    // ── Operations verifies zero energy ───────────────────────────────────────────────────────
    const ops = await pageAs('operations', `/work-orders/${orderId}`, ZONE);
    await verifyZeroEnergyInBrowser(ops, 3);
    await stateIs(ops, number, 'Isolated');
    expect(await orderState(orderId)).toBe('isolated');
    expect((await Line.findByPk(line!.id))!.status).toBe('locked-out');

    // ── The fitter records the joint's seven steps on /joints/:id ─────────────────────────────
    await fitter.goto(`${APP}/joints/${jointId}`);
    await fitter.getByRole('heading', { name: 'J1', exact: true }).waitFor();
    const picture = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#b45a1e' } }).jpeg().toBuffer();

    await stepHeading(fitter, 'Prepare the ends', 'to record now').waitFor();
    for (const box of ['The cut is square', 'Inside and outside are deburred', 'The end is chamfered', 'The surfaces are clean and dry']) await fitter.getByLabel(box).check();
    await fitter.getByRole('button', { name: 'Record: prepare the ends' }).click();
    await stepHeading(fitter, 'Prepare the ends', 'recorded').waitFor();

    await stepHeading(fitter, 'Dry fit', 'to record now').waitFor();
    await fitter.getByLabel('Measured dry insertion').fill('0.75'); // 2" Sch 80: 0.500–1.000 in dry
    await fitter.getByText('✓ Inside the window.').waitFor();
    await fitter.getByRole('button', { name: 'Record: dry fit' }).click();
    await stepHeading(fitter, 'Dry fit', 'recorded').waitFor();

    await stepHeading(fitter, 'Depth marks', 'to record now').waitFor();
    await fitter.getByLabel('The insertion mark is on the pipe').check();
    await fitter.getByLabel('The check mark is on the pipe').check();
    await fitter.getByLabel('Photo of the marks').setInputFiles({ name: 'marks.jpg', mimeType: 'image/jpeg', buffer: picture });
    await fitter.getByText('1 photo taken').waitFor();
    await fitter.getByRole('button', { name: 'Record: depth marks' }).click();
    await stepHeading(fitter, 'Depth marks', 'recorded').waitFor();

    await stepHeading(fitter, 'Primer', 'to record now').waitFor();
    expect(await fitter.getByLabel('Primer standard').inputValue()).toBe('ASTM F656');
    await fitter.getByLabel('Lot number (on the can)').fill('P-2291');
    await fitter.getByLabel('The primer softened a scrap of the pipe').check();
    await fitter.getByRole('button', { name: 'Record: primer' }).click();
    await stepHeading(fitter, 'Primer', 'recorded').waitFor();

    await stepHeading(fitter, 'Cement', 'to record now').waitFor();
    expect(await fitter.getByLabel('Cement standard').inputValue()).toBe('ASTM D2564');
    await fitter.getByLabel('Lot number (on the can)').fill('C-7710');
    await fitter.getByLabel('Date stamped on the can').fill(new Date(Date.now() - 182 * 86_400_000).toISOString().slice(0, 10));
    await fitter.getByLabel('Ambient temperature').fill('70');
    await fitter.getByLabel('Relative humidity (%)').fill('50');
    await fitter.getByRole('button', { name: 'Record: cement' }).click();
    await stepHeading(fitter, 'Cement', 'recorded').waitFor();

    // The hold counts down (30 s at 70 °F); only then may the assembly be recorded.
    await stepHeading(fitter, 'Assemble and hold', 'to record now').waitFor();
    await fitter.getByLabel('The pipe went in while the cement was wet').check();
    expect(await fitter.getByRole('button', { name: 'Record: once the hold has run out' }).isDisabled()).toBe(true);
    await fitter.getByRole('button', { name: 'Start the hold' }).click();
    await fitter.getByText('Holding…').waitFor();
    const recordAssembly = fitter.getByRole('button', { name: /^Record: assembled, held \d+:\d\d$/ });
    await recordAssembly.waitFor({ timeout: 150_000 });
    await recordAssembly.click();
    await stepHeading(fitter, 'Assemble and hold', 'recorded').waitFor();

    await stepHeading(fitter, 'Wipe the bead', 'to record now').waitFor();
    await fitter.getByLabel('The bead is wiped').check();
    await fitter.getByLabel('Photo of the finished joint').setInputFiles({ name: 'joint.jpg', mimeType: 'image/jpeg', buffer: picture });
    await fitter.getByText('1 photo taken').waitFor();
    await fitter.getByRole('button', { name: 'Record: wipe the bead' }).click();
    await stepHeading(fitter, 'Wipe the bead', 'recorded').waitFor();

    const steps = await JointStepRecord.findAll({ where: { jointTaskId: jointId }, order: [['recordedAt', 'ASC']] });
    expect(steps.map((s) => s.step)).toEqual(['prep', 'dry-fit', 'depth-marks', 'primer', 'cement', 'assembly', 'wipe']);
    expect(await Photo.count({ where: { jointTaskId: jointId } })).toBe(2);

    // ── Curing, with its holds ────────────────────────────────────────────────────────────────
    await fitter.goto(`${APP}/work-orders/${orderId}`);
    await stateIs(fitter, number, 'Curing');
    const holdsCard = card(fitter, /^Holds \(\d+\)$/);
    await holdsCard.getByText('J1 Set').waitFor();
    await holdsCard.getByText('J1 Cure').waitFor();
    expect(await orderState(orderId)).toBe('curing');
    const holds = await Hold.findAll({ where: { jointTaskId: jointId } });
    expect(holds.map((h) => h.kind).sort()).toEqual(['cure', 'set']);
    const cureEnd = holds.find((h) => h.kind === 'cure')!.endsAt!.getTime();
    expect(cureEnd).toBeGreaterThan(Date.now());

    // ── A blocked release: operations' release check names every reason ──────────────────────
    await ops.reload();
    await stateIs(ops, number, 'Curing');
    const releaseCard = card(ops, 'Release');
    await releaseCard.getByText(/^Not yet: \d+ things stand in the way$/).waitFor();
    for (const n of fitterLocks) await releaseCard.getByText(`Lock ${n} (Tomas Lind) is still on`, { exact: false }).waitFor();
    await releaseCard.getByText(`Lock ${fitter2Lock} (Noor Haddad) is still on ${valveTag}.`, { exact: false }).waitFor();
    await releaseCard.getByText("J1's cure hold runs until", { exact: false }).waitFor();
    await releaseCard.getByText('No hydrostatic test is recorded.').waitFor();
    await releaseCard.getByText(`${number} is`, { exact: false }).first().waitFor(); // the state it is at
    expect(await releaseCard.getByRole('form', { name: 'Release checklist' }).count()).toBe(0); // not offered before the test
    // …and the server refuses a release outright, naming the same reasons.
    const refused = await users.operations.post(`/api/work-orders/${orderId}/release`, { areaInspected: true, peopleClear: true, affectedTold: true, ventsDrainsSet: true, slowRefill: true });
    expect(refused.status).toBe(409);
    const refusal = JSON.stringify(refused.body);
    for (const words of [`Lock ${fitterLocks[0]}`, `Lock ${fitter2Lock}`, "J1's cure hold", 'No hydrostatic test is recorded.']) expect(refusal).toContain(words);
    expect(await orderState(orderId)).toBe('curing');

    // ── The clock moves past the cure end; the sweep's lift moves the order to testing ────────
    setClockOffsetForTests(cureEnd - Date.now() + 60_000);
    const { lifted } = await liftDueHolds();
    expect(lifted).toEqual(expect.arrayContaining(holds.map((h) => h.id)));
    expect(await orderState(orderId)).toBe('testing');
    await fitter.reload();
    await stateIs(fitter, number, 'Testing');

    // ── Before pressure, each fitter removes their own locks ((f)(1)) ─────────────────────────
    const removeOwn = async (page: Page, n: string) => {
      await page.getByRole('button', { name: `Remove my lock ${n}`, exact: true }).click();
      const yes = page.getByRole('button', { name: `Yes, remove lock ${n}`, exact: true });
      await yes.click();
      await yes.waitFor({ state: 'detached' }); // the lock's line leaves the board once the server has taken it off
      expect(await page.getByText(`Lock ${n} was not removed`).count()).toBe(0);
    };
    for (const n of fitterLocks) await removeOwn(fitter, n);
    await fitter2.reload();
    await stateIs(fitter2, number, 'Testing');
    await removeOwn(fitter2, fitter2Lock);
    // the tablet sends each removal as a queued write: under load the last may land a moment after its dialog closes
    const locksLeft = async () => ((await users.operations.get(`/api/work-orders/${orderId}/lockout`)).body.points as { locks: unknown[] }[]).flatMap((pt) => pt.locks);
    expect(await waitFor('every lock off the board', locksLeft, (left) => left.length === 0, 15_000)).toEqual([]);

    // ── Operations witnesses and records the hydrostatic test ─────────────────────────────────
    await ops.reload();
    await stateIs(ops, number, 'Testing');
    const testCard = card(ops, 'Hydrostatic test');
    await testCard.getByText('No test is recorded yet.').waitFor();
    await testCard.getByRole('button', { name: 'Record the test' }).click();
    const testForm = ops.getByRole('form', { name: 'Record the hydrostatic test' });
    await testForm.getByLabel('Tools and materials are clear of the section.').check();
    await testForm.getByLabel('People are clear of the section.').check();
    expect(await testForm.getByLabel('Test medium').inputValue()).toBe('water');
    const testPsi = await testForm.getByLabel('Test pressure (psi)').inputValue();
    expect(Number(testPsi)).toBeGreaterThanOrEqual(150); // 1.5 × the 100 psi design, prefilled
    await testForm.getByLabel('Gauge').fill('PI-T3, 0–300 psi, calibrated 2026-09');
    // The server's clock is moved: the test ended a minute before its now and held well over the minimum.
    const serverNow = Date.now() + (cureEnd - Date.now() + 60_000);
    const endedAt = serverNow - 60_000;
    const startedAt = endedAt - 15 * 60_000;
    await testForm.getByLabel('Pressure reached at').fill(localUtc(startedAt));
    await testForm.getByLabel('Reading at the start (psi)').fill(testPsi);
    await testForm.getByLabel('Test ended at').fill(localUtc(endedAt));
    await testForm.getByLabel('Reading at the end (psi)').fill(testPsi);
    await testForm.getByLabel('Passed: held, no leak').check();
    await testForm.getByLabel('Examiner who certifies the record').fill('Maud Okafor, operations');
    expect(await testForm.getByLabel('Piping tested').inputValue()).toBe(lineNumber);
    await testForm.getByRole('button', { name: 'Record the test' }).click();
    // The recorded test on the card; the order, read again, is ready. (The card's own "Recorded as passed" notice
    // never shows: the form unmounts when the order's refetch moves it out of testing, before its onSuccess runs.)
    const recorded = testCard.getByRole('listitem').filter({ hasText: 'Test 1' });
    await recorded.getByText('Passed', { exact: true }).waitFor();
    await recorded.getByText(`${testPsi} psi at the start → ${testPsi} psi at the end`).waitFor();
    await recorded.getByText('15 min', { exact: true }).waitFor();
    await stateIs(ops, number, 'Ready for release');
    expect(await orderState(orderId)).toBe('ready');

    // ── /release: ready; the checklist on the order's page; released ──────────────────────────
    await ops.goto(`${APP}/release`);
    const readyList = ops.locator('section').filter({ has: ops.getByRole('heading', { name: /^Ready to release \(\d+\)$/ }) });
    await readyList.getByRole('link', { name: `Release checklist for ${number}` }).click();
    await ops.waitForURL(`${APP}/work-orders/${orderId}`);
    await stateIs(ops, number, 'Ready for release');
    const readyCard = card(ops, 'Release');
    await readyCard.getByText('Ready to release', { exact: true }).waitFor();
    const checklist = ops.getByRole('form', { name: 'Release checklist' });
    for (const words of [
      'The area is inspected: tools and materials removed, the equipment whole.',
      'Everyone is clear of the section.',
      'The affected people are told the line goes back into service.',
      'Vents and drains are set for service.',
      'The line will be refilled slowly, venting the air, watching the new joints.',
    ]) await checklist.getByLabel(words).check();
    await checklist.getByRole('button', { name: 'Release the line' }).click();
    await readyCard.getByText(/^Released by Maud Okafor/).waitFor();
    expect(await orderState(orderId)).toBe('released');
    expect((await Line.findByPk(line!.id))!.status).toBe('in-service');

    // ── The planner closes the order and downloads its record ─────────────────────────────────
    await planner.goto(`${APP}/work-orders/${orderId}`);
    await stateIs(planner, number, 'Released');
    const record = card(planner, 'The record');
    await record.getByText('Every step, photo and the passed test are on record.').waitFor();
    await record.getByRole('button', { name: 'Close the order' }).click();
    await stateIs(planner, number, 'Closed');
    await record.getByText('The order is closed: its record is complete and does not change.').waitFor();
    expect(await orderState(orderId)).toBe('closed');

    const [download] = await Promise.all([planner.waitForEvent('download'), record.getByRole('button', { name: 'Download the record (PDF)' }).click()]);
    const pdf = readFileSync((await download.path())!);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.toString('latin1')).toMatch(/\/Subtype\s*\/Image/); // the joint's QR code (and its photos)
  });
});
