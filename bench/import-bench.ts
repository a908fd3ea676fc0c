// `npm run bench`: how long a 100,000-row lines file takes through the product's import path
// (parse + preview + apply: the service functions the worker runs) against psql's \copy of the
// same rows, into a bare table and into one with the register's indexes, on the same server, run
// by run (BENCH_RUNS, default 3). Starts its own PostgreSQL on 127.0.0.1:54390.

import { execFileSync } from 'node:child_process';
import { chmodSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureDebianPackages } from '../scripts/lib/debian';
import { pgBin, startPostgres } from '../scripts/lib/postgres';
import { HEADER, benchFile } from './bench-file';

const ROWS = Number(process.env.BENCH_ROWS ?? 100_000);
const PORT = Number(process.env.BENCH_PG_PORT ?? 54390);
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const PSQL = path.join(pgBin(), 'psql');
const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
async function time<T>(fn: () => Promise<T>): Promise<[T, number]> {
  const start = performance.now();
  const value = await fn();
  return [value, performance.now() - start];
}

async function main() {
  ensureDebianPackages(['postgresql']);
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'linewright-bench-'));
  chmodSync(tmp, 0o755);
  const pg = startPostgres({ dir: path.join(tmp, 'pg'), port: PORT, database: 'linewright_bench' });
  try {
    // config reads the environment when first imported: set it before any server module loads.
    Object.assign(process.env, { NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_URL: pg.url, REDIS_URL: 'redis://127.0.0.1:1' });
    await run(pg.url, tmp);
  } finally {
    pg.stop();
    rmSync(tmp, { recursive: true, force: true });
  }
}

async function run(url: string, tmp: string) {
  const { migrate } = await import('../server/db/migrate');
  const { sequelize } = await import('../server/db/sequelize');
  const { Person } = await import('../server/db/models/person');
  const { uploadImport, confirmImport } = await import('../server/services/line-imports/import-service');
  await migrate();
  const person = await Person.create({ issuer: 'linewright', subject: 'bench', name: 'Bench', email: null, lastSignInAt: null });
  const me = { id: person.id, name: person.name, email: null, roles: ['planner' as const] };
  const psql = (...args: string[]) => execFileSync(PSQL, [url, '-v', 'ON_ERROR_STOP=1', '-qtA', ...args]).toString();

  // A short warm-up import, untimed: the worker is a long-running process, its code is warm.
  const warm = await uploadImport(me, { filename: 'warm-up.csv', buffer: Buffer.from(benchFile(2000).replace(/BENCH-/g, 'WARM-')) }, { inline: true });
  await confirmImport(me, warm.id, { inline: true });

  const text = benchFile(ROWS);
  const changed = benchFile(ROWS, 10);
  const file = path.join(tmp, 'bench-lines.csv');
  writeFileSync(file, text);
  console.log(`[bench] ${ROWS.toLocaleString('en-US')} rows, ${(text.length / 1e6).toFixed(1)} MB; ${RUNS} runs, each on an empty register`);

  psql('-c', 'create table bench_bare (line_number text, area text, service text, material text, schedule text, nominal_size text, design_pressure_psi real, design_temperature_f real, drawing text, notes text)');
  psql('-c', 'create table bench_like_lines (like lines including all); alter table bench_like_lines alter nominal_size_in drop not null');
  const copy = (table: string, cols: string) => {
    psql('-c', `truncate ${table}`);
    const start = performance.now();
    psql('-c', `\\copy ${table} (${cols}) from '${file}' with (format csv, header true)`);
    return performance.now() - start;
  };
  const importFile = async (name: string, csv: string) => {
    const [preview, previewMs] = await time(() => uploadImport(me, { filename: name, buffer: Buffer.from(csv) }, { inline: true }));
    const [applied, applyMs] = await time(() => confirmImport(me, preview.id, { inline: true }));
    return { previewMs, applyMs, totalMs: previewMs + applyMs, counts: applied.counts };
  };

  // Each run: the product path on an empty register, then the same file by \copy, bare and with the
  // register's indexes, back to back so that all three meet the same load on the machine; then the
  // same file again with 1 row in 10 changed (after loading the first one, untimed).
  type Run = { fresh: Awaited<ReturnType<typeof importFile>>; bare: number; likeLines: number; again: Awaited<ReturnType<typeof importFile>> };
  const runs: Run[] = [];
  for (let i = 1; i <= RUNS; i++) {
    await sequelize.query('truncate lines cascade');
    const fresh = await importFile(`bench-lines-${i}.csv`, text);
    const bare = copy('bench_bare', HEADER);
    const likeLines = copy('bench_like_lines', HEADER.replace('drawing', 'drawing_ref'));
    const again = await importFile(`bench-lines-${i}-changed.csv`, changed);
    runs.push({ fresh, bare, likeLines, again });
    console.log(
      `[bench] run ${i}: new register: preview ${seconds(fresh.previewMs)}, apply ${seconds(fresh.applyMs)}, total ${seconds(fresh.totalMs)} ${JSON.stringify(fresh.counts)}; ` +
        `\\copy bare ${seconds(bare)}, with indexes ${seconds(likeLines)}; product / indexed \\copy ${(fresh.totalMs / likeLines).toFixed(2)}×; ` +
        `1 in 10 changed: preview ${seconds(again.previewMs)}, apply ${seconds(again.applyMs)} ${JSON.stringify(again.counts)}`,
    );
  }

  const { readColumns } = await import('../server/services/line-imports/register-csv');
  const { readRows } = await import('../server/services/line-imports/data-rows');
  const { lineRowChecker } = await import('../server/services/line-imports/register-rows');
  const [, jsMs] = await time(async () => {
    const cols = readColumns(text) as Parameters<typeof lineRowChecker>[0];
    const check = lineRowChecker(cols);
    return [...readRows(text, cols)].map((r) => check(r.cells));
  });

  const best = (pick: (r: Run) => number) => Math.min(...runs.map(pick));
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
  const productMs = best((r) => r.fresh.totalMs);
  const likeLines = best((r) => r.likeLines);
  const bare = best((r) => r.bare);
  console.log(`[bench] best of ${RUNS}: product path, new register: preview ${seconds(best((r) => r.fresh.previewMs))}, apply ${seconds(best((r) => r.fresh.applyMs))}, total ${seconds(productMs)}`);
  console.log(`[bench]   reading and checking the rows in Node alone (CSV reader + row checks), timed apart: ${seconds(jsMs)}`);
  console.log(`[bench] best of ${RUNS}: product path, same file with 1 row in 10 changed: preview ${seconds(best((r) => r.again.previewMs))}, apply ${seconds(best((r) => r.again.applyMs))}`);
  console.log(`[bench] best of ${RUNS}: psql \\copy into a bare table ${seconds(bare)}; into a table shaped like lines, with its indexes ${seconds(likeLines)} (psql start-up included; nominal_size_in left to a default)`);
  console.log(`[bench] product path / bare \\copy = ${(productMs / bare).toFixed(1)}× (best against best)`);
  console.log(
    `[bench] product path / \\copy with the register's indexes = ${(productMs / likeLines).toFixed(2)}× best against best, ` +
      `${median(runs.map((r) => r.fresh.totalMs / r.likeLines)).toFixed(2)}× median of the runs (goal 2×)`,
  );
  await sequelize.close();
}

main().catch((err) => {
  console.error(`[bench] failed: ${err.stack ?? err}`);
  process.exit(1);
});
