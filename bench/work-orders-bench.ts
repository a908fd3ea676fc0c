// `npm run bench:work-orders`: fills a throw-away database with 10,000 work orders and 100,000
// joint tasks through the services, then measures with autocannon (50 connections, 10 s each)
// GET /api/work-orders (a filtered, sorted page), GET /api/work-orders/:id (an order with 20
// joints) and a bare Express 5 route answering the same JSON from memory. Starts its own
// PostgreSQL (127.0.0.1:6441) and Redis (6442); the app listens on 6443, the bare route on 6444.
// The session is a row written straight into user_sessions with a cookie signed like
// express-session's, so no sign-in provider is needed; every target gets the same cookie.

import { spawn, execFileSync } from 'node:child_process';
import { createHmac, randomUUID } from 'node:crypto';
import { chmodSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import { ensureDebianPackages } from '../scripts/lib/debian';
import { pgBin, startPostgres } from '../scripts/lib/postgres';
import { BIN, ROOT } from '../scripts/lib/processes';
import { startRedis } from '../scripts/lib/redis';
import type { LoadResult, LoadSpec } from './work-orders-load';

const ORDERS = Number(process.env.BENCH_ORDERS ?? 10_000);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 50;
const FILL_CONCURRENCY = 8;
const [PG_PORT, REDIS_PORT, APP_PORT, BARE_PORT] = [6441, 6442, 6443, 6444];
const SECRET = 'work-order-bench-session-secret';
const log = (msg: string) => console.log(`[bench] ${msg}`);

/** express-session's cookie: "s:" + the id + "." + its HMAC-SHA256 in base64 without padding (cookie-signature). */
const signedCookie = (sid: string) => `lw.sid=${encodeURIComponent(`s:${sid}.${createHmac('sha256', SECRET).update(sid).digest('base64').replace(/=+$/, '')}`)}`;

const listen = (app: express.Express | ReturnType<typeof express>, port: number) =>
  new Promise<Server>((ok, fail) => { const s = createServer(app).once('error', fail).listen(port, '127.0.0.1', () => ok(s)); });
const close = (s: Server) => new Promise<void>((ok) => (s.closeAllConnections(), s.close(() => ok())));

/** CPU milliseconds used so far by the PostgreSQL backends (children of the postmaster): /proc utime + stime, 100 ticks a second. */
function pgCpuMs(pgDir: string): number {
  const postmaster = readFileSync(path.join(pgDir, 'postmaster.pid'), 'utf8').split('\n')[0]!.trim();
  let ticks = 0;
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      const f = stat.slice(stat.lastIndexOf(')') + 2).split(' '); // fields from the state on: ppid is [1], utime [11], stime [12]
      if (f[1] === postmaster) ticks += Number(f[11]) + Number(f[12]);
    } catch {
      /* the process ended meanwhile */
    }
  }
  return ticks * 10;
}

/** autocannon in a child process (its own event loop and core), one JSON line back. */
function loadIn(spec: LoadSpec): Promise<LoadResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(BIN('tsx'), ['bench/work-orders-load.ts'], { cwd: ROOT, env: { ...process.env, BENCH_LOAD: JSON.stringify(spec) }, stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.once('exit', (code) => (code === 0 ? resolve(JSON.parse(out.trim().split('\n').pop()!)) : reject(new Error(`load run failed (exit ${code})`))));
  });
}

async function main() {
  ensureDebianPackages(['postgresql', 'redis-server']);
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'linewright-wo-bench-'));
  chmodSync(tmp, 0o755);
  const pg = startPostgres({ dir: path.join(tmp, 'pg'), port: PG_PORT, database: 'linewright_wo_bench' });
  const redis = await startRedis({ port: REDIS_PORT });
  try {
    // config reads the environment when first imported: set it before any server module loads. Production, as a plant runs it.
    Object.assign(process.env, {
      NODE_ENV: 'production', LOG_LEVEL: 'warn', DATABASE_URL: pg.url, REDIS_URL: redis.url, SESSION_SECRET: SECRET, PORT: String(APP_PORT),
      APP_ORIGIN: `http://127.0.0.1:${APP_PORT}`, OIDC_ISSUER: 'http://127.0.0.1:6445', CLIENT_DIST: path.join(tmp, 'no-client'),
    });
    await run(pg.url, path.join(tmp, 'pg'));
  } finally {
    await redis.stop();
    pg.stop();
    rmSync(tmp, { recursive: true, force: true });
  }
}

