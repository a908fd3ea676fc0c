import { afterEach, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { PlantSetting } from '@server/db/models/plant-setting';
import { APP } from '../helpers/browserless';
import { signInInBrowser, VIEWPORTS } from '../helpers/chromium';
import { useBrowserApp } from '../helpers/browser-app';

let page: Page;
const plantDefaults = () => PlantSetting.update({ cureScheduleId: 'A', testCap: 'rating', updatedById: null }, { where: { id: 1 } });

const { newPage } = useBrowserApp({ before: plantDefaults });
afterEach(plantDefaults);

const verdict = () => page.getByRole('region', { name: /published tables|not allowed/i });

describe('a fitter on a tablet works out one joint', () => {
  it('types a 6" joint for a cool night, sees its cure time checked by the server, then sees an air test refused', async () => {
    page = await newPage();
    await signInInBrowser(page, APP, 'fitter', '/calculator');
    await page.goto(`${APP}/calculator`);
    await page.getByLabel('Nominal size').selectOption('6');
    await page.getByLabel('Design pressure').fill('80');
    await page.getByLabel('Coldest during cure').fill('45');

    // 6" at 40–60 °F, test 120 psi (≤160 column): set 2 h, cure 4 h in schedule A
    await expect.poll(() => verdict().textContent()).toMatch(/Set2 h.*Cure4 h/);
    await expect.poll(() => page.getByText('✓ Checked by the server').isVisible()).toBe(true);

    await page.getByLabel('Air', { exact: true }).check();
    await expect.poll(() => verdict().textContent()).toMatch(/Not allowed as entered.*Testing with air is refused/);
    await expect.poll(() => page.getByText('No one can approve a test with air or gas').first().isVisible()).toBe(true);
  });

  it('switching to metric keeps the same joint: the values are converted, not re-read', async () => {
    page = await newPage();
    await signInInBrowser(page, APP, 'fitter', '/calculator');
    await page.goto(`${APP}/calculator`);
    await page.getByLabel('bar', { exact: true }).check();
    await page.getByLabel('°C', { exact: true }).check();
    expect(await page.getByLabel('Design pressure').inputValue()).toBe('6.895');
    expect(await page.getByLabel('Coldest during cure').inputValue()).toBe('21.11');
    await expect.poll(() => verdict().textContent()).toMatch(/Within the published tables.*Cure30 min/);
  });

  it('when the plant changes its schedule while the page is open, the page follows the server', async () => {
    page = await newPage({ viewport: VIEWPORTS.desktop });
    await signInInBrowser(page, APP, 'planner', '/calculator');
    await page.goto(`${APP}/calculator`);
    await expect.poll(() => page.getByText('Plant cure schedule: A').isVisible()).toBe(true);
    await PlantSetting.update({ cureScheduleId: 'B' }, { where: { id: 1 } });
    await page.getByLabel('Relative humidity').fill('45');
    await expect.poll(() => page.getByText('Plant cure schedule: B').isVisible(), { timeout: 10_000 }).toBe(true);
    await expect.poll(() => verdict().textContent()).toMatch(/Cure2 hschedule B/);
    await expect.poll(() => page.getByText('✓ Checked by the server').isVisible()).toBe(true);
  });
});
