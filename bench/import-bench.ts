// `npm run bench`: how long a 100,000-row lines file takes through the product's import path
// (parse + preview + apply: the service functions the worker runs) against psql's \copy of the
// same rows into a bare table on the same server. Starts its own PostgreSQL on 127.0.0.1:54390.

import { execFileSync } from 'node:child_process';
import { chmodSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureDebianPackages } from '../scripts/lib/debian';
import { pgBin, startPostgres } from '../scripts/lib/postgres';
import { prng } from '../scripts/lib/prng';
import { LINE_CSV_COLUMNS } from '../shared/schemas/register-columns';

const ROWS = Number(process.env.BENCH_ROWS ?? 100_000);
const PORT = Number(process.env.BENCH_PG_PORT ?? 54390);
const PSQL = path.join(pgBin(), 'psql');
const HEADER = LINE_CSV_COLUMNS.join(',');


function benchFile(rows: number, changedEvery = 0): string {
  const rnd = prng(20261203);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)]!;
  const out = [HEADER];
  for (let i = 0; i < rows; i++) {
    const material = pick(['PVC', 'CPVC', 'ABS'] as const);
    const temp = Math.round(40 + rnd() * ({ PVC: 100, CPVC: 160, ABS: 140 }[material] - 40));
    const psi = Math.round(50 + rnd() * 250) + (changedEvery && i % changedEvery === 0 ? 5 : 0);
    out.push([`BENCH-${String(i).padStart(6, '0')}`, pick(['100 Acid dosing', '200 Caustic & brine', '300 Water treatment']), pick(['Sulphuric acid 93%', 'Brine', 'RO permeate']), material, pick(['40', '80', 'SDR 21']), pick(['1/2', '1-1/4', '2', '4', '8']), psi, temp, `MRW-P&ID-${100 + (i % 400)}-0${i % 9}`, i % 10 === 0 ? 'bench row' : ''].join(','));
  }
  return out.join('\n') + '\n';
}

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
  const file = path.join(tmp, 'bench-lines.csv');
  writeFileSync(file, text);
  console.log(`[bench] ${ROWS.toLocaleString('en-US')} rows, ${(text.length / 1e6).toFixed(1)} MB`);

  const [preview, previewMs] = await time(() => uploadImport(me, { filename: 'bench-lines.csv', buffer: Buffer.from(text) }, { inline: true }));
  const [applied, applyMs] = await time(() => confirmImport(me, preview.id, { inline: true }));
  const productMs = previewMs + applyMs;
  console.log(`[bench] product path, new register: parse + preview ${seconds(previewMs)}, apply ${seconds(applyMs)}, total ${seconds(productMs)} (${JSON.stringify(applied.counts)})`);

  const { readColumns, readRows } = await import('../server/services/line-imports/register-csv');
  const { lineRowChecker } = await import('../server/services/line-imports/register-rows');
  const [, jsMs] = await time(async () => {
    const cols = readColumns(text) as Parameters<typeof lineRowChecker>[0];
    const check = lineRowChecker(cols);
    return readRows(text, cols).map((r) => check(r.cells));
  });
  console.log(`[bench]   of which reading and checking the rows in Node (papaparse + row checks), timed apart: ${seconds(jsMs)}`);

  const changed = benchFile(ROWS, 10);
  const [again, againPreviewMs] = await time(() => uploadImport(me, { filename: 'bench-lines-2.csv', buffer: Buffer.from(changed) }, { inline: true }));
  const [, againApplyMs] = await time(() => confirmImport(me, again.id, { inline: true }));
  console.log(`[bench] product path, same file with 1 row in 10 changed: parse + preview ${seconds(againPreviewMs)}, apply ${seconds(againApplyMs)}, total ${seconds(againPreviewMs + againApplyMs)} (${JSON.stringify(again.counts)})`);

  psql('-c', 'create table bench_bare (line_number text, area text, service text, material text, schedule text, nominal_size text, design_pressure_psi real, design_temperature_f real, drawing text, notes text)');
  psql('-c', 'create table bench_like_lines (like lines including all); alter table bench_like_lines alter nominal_size_in drop not null');
  const copy = (table: string, cols: string) => {
    psql('-c', `truncate ${table}`);
    const start = performance.now();
    psql('-c', `\\copy ${table} (${cols}) from '${file}' with (format csv, header true)`);
    return performance.now() - start;
  };
  const bare = Math.min(...[1, 2, 3].map(() => copy('bench_bare', HEADER)));
  const likeLines = Math.min(...[1, 2, 3].map(() => copy('bench_like_lines', HEADER.replace('drawing', 'drawing_ref'))));
  console.log(`[bench] psql \\copy into a bare table: ${seconds(bare)} (best of 3, psql start-up included)`);
  console.log(`[bench] psql \\copy into a table shaped like lines, with its indexes: ${seconds(likeLines)} (for scale; nominal_size_in left to a default)`);
  console.log(`[bench] product path / bare \\copy = ${(productMs / bare).toFixed(1)}× (goal 2×)`);
  await sequelize.close();
}

main().catch((err) => {
  console.error(`[bench] failed: ${err.stack ?? err}`);
  process.exit(1);
});