async function run(url: string, pgDir: string) {
  const psql = (sql: string) => execFileSync(path.join(pgBin(), 'psql'), [url, '-v', 'ON_ERROR_STOP=1', '-qtAc', sql]).toString().trim();
  const { migrate } = await import('../server/db/migrate');
  const { sequelize } = await import('../server/db/sequelize');
  const { closeQueues } = await import('../server/queues/connection');
  const { createApp } = await import('../server/app');
  const fill = await import('./work-orders-fill');
  await migrate();

  // Commits need not wait for the disk while filling (a throw-away database); the measurement runs with the default back.
  psql('alter system set synchronous_commit = off');
  psql('select pg_reload_conf()');
  const me = await fill.benchPlanner();
  const lines = await fill.importDemoLines(me);
  log(`${lines.length} demo lines imported; making ${ORDERS.toLocaleString('en-US')} orders, ${FILL_CONCURRENCY} at a time, through the services…`);
  const started = performance.now();
  const ids = await fill.fillOrders(me, lines, ORDERS, FILL_CONCURRENCY, log);
  const fillSeconds = (performance.now() - started) / 1000;
  psql('alter system reset synchronous_commit');
  psql('select pg_reload_conf()');
  psql('vacuum analyze');
  const counts = psql("select (select count(*) from work_orders) || ' orders, ' || (select count(*) from joint_tasks) || ' joint tasks'");
  log(`filled in ${fillSeconds.toFixed(0)} s: ${counts}; time in the services (summed over parallel calls): ${Object.entries(fill.spent).map(([k, ms]) => `${k} ${(ms / 1000).toFixed(0)} s`).join(', ')}`);

  const sid = randomUUID();
  const expires = new Date(Date.now() + 12 * 3_600_000);
  const sess = { cookie: { originalMaxAge: 12 * 3_600_000, expires: expires.toISOString(), secure: false, httpOnly: true, path: '/', sameSite: 'lax' }, personId: me.id };
  psql(`insert into user_sessions (sid, sess, expire) values ('${sid}', '${JSON.stringify(sess)}', '${expires.toISOString()}')`);
  const cookie = signedCookie(sid);

  const app = await listen(createApp(), APP_PORT);
  const middle = Math.floor(ORDERS / 2 / 20) * 20; // index ≡ 0 (mod 4 and 10): 20 joints, not cancelled
  const routes = {
    list: '/api/work-orders?state=draft&area=300%20Water%20treatment&sort=windowStart&dir=asc&page=3&pageSize=50',
    detail: `/api/work-orders/${ids[middle]}`,
  };
  const bodies: Record<string, unknown> = {};
  for (const [name, route] of Object.entries(routes)) {
    const res = await fetch(`http://127.0.0.1:${APP_PORT}${route}`, { headers: { cookie } });
    if (res.status !== 200) throw new Error(`${route} answered ${res.status}: ${await res.text()}`);
    bodies[name] = await res.json();
  }
  const detail = bodies.detail as { jointTasks: unknown[] };
  const list = bodies.list as { total: number; rows: unknown[] };
  log(`list: ${list.rows.length} rows of ${list.total} (${JSON.stringify(bodies.list).length} bytes); detail: ${detail.jointTasks.length} joints (${JSON.stringify(detail).length} bytes)`);

  const bare = express();
  bare.get('/api/work-orders', (_req, res) => { res.json(bodies.list); });
  bare.get('/api/work-orders/:id', (_req, res) => { res.json(bodies.detail); });
  const bareServer = await listen(bare, BARE_PORT);

  const productUrl = (route: string) => `http://127.0.0.1:${APP_PORT}${route}`;
  const bareUrl = (route: string) => `http://127.0.0.1:${BARE_PORT}${route}`;
  const targets: [string, string][] = [
    ['product GET /api/work-orders (filtered, sorted page)', productUrl(routes.list)],
    ['bare Express, the same list JSON', bareUrl(routes.list)],
    ['product GET /api/work-orders/:id (20 joints)', productUrl(routes.detail)],
    ['bare Express, the same order JSON', bareUrl(routes.detail)],
    ['for scale: product GET /api/me (session, person, session touch; no work-order query)', productUrl('/api/me')],
  ];
  const results: LoadResult[] = [];
  for (const [name, target] of targets) {
    await loadIn({ url: target, cookie, connections: CONNECTIONS, seconds: 2 }); // warm-up, not counted
    const one = await loadIn({ url: target, cookie, connections: 1, seconds: 3 }); // one request at a time: the route's own latency
    const [node0, pg0] = [process.cpuUsage(), pgCpuMs(pgDir)];
    const r = await loadIn({ url: target, cookie, connections: CONNECTIONS, seconds: SECONDS });
    const node = process.cpuUsage(node0);
    const cpu = `CPU per request: Node ${((node.user + node.system) / 1000 / r.requests).toFixed(2)} ms, PostgreSQL ${((pgCpuMs(pgDir) - pg0) / r.requests).toFixed(2)} ms`;
    results.push(r);
    const load1 = os.loadavg()[0]!.toFixed(1);
    log(`${name}: ${r.rps} req/s, p50 ${r.p50} ms, p95 ${r.p95} ms, p99 ${r.p99} ms, max ${r.max} ms (${r.requests} requests, ${r.non2xx} non-2xx, ${r.errors} errors; machine load ${load1}); alone: ${one.rps} req/s, p50 ${one.p50} ms; ${cpu}`);
  }
  const [pl, bl, pd, bd] = results as [LoadResult, LoadResult, LoadResult, LoadResult];
  const verdict = (p: LoadResult, b: LoadResult) => `${((100 * p.rps) / b.rps).toFixed(0)} % of bare (goal ≥ 30 %), p95 ${p.p95} ms (goal < 100 ms)`;
  log(`list: ${verdict(pl, bl)}`);
  log(`detail: ${verdict(pd, bd)}`);
  log(`fill: ${fillSeconds.toFixed(0)} s for ${counts}`);

  await Promise.all([close(app), close(bareServer)]);
  await closeQueues();
  await sequelize.close();
}

main().then(
  () => process.exit(0), // the app's rate limiter keeps a Redis client open
  (err) => {
    console.error(`[bench] failed: ${err.stack ?? err}`);
    process.exit(1);
  },
);
