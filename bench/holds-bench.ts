// `npm run bench:holds`: how late the worker lifts holds, and how releases behave when they race.
// Starts its own PostgreSQL (127.0.0.1:6461) and Redis (6462) and one worker in this process.
//   1. 200 holds due over two minutes, the worker otherwise idle: lateness after each due time.
//   2. 50 holds due over 30 s, then FLUSHALL at once: the sweep (every 30 s) lifts them from PostgreSQL.
//   3. 50 releases at once on one ready order (exactly one may pass) and 50 on one blocked order
//      (all refused), through the release service: outcomes and the p95 latency of a release.
// The orders, joints and holds are written straight as rows: the bench measures lifting and
// releasing, not how they came about.

import { mkdtempSync, chmodSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureDebianPackages } from '../scripts/lib/debian';
import { startPostgres } from '../scripts/lib/postgres';
import { startRedis } from '../scripts/lib/redis';

const [PG_PORT, REDIS_PORT] = [6461, 6462];
const log = (msg: string) => console.log(`[bench] ${msg}`);
const pct = (xs: number[], p: number) => { const s = [...xs].sort((a, b) => a - b); return s[Math.min(s.length - 1, Math.ceil((p / 100) * s.length) - 1)] ?? NaN; };
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function main() {
  ensureDebianPackages(['postgresql', 'redis-server']);
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'linewright-holds-bench-'));
  chmodSync(tmp, 0o755);
  const pg = startPostgres({ dir: path.join(tmp, 'pg'), port: PG_PORT, database: 'linewright_holds_bench' });
  const redis = await startRedis({ port: REDIS_PORT });
  try {
    Object.assign(process.env, {
      NODE_ENV: 'production', LOG_LEVEL: 'warn', DATABASE_URL: pg.url, REDIS_URL: redis.url, SESSION_SECRET: 'holds-bench-session-secret',
      APP_ORIGIN: 'http://127.0.0.1:6463', OIDC_ISSUER: 'http://127.0.0.1:6464', CLIENT_DIST: path.join(tmp, 'no-client'),
    });
    await run();
  } finally {
    await redis.stop();
    pg.stop();
    rmSync(tmp, { recursive: true, force: true });
  }
}

