import { describe, expect, it } from 'vitest';
import { Person } from '@server/db/models/person';
import { AuditEntry } from '@server/db/models/audit-entry';
import { useTestApp } from '../helpers/app';
import { Browserless, signedIn } from '../helpers/browserless';

useTestApp();

describe('signing in through the identity provider', () => {
  it('sends the browser to the provider with PKCE S256, state and nonce', async () => {
    const b = new Browserless();
    const res = await b.raw('/auth/login');
    expect(res.status).toBe(302);
    const url = new URL(res.headers.get('location')!);
    expect(url.searchParams.get('code_challenge_method')).toBe('S256');
    expect(url.searchParams.get('code_challenge')).toMatch(/^[\w-]{43}$/);
    expect(url.searchParams.get('state')).toBeTruthy();
    expect(url.searchParams.get('nonce')).toBeTruthy();
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('lw.sid='))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('a planner who signs in gets a new session, their person row and the planner role', async () => {
    const b = new Browserless();
    await b.raw('/auth/login');
    const before = b.cookie('lw.sid');
    await b.signIn('planner');
    expect(b.cookie('lw.sid')).toBeTruthy();
    expect(b.cookie('lw.sid')).not.toBe(before); // regenerated at sign-in
    const me = await b.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ name: 'Ines Varga', roles: ['planner'] });
    const row = await Person.findByPk(me.body.id);
    expect(row?.rolesFromIdp).toEqual(['planner']);
    expect(await AuditEntry.count({ where: { action: 'sign-in', entityId: me.body.id } })).toBeGreaterThan(0);
  });

  it('a wrong password stays on the provider page with a message, and no session is made', async () => {
    const b = new Browserless();
    const res = await b.signIn('planner', 'not-the-password');
    expect(res.status).toBe(401);
    expect(await res.text()).toContain('do not match');
    expect((await b.get('/api/me')).status).toBe(401);
  });

  it('a callback with a forged state is refused', async () => {
    const b = new Browserless();
    await b.raw('/auth/login');
    const res = await b.get('/auth/callback?code=abc&state=forged');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/could not be completed/);
  });

  it('signing out ends the session', async () => {
    const b = await signedIn('fitter');
    expect((await b.get('/api/me')).status).toBe(200);
    const out = await b.post('/auth/logout');
    expect(out.status).toBe(200);
    expect((await b.get('/api/me')).status).toBe(401);
  });

  it('without a session the API answers 401 in the one error shape', async () => {
    const res = await new Browserless().get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'unauthenticated', message: 'Sign in to continue.' } });
  });

  it('a state-changing request from another origin is refused', async () => {
    const b = await signedIn('admin');
    const me = await b.get('/api/me');
    const res = await b.json('PUT', `/api/people/${me.body.id}/roles`, { roles: ['admin'] }, { origin: 'http://evil.invalid' });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/may not change/);
  });
});
