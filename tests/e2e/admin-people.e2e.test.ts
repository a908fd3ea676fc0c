import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Person } from '@server/db/models/person';
import { APP, signedIn } from '../helpers/browserless';
import { DEMO_ACCOUNTS } from '../../scripts/demo-accounts';
import { useBrowserApp } from '../helpers/browser-app';

let supervisorId: string;

// The demo accounts are shared with other test files: start and end with their directory roles only.
const SHOWN = DEMO_ACCOUNTS.filter((a) => ['admin', 'planner', 'supervisor'].includes(a.username)).map((a) => a.email);
const directoryRolesOnly = () => Person.update({ rolesGranted: [], rolesWithdrawn: [] }, { where: { email: SHOWN } });

const { pageAs } = useBrowserApp();
beforeAll(async () => {
  // The person the admin will grant a role to must have signed in once to be listed.
  supervisorId = (await (await signedIn('supervisor')).get('/api/me')).body.id;
  await directoryRolesOnly();
});
afterAll(directoryRolesOnly);

describe('People & roles in the browser', () => {
  it('an admin grants the pipefitter role to the supervisor and sees it saved', async () => {
    const page = await pageAs('admin', '/admin/people');
    await page.getByRole('heading', { name: 'People & roles' }).waitFor();
    const row = page.locator('tbody tr').filter({ hasText: 'Rafe Adeyemi' });
    const fitter = row.getByRole('checkbox', { name: 'Pipefitter: Rafe Adeyemi' });
    expect(await fitter.isChecked()).toBe(false);

    await fitter.check();
    await row.getByText('granted here').waitFor();
    await row.getByRole('button', { name: 'Save' }).click();
    await row.getByRole('status').filter({ hasText: 'Saved' }).waitFor();

    expect(await Person.findByPk(supervisorId)).toMatchObject({ rolesGranted: ['fitter'], rolesWithdrawn: [] });
    await page.reload();
    await page.getByRole('checkbox', { name: 'Pipefitter: Rafe Adeyemi' }).waitFor();
    expect(await page.getByRole('checkbox', { name: 'Pipefitter: Rafe Adeyemi' }).isChecked()).toBe(true);
  });

  it('an admin who unticks their own admin role is told in place why it cannot be saved', async () => {
    const page = await pageAs('admin', '/admin/people');
    const row = page.locator('tbody tr').filter({ hasText: 'Kit Morrow' });
    await row.getByRole('checkbox', { name: 'Administrator: Kit Morrow' }).uncheck();
    await row.getByText('withdrawn here').waitFor();
    await row.getByRole('button', { name: 'Save' }).click();
    await page.getByRole('alert').filter({ hasText: 'You cannot withdraw your own admin role' }).waitFor();
    await page.getByRole('button', { name: 'Undo' }).click();
    expect(await page.getByRole('checkbox', { name: 'Administrator: Kit Morrow' }).isChecked()).toBe(true);
  });

  it('a planner does not see People & roles in the menu, and opening it directly says who may', async () => {
    const page = await pageAs('planner', '/lines');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Line register' }).waitFor();
    expect(await nav.getByRole('link', { name: 'People & roles' }).count()).toBe(0);

    await page.goto(`${APP}/admin/people`);
    await page.getByRole('alert').filter({ hasText: 'Only an administrator may do this' }).waitFor();
    expect(await page.getByRole('table').count()).toBe(0);
  });
});
