import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Op } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { Line } from '@server/db/models/line';
import { APP } from '../helpers/browserless';
import { useBrowserApp } from '../helpers/browser-app';
import { LINE_HEADER } from '../helpers/import-csv';
import { makeLines } from '../helpers/line-rows';

const tmp = mkdtempSync(path.join(os.tmpdir(), 'linewright-register-e2e-'));
// Line numbers of this run only, so the test neither meets nor leaves rows of another.
const prefix = `E2E${Date.now().toString(36).toUpperCase()}`;
const ours = { lineNumber: { [Op.like]: `${prefix}-%` } };

const { pageAs } = useBrowserApp();
afterAll(async () => {
  await Line.destroy({ where: ours });
  rmSync(tmp, { recursive: true, force: true });
});

function writeCsv(): string {
  const file = path.join(tmp, 'new-lines.csv');
  writeFileSync(
    file,
    [
      'line_number,area,service,material,schedule,nominal_size,design_pressure_psi,design_temperature_f,drawing,notes',
      `${prefix}-001,Neutralisation,Sodium bisulfite 38%,PVC,80,2,150,73,P&ID-310,`,
      `${prefix}-002,Neutralisation,Sulfuric acid 93%,CPVC,80,1,150,100,P&ID-310,Feed to the pit`,
      `${prefix}-003,Neutralisation,Process water,PVC,SDR 21,3,100,73,,`,
      `${prefix}-004,Neutralisation,Caustic soda 25%,PP,80,4,100,73,,`,
    ].join('\n') + '\n',
  );
  return file;
}

describe('importing lines in the browser', () => {
  it('a planner uploads a CSV, sees the rejected row and why, confirms, and finds the new lines in the register', async () => {
    const page = await pageAs('planner', '/lines');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Import lines' }).click();
    await page.getByRole('heading', { name: 'Import lines' }).waitFor();

    await page.locator('input[type=file]').setInputFiles(writeCsv());
    await page.getByRole('heading', { name: 'Import preview' }).waitFor();
    const rejected = page.locator('tbody tr').filter({ hasText: `${prefix}-004` });
    await rejected.getByText('Rejected').waitFor();
    expect(await rejected.textContent()).toMatch(/material.*"PP" is not a material/);
    await page.getByRole('button', { name: 'New 3' }).waitFor();
    await page.getByRole('button', { name: 'Rejected 1' }).waitFor();
    expect(await Line.count({ where: ours })).toBe(0); // nothing is written before the confirm

    await page.getByRole('button', { name: 'Write 3 new and 0 changed lines to the register' }).click();
    await page.getByText('Written to the register: 3 new and 0 changed lines.').waitFor();
    await page.getByRole('link', { name: 'Open the line register' }).click();

    await page.getByLabel('Find a line number').fill(prefix);
    await page.waitForURL((url) => url.searchParams.get('search') === prefix);
    // The unfiltered page stays on screen (dimmed) until the search answers: wait for the answer.
    await page.getByText('3 lines match', { exact: true }).waitFor();
    await page.getByRole('row', { name: `Line ${prefix}-003` }).waitFor();
    const shown = await page.locator('tbody tr').allTextContents();
    expect(shown).toHaveLength(3);
    expect(shown.join(' ')).not.toContain(`${prefix}-004`);

    const rows = await Line.findAll({ where: ours, order: [['lineNumber', 'ASC']] });
    expect(rows.map((r) => r.lineNumber)).toEqual([`${prefix}-001`, `${prefix}-002`, `${prefix}-003`]);
    expect(rows[2]).toMatchObject({ material: 'PVC', sdr: 21, schedule: null, nominalSize: '3', designPressurePsi: 100 });
  });

  it('a pipefitter is not offered the import, and opening it directly says who may import', async () => {
    const page = await pageAs('fitter', '/lines');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Line register' }).waitFor();
    expect(await nav.getByRole('link', { name: 'Import lines' }).count()).toBe(0);

    await page.goto(`${APP}/imports/new`);
    await page.getByRole('alert').filter({ hasText: 'Importing is for planners and administrators' }).waitFor();
    expect(await page.locator('input[type=file]').count()).toBe(0);
  });
});

describe('exporting the register in the browser', () => {
  it('Export CSV downloads the filtered register as a file named for the day', async () => {
    await makeLines(`${prefix}-X`, [{}, {}]);
    const page = await pageAs('fitter', `/lines?search=${prefix}-X`);
    await page.getByText('2 lines match', { exact: true }).waitFor();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^line-register-\d{4}-\d{2}-\d{2}\.csv$/);
    const text = readFileSync((await download.path())!, 'utf8');
    expect(text.split('\r\n')[0]).toBe(LINE_HEADER.join(','));
    expect(text.match(new RegExp(`^${prefix}-X-`, 'gm'))).toHaveLength(2);
  });

  it('when the export fails, the page says why and no file arrives', async () => {
    const page = await pageAs('fitter', '/lines');
    await page.route('**/api/lines/export.csv*', (route) =>
      route.fulfill({ status: 503, contentType: 'application/json', body: JSON.stringify({ error: { code: 'unavailable', message: 'The register is being rebuilt.' } }) }),
    );
    let downloads = 0;
    page.on('download', () => downloads++);
    await page.getByRole('button', { name: 'Export CSV' }).click();
    await page.getByRole('alert').filter({ hasText: 'The export could not be made' }).filter({ hasText: 'The register is being rebuilt.' }).waitFor();
    expect(downloads).toBe(0);
  });
});
