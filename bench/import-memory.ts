// `npx tsx bench/import-memory.ts`: the memory a worker needs to preview and apply a 100,000-row
// lines file. Runs the worker's two steps (previewImport, applyImport) in this process against a
// PostgreSQL of its own (127.0.0.1:54391, BENCH_PG_PORT moves it) and reports the peak resident set
// (the kernel's ru_maxrss), the peak V8 heap in use (sampled every 2 ms and at every progress report,
// garbage not yet collected included) and, with --expose-gc, the live heap at each progress report
// (after a full collection): `node --expose-gc --import tsx bench/import-memory.ts`.

import { mkdtempSync, rmSync, chmodSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureDebianPackages } from '../scripts/lib/debian';
import { startPostgres } from '../scripts/lib/postgres';
import { benchFile } from './bench-file';

const ROWS = Number(process.env.BENCH_ROWS ?? 100_000);
const PORT = Number(process.env.BENCH_PG_PORT ?? 54391);
const mb = (bytes: number) => `${(bytes / 2 ** 20).toFixed(0)} MB`;

async function main() {
  ensureDebianPackages(['postgresql']);
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'linewright-memory-'));
  chmodSync(tmp, 0o755);
  const pg = startPostgres({ dir: path.join(tmp, 'pg'), port: PORT, database: 'linewright_memory', fsync: false });
  try {
    Object.assign(process.env, { NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_URL: pg.url, REDIS_URL: 'redis://127.0.0.1:1', IMPORT_INLINE_LIMIT: '2000000' });
    await run();
  } finally {
    pg.stop();
    rmSync(tmp, { recursive: true, force: true });
  }
}

async function run() {
  const { migrate } = await import('../server/db/migrate');
  const { sequelize } = await import('../server/db/sequelize');
  const { Person } = await import('../server/db/models/person');
  const { LineImport } = await import('../server/db/models/line-import');
  const { applyImport, previewImport } = await import('../server/services/line-imports/import-service');
  const { decodeCsv } = await import('../server/services/line-imports/csv-text');
  await migrate();
  const person = await Person.create({ issuer: 'linewright', subject: 'memory', name: 'Memory', email: null, lastSignInAt: null });
  const source = decodeCsv(Buffer.from(benchFile(ROWS)));
  // The row as the API leaves it for the worker: stored, previewing; the worker reads it back.
  const imp = await LineImport.create({ kind: 'lines', filename: 'memory.csv', status: 'previewing', source, createdById: person.id, confirmedById: null, appliedAt: null, error: null });

  let peakHeap = 0;
  let peakLive = 0;
  const sample = () => (peakHeap = Math.max(peakHeap, process.memoryUsage().heapUsed));
  const gc = (globalThis as { gc?: () => void }).gc;
  // At each progress report (between chunks), what is still alive: the heap after a full collection.
  const live = () => {
    sample();
    if (!gc) return;
    gc();
    peakLive = Math.max(peakLive, process.memoryUsage().heapUsed);
  };
  (globalThis as { gc?: () => void }).gc?.();
  const before = process.memoryUsage();
  console.log(`[memory] ${ROWS.toLocaleString('en-US')} rows, ${(source.length / 1e6).toFixed(1)} MB; before: rss ${mb(before.rss)}, heap ${mb(before.heapUsed)}`);
  const timer = setInterval(sample, 2);
  const update = LineImport.update.bind(LineImport);
  // Every progress report samples too: those are the moments between chunks.
  LineImport.update = ((...args: Parameters<typeof update>) => (live(), update(...args))) as typeof LineImport.update;
  const start = performance.now();
  await previewImport(imp.id);
  const previewed = await LineImport.findByPk(imp.id);
  const previewStatus = previewed!.status;
  const previewHeap = peakHeap;
  const previewLive = peakLive;
  const previewRss = process.resourceUsage().maxRSS * 1024;
  await previewed!.update({ status: 'applying', confirmedById: person.id });
  await applyImport(imp.id);
  clearInterval(timer);
  const applied = await LineImport.findByPk(imp.id);
  console.log(`[memory] preview: ${previewStatus} ${JSON.stringify(previewed!.counts)}; peak rss ${mb(previewRss)}, peak heap ${mb(previewHeap)}${gc ? `, live heap between chunks ≤ ${mb(previewLive)}` : ''}`);
  console.log(`[memory] apply: ${applied!.status}; peak rss (whole run) ${mb(process.resourceUsage().maxRSS * 1024)}, peak heap (whole run) ${mb(peakHeap)}${gc ? `, live heap between chunks ≤ ${mb(peakLive)}` : ''}; ${((performance.now() - start) / 1000).toFixed(1)} s`);
  await sequelize.close();
}

main().catch((err) => {
  console.error(`[memory] failed: ${err.stack ?? err}`);
  process.exit(1);
});
