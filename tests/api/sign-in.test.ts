import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { sequelize } from '@server/db/sequelize';
import { Person } from '@server/db/models/person';
import { SESSION_EXTEND_AFTER_MS, SESSION_IDLE_MS } from '@server/middleware/session';
import { sessionReadCounts } from '@server/db/session-store';
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

describe('a signed-in session costs one read a request, and a write only every few minutes', () => {
  const sidOf = (b: Browserless) => decodeURIComponent(b.cookie('lw.sid')!).replace(/^s:/, '').split('.')[0]!;
  const expiryOf = async (sid: string) => {
    const [row] = await sequelize.query<{ expire: Date }>('select expire from user_sessions where sid = $1', { bind: [sid], type: QueryTypes.SELECT });
    return row ? new Date(row.expire).getTime() : null;
  };
  /** Moves the session's stored expiry back by `ms`, as if it had last been extended that long ago. */
  const ageSession = (sid: string, ms: number) =>
    sequelize.query(
      `update user_sessions set expire = expire - $2 * interval '1 millisecond',
              sess = jsonb_set(sess::jsonb, '{cookie,expires}', to_jsonb(to_char((expire - $2 * interval '1 millisecond') at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')))::json
        where sid = $1`,
      { bind: [sid, ms] },
    );

  it('requests within a few minutes of sign-in neither write the session nor send its cookie again', async () => {
    const b = await signedIn('planner');
    const sid = sidOf(b);
    const expiry = await expiryOf(sid);
    for (let i = 0; i < 3; i++) {
      const res = await b.raw('/api/me');
      expect(res.status).toBe(200);
      expect(res.headers.getSetCookie().filter((c) => c.startsWith('lw.sid='))).toEqual([]);
    }
    expect(await expiryOf(sid)).toBe(expiry);
  });

  it('once its expiry was set more than five minutes ago, the next request extends it to twelve hours and re-sends the cookie', async () => {
    const b = await signedIn('planner');
    const sid = sidOf(b);
    await ageSession(sid, SESSION_EXTEND_AFTER_MS + 60_000);
    const res = await b.raw('/api/me');
    expect(res.status).toBe(200);
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('lw.sid='));
    expect(cookie).toMatch(/Expires=/);
    const left = (await expiryOf(sid))! - Date.now();
    expect(left).toBeGreaterThan(SESSION_IDLE_MS - 60_000);
    expect(left).toBeLessThanOrEqual(SESSION_IDLE_MS + 5_000);
    expect((await b.raw('/api/me')).headers.getSetCookie()).toEqual([]); // extended: quiet again
  });

  it('requests arriving together share session reads, and each still sees a role change made before it was sent', async () => {
    const [planner, fitter, admin, supervisor] = await Promise.all([signedIn('planner'), signedIn('fitter'), signedIn('admin'), signedIn('supervisor')]);
    const before = sessionReadCounts();
    const answers = await Promise.all(Array.from({ length: 30 }, (_, i) => [planner, fitter][i % 2]!.get('/api/me')));
    expect(answers.map((r) => r.status)).toEqual(Array(30).fill(200));
    expect(answers.filter((r) => r.body.roles.includes('fitter'))).toHaveLength(15);
    const after = sessionReadCounts();
    expect(after.sessions - before.sessions).toBe(30);
    expect(after.reads - before.reads).toBeLessThan(30); // batched: fewer reads than requests
    expect(after.reads - before.reads).toBeGreaterThan(0);

    const id = (await supervisor.get('/api/me')).body.id;
    const asked = () => Promise.all(Array.from({ length: 10 }, () => supervisor.get('/api/me'))).then((rs) => rs.map((r) => r.body.roles));
    expect((await admin.put(`/api/people/${id}/roles`, { roles: ['supervisor', 'planner'] })).status).toBe(200);
    expect(await asked()).toEqual(Array(10).fill(['planner', 'supervisor']));
    expect((await admin.put(`/api/people/${id}/roles`, { roles: ['supervisor'] })).status).toBe(200);
    expect(await asked()).toEqual(Array(10).fill(['supervisor']));
  });

  it('a session idle for twelve hours has ended: 401, and the person must sign in again', async () => {
    const b = await signedIn('planner');
    await ageSession(sidOf(b), SESSION_IDLE_MS + 1_000);
    const res = await b.get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'unauthenticated', message: 'Sign in to continue.' } });
  });
});
