import { randomUUID } from 'node:crypto';
import { afterEach, describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Person } from '@server/db/models/person';
import { useTestApp } from '../helpers/app';
import { signedIn, type Browserless } from '../helpers/browserless';

useTestApp();

// The demo accounts are shared with other test files: each test starts them with only their
// directory roles, and puts back whatever it granted or withdrew.
const touched = new Set<string>();
const directoryRolesOnly = (ids: string[]) => Person.update({ rolesGranted: [], rolesWithdrawn: [] }, { where: { id: ids } });
afterEach(async () => {
  await directoryRolesOnly([...touched]);
  touched.clear();
});

async function signedInAs(username: string): Promise<{ b: Browserless; id: string }> {
  const b = await signedIn(username);
  const id: string = (await b.get('/api/me')).body.id;
  await directoryRolesOnly([id]);
  touched.add(id);
  return { b, id };
}

describe('people and roles', () => {
  it('an admin lists everyone who has signed in, with where each role comes from', async () => {
    const planner = await signedInAs('planner');
    const admin = await signedInAs('admin');
    const res = await admin.b.get('/api/people');
    expect(res.status).toBe(200);
    const ines = res.body.find((p: { id: string }) => p.id === planner.id);
    expect(ines).toMatchObject({
      name: 'Ines Varga',
      email: 'ines.varga@marrowby.invalid',
      roles: ['planner'],
      rolesFromIdentityProvider: ['planner'],
      rolesGranted: [],
      rolesWithdrawn: [],
    });
    expect(new Date(ines.lastSignInAt).getTime()).toBeGreaterThan(Date.now() - 60_000);
  });

  it('an admin grants the pipefitter role to a planner: stored as a grant, in force on their next request, audited', async () => {
    const planner = await signedInAs('planner');
    const admin = await signedInAs('admin');
    const res = await admin.b.put(`/api/people/${planner.id}/roles`, { roles: ['planner', 'fitter'] });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ roles: ['planner', 'fitter'], rolesFromIdentityProvider: ['planner'], rolesGranted: ['fitter'], rolesWithdrawn: [] });
    const row = await Person.findByPk(planner.id);
    expect(row).toMatchObject({ rolesFromIdp: ['planner'], rolesGranted: ['fitter'], rolesWithdrawn: [] });
    expect((await planner.b.get('/api/me')).body.roles).toEqual(['planner', 'fitter']);
    const audit = await AuditEntry.findOne({ where: { action: 'roles-set', entityId: planner.id }, order: [['id', 'DESC']] });
    expect(audit).toMatchObject({ actorId: admin.id, entity: 'person', before: ['planner'], after: ['planner', 'fitter'] });
  });

  it('withdrawing a directory role is stored as a withdrawal, ends at once and outlasts the next sign-in', async () => {
    const fitter = await signedInAs('fitter2');
    const admin = await signedInAs('admin');
    const res = await admin.b.put(`/api/people/${fitter.id}/roles`, { roles: [] });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ roles: [], rolesFromIdentityProvider: ['fitter'], rolesGranted: [], rolesWithdrawn: ['fitter'] });
    expect(await Person.findByPk(fitter.id)).toMatchObject({ rolesFromIdp: ['fitter'], rolesWithdrawn: ['fitter'] });
    expect((await fitter.b.get('/api/me')).body.roles).toEqual([]); // same session, no new sign-in
    const again = await signedIn('fitter2');
    expect((await again.get('/api/me')).body.roles).toEqual([]);
  });

  it('an admin cannot withdraw their own admin role, and nothing changes', async () => {
    const admin = await signedInAs('admin');
    const audits = await AuditEntry.count({ where: { action: 'roles-set', entityId: admin.id } });
    const res = await admin.b.put(`/api/people/${admin.id}/roles`, { roles: ['planner'] });
    expect(res.status).toBe(409);
    expect(res.body).toEqual({ error: { code: 'conflict', message: 'You cannot withdraw your own admin role; ask another admin.' } });
    expect(await Person.findByPk(admin.id)).toMatchObject({ rolesGranted: [], rolesWithdrawn: [] });
    expect(await AuditEntry.count({ where: { action: 'roles-set', entityId: admin.id } })).toBe(audits);
  });

  it('a role that does not exist is refused with details on the field', async () => {
    const planner = await signedInAs('planner');
    const admin = await signedInAs('admin');
    const res = await admin.b.put(`/api/people/${planner.id}/roles`, { roles: ['planner', 'foreman'] });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_request');
    expect(res.body.error.details).toHaveProperty(['roles.1']);
    expect(await Person.findByPk(planner.id)).toMatchObject({ rolesGranted: [] });
  });

  it('a person id that is not one is refused, and an unknown person is not found', async () => {
    const admin = await signedInAs('admin');
    const bad = await admin.b.put('/api/people/42/roles', { roles: [] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details).toEqual({ id: ['not a person id'] });
    const unknown = await admin.b.put(`/api/people/${randomUUID()}/roles`, { roles: ['planner'] });
    expect(unknown.status).toBe(404);
    expect(unknown.body).toEqual({ error: { code: 'not_found', message: 'No such person.' } });
  });

  it('someone who is not an admin may neither list people nor change roles', async () => {
    const supervisor = await signedInAs('supervisor');
    const list = await supervisor.b.get('/api/people');
    expect(list.status).toBe(403);
    expect(list.body.error.message).toMatch(/^Only an administrator may do this/);
    const change = await supervisor.b.put(`/api/people/${supervisor.id}/roles`, { roles: ['supervisor', 'admin'] });
    expect(change.status).toBe(403);
    expect(await Person.findByPk(supervisor.id)).toMatchObject({ rolesGranted: [] });
    expect((await supervisor.b.get('/api/me')).body.roles).toEqual(['supervisor']);
  });
});

describe('the fitters a planner may give joints to', () => {
  it('lists exactly the people who hold the fitter role now, by name, for a planner; an admin who only manages people may not', async () => {
    const fitter = await signedIn('fitter');
    await signedIn('fitter2');
    const planner = await signedIn('planner');
    const list = await planner.get('/api/fitters');
    expect(list.status).toBe(200);
    const names = (list.body as { name: string }[]).map((f) => f.name);
    expect(names).toEqual(expect.arrayContaining(['Tomas Lind', 'Noor Haddad']));
    expect(names).not.toContain('Ines Varga');
    expect(names).toEqual([...names].sort((a, b) => a.localeCompare(b)));

    // A fitter whose role is withdrawn drops off the list at once.
    const me = (await fitter.get('/api/me')).body;
    touched.add(me.id);
    await Person.update({ rolesWithdrawn: ['fitter'] }, { where: { id: me.id } });
    expect(((await planner.get('/api/fitters')).body as { name: string }[]).map((f) => f.name)).not.toContain('Tomas Lind');
    expect((await (await signedIn('admin')).get('/api/fitters')).status).toBe(403);
  });
});
