// `npm run bench:speed` (issue 11, "fast where people wait"): every measure of the issue's table in
// one run, each printed with its goal. Starts its own PostgreSQL (127.0.0.1:6481) and Redis (6482),
// migrates, fills through the services (demo plant, orders locked out and verified: the release
// queue, draft orders), serves the app as a plant does (NODE_ENV=production, createApp(), the built client) on
// 6483 and a bare Express 5 app answering the same JSON from memory on 6484, forges a session cookie
// (a user_sessions row signed like express-session's), then loads each route with autocannon in a
// child process: 50 connections, warm-up not counted, `Accept-Encoding: gzip, deflate, br` to both.
// The register grows 150 → 20,165 → 100,000 lines (the line import) with the search measured at each
// size. At 20,165 lines the cold /lines first screen is measured by bench/first-screen.ts, before the
// load runs (judged) and after them (reported).
// BENCH_SECONDS, BENCH_WARMUP, BENCH_ORDERS, BENCH_QUEUE, BENCH_SIZES, BENCH_FIRST_SCREEN_RUNS (7), BENCH_FIRST_SCREEN_AFTER_RUNS (5),
// BENCH_BUILD (0: reuse the client build as it is, 1: rebuild), BENCH_PORT_BASE: see bench/README.md.

import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { createHmac, randomUUID } from 'node:crypto';
import { chmodSync, existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import { ensureDebianPackages } from '../scripts/lib/debian';
import { pgBin, startPostgres } from '../scripts/lib/postgres';
import { BIN, ROOT } from '../scripts/lib/processes';
import { startRedis } from '../scripts/lib/redis';
import type { FirstScreenResult, LoadResult } from './speed-load';
import { verdicts, type Measured } from './speed-report';

const env = (name: string, fallback: number) => Number(process.env[name] ?? fallback);
const SECONDS = env('BENCH_SECONDS', 10);
const WARMUP = env('BENCH_WARMUP', 3);
const ORDERS = env('BENCH_ORDERS', 1000);
const QUEUE = env('BENCH_QUEUE', 23);
const FS_RUNS = env('BENCH_FIRST_SCREEN_RUNS', 7);
const FS_AFTER_RUNS = env('BENCH_FIRST_SCREEN_AFTER_RUNS', 5);
const ALONE_SECONDS = env('BENCH_ALONE_SECONDS', 3);
const SIZES = (process.env.BENCH_SIZES ?? '150,20165,100000').split(',').map(Number);
const MAIN_SIZE = SIZES[1] ?? SIZES[0]!;
const BASE = env('BENCH_PORT_BASE', 6481);
const [PG_PORT, REDIS_PORT, APP_PORT, BARE_PORT] = [BASE, BASE + 1, BASE + 2, BASE + 3];
const CONNECTIONS = 50;
const SECRET = 'speed-bench-session-secret';
const DIST = path.join(ROOT, '.tmp', 'dist-6489');
/** BENCH_CPU_PROFILE=<dir>: a V8 CPU profile of this process (the app) over each product route's measured run. */
const PROFILE_DIR = process.env.BENCH_CPU_PROFILE;
/** BENCH_ROUTES=lines,me,…: measure only these (the search is always measured). */
const ONLY = process.env.BENCH_ROUTES?.split(',');
const log = (msg: string) => console.log(`[bench] ${msg}`);
const load1 = () => os.loadavg().map((l) => l.toFixed(1)).join(' ');

const ROUTES = {
  lines: '/api/lines?page=1&pageSize=50',
  search: '/api/lines?page=1&pageSize=50&search=HY&material=PVC&sort=designPressurePsi',
  /** The same search with a new term in every request ({n}: 100, 101, …): nothing kept, each answer is a query. */
  searchNew: '/api/lines?page=1&pageSize=50&search={n}&material=PVC&sort=designPressurePsi',
  me: '/api/me',
  workOrders: '/api/work-orders?state=draft&area=300%20Water%20treatment&sort=windowStart&dir=asc&page=3&pageSize=50',
  releaseQueue: '/api/release-queue',
  lineStatus: '/api/line-status',
} as const;
type RouteName = keyof typeof ROUTES;

/** express-session's cookie: "s:" + the id + "." + its HMAC-SHA256 in base64 without padding (cookie-signature). */
const signedCookie = (sid: string) => `lw.sid=${encodeURIComponent(`s:${sid}.${createHmac('sha256', SECRET).update(sid).digest('base64').replace(/=+$/, '')}`)}`;
const listen = (app: ReturnType<typeof express>, port: number) =>
  new Promise<Server>((ok, fail) => { const s = createServer(app).once('error', fail).listen(port, '127.0.0.1', () => ok(s)); });
const close = (s: Server) => new Promise<void>((ok) => (s.closeAllConnections(), s.close(() => ok())));

/** bench/speed-load.ts in a child process (its own event loop); its last stdout line is JSON. */
function child<T>(envName: string, spec: object, timeoutMs: number): Promise<T> {
  return new Promise((resolve, reject) => {
    const c = spawn(BIN('tsx'), ['bench/speed-load.ts'], { cwd: ROOT, env: { ...process.env, [envName]: JSON.stringify(spec) }, stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    const timer = setTimeout(() => c.kill('SIGTERM'), timeoutMs);
    c.stdout.on('data', (d) => (out += d));
    c.once('exit', (code) => {
      clearTimeout(timer);
      if (code === 0) resolve(JSON.parse(out.trim().split('\n').pop()!) as T);
      else reject(new Error(`${envName} child failed (exit ${code})`));
    });
  });
}

async function startProfile(): Promise<(file: string) => Promise<void>> {
  const { Session } = await import('node:inspector/promises');
  const { mkdirSync, writeFileSync } = await import('node:fs');
  const session = new Session();
  session.connect();
  await session.post('Profiler.enable');
  await session.post('Profiler.start');
  return async (file) => {
    const { profile } = await session.post('Profiler.stop');
    mkdirSync(path.dirname(file), { recursive: true });
    writeFileSync(file, JSON.stringify(profile));
    session.disconnect();
    log(`  CPU profile: ${file}`);
  };
}

/** The register's growth by the line import, in bench/speed-grow.ts (a child process, so the serving process keeps its heap). */
function grow(spec: object): Promise<void> {
  return new Promise((resolve, reject) => {
    const c = spawn(BIN('tsx'), ['bench/speed-grow.ts'], { cwd: ROOT, env: { ...process.env, BENCH_GROW: JSON.stringify(spec) }, stdio: ['ignore', 'inherit', 'inherit'] });
    c.once('exit', (code) => (code === 0 ? resolve() : reject(new Error(`the register's growth failed (exit ${code})`))));
  });
}

/**
 * Until the app has finished every request a load run left behind (the server goes on answering
 * requests whose client has gone): no statement running in PostgreSQL and the process nearly idle,
 * five times in a row a quarter-second apart. Without it a slow route's backlog slows the next target.
 */
async function settle(idle: () => Promise<boolean>, label: string): Promise<number> {
  const start = performance.now();
  for (let quiet = 0; quiet < 5 && performance.now() - start < 300_000;) {
    const cpu = process.cpuUsage();
    await new Promise((r) => setTimeout(r, 250));
    const used = process.cpuUsage(cpu);
    quiet = (await idle()) && (used.user + used.system) / 1000 < 50 ? quiet + 1 : 0;
  }
  const waited = (performance.now() - start) / 1000;
  if (waited > 3) log(`  (waited ${waited.toFixed(0)} s after ${label} for the app to finish the requests left behind)`);
  return waited;
}

async function measure(label: string, url: string, cookie: string, idle: () => Promise<boolean>, alone = false): Promise<Measured> {
  const load = (connections: number, seconds: number) => child<LoadResult>('BENCH_LOAD', { url, cookie, connections, seconds }, seconds * 1000 + 120_000);
  if (WARMUP > 0) await load(CONNECTIONS, WARMUP);
  await settle(idle, `the warm-up of ${label}`);
  const one = alone ? await load(1, ALONE_SECONDS) : undefined;
  const profiling = PROFILE_DIR && alone ? await startProfile() : undefined;
  const r = await load(CONNECTIONS, SECONDS);
  if (profiling) await profiling(path.join(PROFILE_DIR!, `${label.replace(/[^a-z0-9]+/gi, '-')}.cpuprofile`));
  const m: Measured = { ...r, label, load: load1(), aloneP50: one?.p50 };
  log(`${label}: ${r.rps} req/s, p50 ${r.p50} ms, p95 ${r.p95} ms, ${r.bytes} B/response, ${r.non2xx} non-2xx, ${r.errors} errors; load ${m.load}${one ? `; alone: ${one.rps} req/s, p50 ${one.p50} ms` : ''}`);
  if (r.non2xx || r.errors) log(`  WARNING: ${label} had ${r.non2xx} non-2xx answers and ${r.errors} errors`);
  const waited = await settle(idle, label);
  // Fewer answers than connections: the run was shorter than one request under this load. Counting the
  // requests still in flight as answered when the app fell quiet gives the route's throughput roughly.
  if (r.requests < CONNECTIONS * 2) {
    m.drainedRps = Math.round(((r.requests + CONNECTIONS) / (SECONDS + waited)) * 10) / 10;
    log(`  ${label}: ${r.requests} answers in ${SECONDS} s and ${CONNECTIONS} more by ${waited.toFixed(0)} s later: ≈ ${m.drainedRps} req/s`);
  }
  return m;
}

/** The newest modification time under the client's sources, to know whether a build is stale. */
function newest(p: string): number {
  if (!existsSync(p)) return 0;
  const s = statSync(p);
  if (!s.isDirectory()) return s.mtimeMs;
  return Math.max(s.mtimeMs, ...readdirSync(p).map((f) => newest(path.join(p, f))));
}

function buildClient(): void {
  const built = path.join(DIST, 'index.html');
  const stale = !existsSync(built) || statSync(built).mtimeMs < Math.max(...['src', 'shared', 'public', 'index.html', 'vite.config.ts', 'package.json'].map((f) => newest(path.join(ROOT, f))));
  if (process.env.BENCH_BUILD === '0' ? !existsSync(built) : process.env.BENCH_BUILD === '1' || stale) {
    log(`building the client into ${path.relative(ROOT, DIST)} (NODE_ENV=production vite build)…`);
    const r = spawnSync(BIN('vite'), ['build', '--outDir', DIST, '--emptyOutDir'], { cwd: ROOT, env: { ...process.env, NODE_ENV: 'production' }, encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`vite build failed:\n${r.stdout}\n${r.stderr}`);
  } else log(`reusing the client build in ${path.relative(ROOT, DIST)}`);
}

async function main() {
  ensureDebianPackages(['postgresql', 'redis-server']);
  log(`tree ${ROOT}; load average at start ${load1()}`);
  buildClient();
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'linewright-speed-bench-'));
  chmodSync(tmp, 0o755);
  const pg = startPostgres({ dir: path.join(tmp, 'pg'), port: PG_PORT, database: 'linewright_speed_bench' });
  const redis = await startRedis({ port: REDIS_PORT });
  try {
    // config reads the environment when first imported: set it before any server module loads.
    Object.assign(process.env, {
      NODE_ENV: 'production', LOG_LEVEL: 'warn', DATABASE_URL: pg.url, REDIS_URL: redis.url, SESSION_SECRET: SECRET, PORT: String(APP_PORT),
      APP_ORIGIN: `http://127.0.0.1:${APP_PORT}`, OIDC_ISSUER: `http://127.0.0.1:${BASE + 4}`, CLIENT_DIST: DIST,
    });
    await run(pg.url);
  } finally {
    await redis.stop();
    pg.stop();
    rmSync(tmp, { recursive: true, force: true });
  }
}

async function run(url: string) {
  const psql = (sql: string) => execFileSync(path.join(pgBin(), 'psql'), [url, '-v', 'ON_ERROR_STOP=1', '-qtAc', sql]).toString().trim();
  const { migrate } = await import('../server/db/migrate');
  const { sequelize } = await import('../server/db/sequelize');
  const { QueryTypes } = await import('sequelize');
  const { closeQueues } = await import('../server/queues/connection');
  const { createApp } = await import('../server/app');
  const { Line } = await import('../server/db/models/line');
  const { Person } = await import('../server/db/models/person');
  const fill = await import('./speed-fill');
  const { fillOrders } = await import('./work-orders-fill');
  await migrate();

  // A throw-away database: commits need not wait for the disk while filling; measured with the default back.
  psql('alter system set synchronous_commit = off');
  psql('select pg_reload_conf()');
  const started = performance.now();
  const loaderRow = await Person.create({ issuer: 'bench', subject: 'loader', name: 'Bench loader', email: null, rolesFromIdp: ['planner'], lastSignInAt: null });
  const loader = { id: loaderRow.id, name: loaderRow.name, email: null, roles: ['planner' as const] };
  log(`demo plant through the line import: ${await fill.loadPlant(loader)}`);
  const people = { planner: await fill.demoPerson('planner', 'planner'), operations: await fill.demoPerson('operations', 'operations'), fitter: await fill.demoPerson('fitter', 'fitter') };
  log(`${await fill.isolatedOrders(QUEUE, people)} orders planned, locked out and verified (in the release queue)`);
  const demoLines = await Line.findAll({ order: [['lineNumber', 'ASC']] });
  await fillOrders(people.planner, demoLines, ORDERS, 8, log);
  psql('alter system reset synchronous_commit');
  psql('select pg_reload_conf()');
  psql('vacuum analyze');
  log(`filled in ${((performance.now() - started) / 1000).toFixed(0)} s: ${psql("select (select count(*) from lines) || ' lines, ' || (select count(*) from work_orders) || ' orders (' || (select count(*) from work_orders where state in ('isolated','in-work','curing','testing','ready')) || ' in the release queue), ' || (select count(*) from joint_tasks) || ' joint tasks'")}`);

  /**
   * A signed-in planner's session, its expiry last extended `ageMin` minutes ago (a user_sessions row
   * and its cookie signed like express-session's).
   */
  const session = (ageMin: number) => {
    const sid = randomUUID();
    const expires = new Date(Date.now() + 12 * 3_600_000 - ageMin * 60_000);
    const sess = { cookie: { originalMaxAge: 12 * 3_600_000, expires: expires.toISOString(), secure: false, httpOnly: true, path: '/', sameSite: 'lax' }, personId: people.planner.id };
    psql(`insert into user_sessions (sid, sess, expire) values ('${sid}', '${JSON.stringify(sess)}', '${expires.toISOString()}')`);
    return signedCookie(sid);
  };
  const cookie = session(0);

  const app = await listen(createApp(), APP_PORT);
  const idle = async () => Number((await sequelize.query<{ n: string }>("select count(*) as n from pg_stat_activity where datname = current_database() and state <> 'idle' and pid <> pg_backend_pid()", { type: QueryTypes.SELECT }))[0]!.n) === 0;
  const product = (r: RouteName) => `http://127.0.0.1:${APP_PORT}${ROUTES[r]}`;
  const bareUrl = (r: RouteName) => `http://127.0.0.1:${BARE_PORT}${ROUTES[r]}`;
  const bodies = new Map<string, unknown>();
  const bare = express();
  bare.get('/{*splat}', (req, res) => { res.json(bodies.get(req.path)); });
  const bareServer = await listen(bare, BARE_PORT);

  const m: Record<string, Measured> = {};
  const searchAt: [number, Measured][] = [];
  const searchNewAt: [number, Measured][] = [];
  let firstScreen: FirstScreenResult | undefined;
  let firstScreenAfter: FirstScreenResult | undefined;
  /**
   * Cold loads of /lines in Chromium at 4× CPU slowdown (bench/first-screen.ts), judged before the
   * load runs — a tablet meets the server as it serves a plant, not as fifty connections have just
   * left it — and measured again after them, reported beside. Each gets a session of its own, fresh
   * as after a sign-in or within five minutes of the last request: a session whose expiry is due to
   * be extended (a write and a Set-Cookie on the first request) made the first screen ~0.6 s slower
   * in Chromium here, though the server answered those requests in 17 ms (bench/README.md).
   * BENCH_FIRST_SCREEN_SESSION_AGE (minutes) measures that case.
   */
  const measureFirstScreen = async (runs: number, when: string): Promise<FirstScreenResult> => {
    log(`first screen ${when}: ${runs} cold loads of /lines in Chromium at 4× CPU slowdown (bench/first-screen.ts)…`);
    const fsCookie = session(Number(process.env.BENCH_FIRST_SCREEN_SESSION_AGE ?? 0));
    const r = await child<FirstScreenResult>('BENCH_FIRST_SCREEN', { baseUrl: `http://127.0.0.1:${APP_PORT}`, cookie: fsCookie, runs }, 600_000)
      .catch((err: Error): FirstScreenResult => ({ missing: `failed: ${err.message}` }));
    log(`first screen ${when}: LCP median ${r.lcpMs ?? '?'} ms, first row ${r.firstRowMs ?? '?'} ms, ${r.bytes ?? '?'} B; load ${load1()}`);
    return r;
  };
  let lines = Number(psql('select count(*) from lines'));
  for (const size of SIZES) {
    if (size > lines) {
      const t0 = performance.now();
      await grow({ loader, from: lines - 150, count: size - lines, filename: `bench-lines-${size}.csv` });
      psql('vacuum analyze');
      psql('checkpoint'); // the import's dirty pages written now, not while the next target is measured
      execFileSync('sync'); // and out of the system's write-back too
      lines = Number(psql('select count(*) from lines'));
      log(`register grown to ${lines} lines through the line import in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    }
    const search = await measure(`search at ${lines} lines`, product('search'), cookie, idle, true);
    searchAt.push([lines, search]);
    searchNewAt.push([lines, await measure(`search, a new term each request, at ${lines} lines`, product('searchNew'), cookie, idle, true)]);
    if (size !== MAIN_SIZE) continue;
    for (const r of Object.keys(ROUTES) as RouteName[]) {
      if (r === 'searchNew') continue;
      const res = await fetch(product(r), { headers: { cookie, 'accept-encoding': 'identity' } });
      if (res.status !== 200) throw new Error(`${ROUTES[r]} answered ${res.status}: ${await res.text()}`);
      const body = (await res.json()) as Record<string, unknown>;
      if (r !== 'search') bodies.set(ROUTES[r].split('?')[0]!, body);
      const count = ['total', 'orders', 'lines'].map((k) => (Array.isArray(body[k]) ? (body[k] as unknown[]).length : body[k])).find((v) => v !== undefined);
      log(`${ROUTES[r]}: ${JSON.stringify(body).length} bytes of JSON${count === undefined ? '' : `, ${count} ${r === 'lines' || r === 'search' ? 'matching lines' : 'rows'}`}`);
    }
    m.search = search;
    if (FS_RUNS > 0) firstScreen = await measureFirstScreen(FS_RUNS, 'before the load runs');
    for (const r of (['lines', 'me', 'workOrders', 'releaseQueue', 'lineStatus'] as const).filter((n) => !ONLY || ONLY.includes(n))) {
      m[r] = await measure(`product ${ROUTES[r]}`, product(r), cookie, idle, true);
      m[`${r}Bare`] = await measure(`bare ${ROUTES[r].split('?')[0]}`, bareUrl(r), cookie, idle);
    }
    if (FS_RUNS > 0 && FS_AFTER_RUNS > 0) firstScreenAfter = await measureFirstScreen(FS_AFTER_RUNS, 'after the load runs');
  }
  verdicts(m, searchAt, firstScreen, log, searchNewAt, firstScreenAfter);
  log(`load average at the end ${load1()}; tree ${ROOT}`);

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
