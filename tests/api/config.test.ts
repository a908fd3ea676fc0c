import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '..', '..');
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');

/** Loads server/config.ts in a fresh process with exactly the given environment. */
function loadConfig(env: Record<string, string>) {
  return spawnSync(tsx, ['-e', "import('./server/config.ts').then(({ config }) => console.log(JSON.stringify({ issuer: config.oidc.issuer, roleMap: config.oidc.roleMap })))"], {
    cwd: root,
    env: { PATH: process.env.PATH!, HOME: process.env.HOME ?? '/tmp', ...env },
    encoding: 'utf8',
  });
}

const base = { DATABASE_URL: 'postgres://x@127.0.0.1:1/x', REDIS_URL: 'redis://127.0.0.1:1' };

describe('configuration at start-up', () => {
  it('in production the server refuses to start without an identity provider, a session secret and its address', () => {
    const r = loadConfig({ ...base, NODE_ENV: 'production' });
    expect(r.status).not.toBe(0);
    expect(r.stderr).toContain('OIDC_ISSUER: production needs a configured identity provider issuer');
    expect(r.stderr).toContain('SESSION_SECRET');
    expect(r.stderr).toContain('APP_ORIGIN');
  });

  it('in production with a configured issuer it starts and uses that issuer, not the local fake', () => {
    const r = loadConfig({ ...base, NODE_ENV: 'production', OIDC_ISSUER: 'https://id.plant.invalid', SESSION_SECRET: 'a'.repeat(32), APP_ORIGIN: 'https://lw.plant.invalid' });
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).issuer).toBe('https://id.plant.invalid');
  });

  it('without a database address nothing starts, and the message names the variable', () => {
    const r = loadConfig({ REDIS_URL: base.REDIS_URL });
    expect(r.status).not.toBe(0);
    expect(r.stderr).toContain('DATABASE_URL');
  });

  it('maps the provider’s group names to roles, and refuses a mapping to a role that does not exist', () => {
    const ok = loadConfig({ ...base, OIDC_ROLE_MAP: 'plant-planning=planner, ops=operations' });
    expect(JSON.parse(ok.stdout).roleMap).toMatchObject({ 'plant-planning': 'planner', ops: 'operations', admin: 'admin' });
    const bad = loadConfig({ ...base, OIDC_ROLE_MAP: 'plant-planning=boss' });
    expect(bad.status).not.toBe(0);
    expect(bad.stderr).toContain('OIDC_ROLE_MAP entry "plant-planning=boss"');
  });
});