async function run() {
  const { migrate } = await import('../server/db/migrate');
  const { sequelize } = await import('../server/db/sequelize');
  const { closeQueues, redis } = await import('../server/queues/connection');
  const { Person } = await import('../server/db/models/person');
  const { Line } = await import('../server/db/models/line');
  const { WorkOrder, WorkOrderLine } = await import('../server/db/models/work-order');
  const { JointTask } = await import('../server/db/models/joint-task');
  const { Hold } = await import('../server/db/models/joint-record');
  const { PressureTest } = await import('../server/db/models/release');
  const { scheduleLifts } = await import('../server/services/holds/lift');
  const { releaseOrder } = await import('../server/services/release/release');
  const { startWorkers } = await import('../worker/workers');
  await migrate();

  const person = await Person.create({ issuer: 'bench', subject: 'ops', name: 'Bench Operator', email: null, rolesFromIdp: ['operations'], lastSignInAt: null });
  const me = { id: person.id, name: person.name, email: null, roles: ['operations' as const] };
  const line = await Line.create({ lineNumber: 'BENCH-001', area: 'Bench', service: 'Water', material: 'PVC', schedule: '80', sdr: null, nominalSize: '2', nominalSizeIn: 2, designPressurePsi: 100, designTemperatureF: 73, drawingRef: null, notes: null });
  let n = 0;
  const order = async (state: 'curing' | 'ready' | 'testing', joints: number) => {
    const o = await WorkOrder.create({ number: `WO-BENCH-${++n}`, kind: 'repair', priority: 'soon', scope: 'bench', requestedBy: 'bench', windowStart: null, windowEnd: null, forecastLowF: 70, forecastHighRh: 50, testPressurePsi: null, componentRatingPsi: null, state, createdById: person.id, lastJointNumber: joints });
    await WorkOrderLine.create({ workOrderId: o.id, lineId: line.id });
    const tasks = await JointTask.bulkCreate(Array.from({ length: joints }, (_, i) => ({ workOrderId: o.id, number: i + 1, lineId: line.id, fittingKind: 'coupling' as const, nominalSize: '2', nominalSizeIn: 2, reducingSize: null, reducingSizeIn: null })));
    return { o, tasks };
  };
  const holdsDue = async (orderId: string, taskIds: string[], firstInMs: number, spreadMs: number) => {
    const now = Date.now();
    return Hold.bulkCreate(taskIds.map((id, i) => ({
      workOrderId: orderId, jointTaskId: id, kind: 'set' as const, status: 'running' as const, startsAt: new Date(now), endsAt: new Date(now + firstInMs + Math.round((i / taskIds.length) * spreadMs)),
      temperatureF: 70, relativeHumidity: 50, pressurePsi: 150, schedule: 'A', basis: 'bench', source: 'bench',
    })));
  };
  const lateness = async (ids: string[]) => (await Hold.findAll({ where: { id: ids } })).map((h) => (h.endedAt ? h.endedAt.getTime() - h.endsAt!.getTime() : NaN));
  const waitAllEnded = async (ids: string[], ms: number) => {
    const until = Date.now() + ms;
    while (Date.now() < until) {
      if ((await Hold.count({ where: { id: ids, status: 'ended' } })) === ids.length) return true;
      await sleep(250);
    }
    return false;
  };

  const workers = startWorkers();
  await sleep(2000);

  // 1. 200 holds due over two minutes
  const a = await order('curing', 200);
  const first = await holdsDue(a.o.id, a.tasks.map((t) => t.id), 5_000, 120_000);
  scheduleLifts(first);
  log('200 holds due over 2 min, the worker idle…');
  const all1 = await waitAllEnded(first.map((h) => h.id), 180_000);
  const late1 = await lateness(first.map((h) => h.id));
  const ok1 = late1.filter(Number.isFinite);
  log(`lifted ${ok1.length}/200${all1 ? '' : ' (not all!)'}: lateness median ${pct(ok1, 50)} ms, p95 ${pct(ok1, 95)} ms, worst ${Math.max(...ok1)} ms (goal: worst ≤ 1000 ms)`);

  // 2. FLUSHALL: the delayed jobs are gone; the sweep finds the holds in PostgreSQL
  const b = await order('curing', 50);
  const second = await holdsDue(b.o.id, b.tasks.map((t) => t.id), 5_000, 30_000);
  scheduleLifts(second);
  await sleep(500);
  await redis().flushall();
  log('50 holds due over 30 s, Redis flushed…');
  const all2 = await waitAllEnded(second.map((h) => h.id), 120_000);
  const late2 = (await lateness(second.map((h) => h.id))).filter(Number.isFinite);
  log(`lifted ${late2.length}/50${all2 ? '' : ' (not all!)'} after FLUSHALL: lateness median ${(pct(late2, 50) / 1000).toFixed(1)} s, worst ${(Math.max(...late2) / 1000).toFixed(1)} s (goal: ≤ the 30 s sweep period, plus the 15 s schedule watch)`);

  // 3. releases racing
  const ready = await order('ready', 1);
  await PressureTest.create({ workOrderId: ready.o.id, result: 'passed', medium: 'water', testPressurePsi: 150, gauge: 'bench', startedAt: new Date(Date.now() - 20 * 60_000), startReadingPsi: 150, endedAt: new Date(Date.now() - 60_000), endReadingPsi: 150, pipingIdentified: 'bench', examiner: 'bench', notes: null, witnessId: person.id, recordedAt: new Date() });
  const blocked = await order('testing', 1);
  await holdsDue(blocked.o.id, blocked.tasks.map((t) => t.id), 3_600_000, 0);
  const checklist = { areaInspected: true as const, peopleClear: true as const, affectedTold: true as const, ventsDrainsSet: true as const, slowRefill: true as const };
  const race = async (orderId: string) => Promise.all(Array.from({ length: 50 }, async () => {
    const t0 = performance.now();
    try {
      await releaseOrder(me, orderId, checklist);
      return { ok: true, ms: performance.now() - t0, code: '' };
    } catch (err) {
      return { ok: false, ms: performance.now() - t0, code: (err as { code?: string }).code ?? String(err) };
    }
  }));
  for (const [name, id] of [['ready', ready.o.id], ['blocked', blocked.o.id]] as const) {
    const r = await race(id);
    const codes = [...new Set(r.filter((x) => !x.ok).map((x) => x.code))].join(', ');
    log(`50 releases at once on the ${name} order: ${r.filter((x) => x.ok).length} released, ${r.filter((x) => !x.ok).length} refused (${codes}); latency p50 ${pct(r.map((x) => x.ms), 50).toFixed(0)} ms, p95 ${pct(r.map((x) => x.ms), 95).toFixed(0)} ms`);
  }

  await workers.close();
  await closeQueues();
  await sequelize.close();
}

void main().catch((err) => {
  console.error(err);
  process.exit(1);
});
