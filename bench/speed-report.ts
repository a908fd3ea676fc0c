// The speed bench's two tables: every target as measured, then each measure of issue 11 with its
// value, its goal and pass/fail. Ratios compare targets measured back to back in the same run.

import type { FirstScreenResult, LoadResult } from './speed-load';

export interface Measured extends LoadResult {
  label: string;
  /** The machine's load average (1, 5, 15 min) right after the measurement. */
  load: string;
  /** p50 with one connection, one request at a time (product targets only). */
  aloneP50?: number | null;
  /** For a route slower than the run: (answers + the requests left in flight) / (run + the time they took to finish). */
  drainedRps?: number;
}

/** "Flat": the search's req/s at every size is at least this share of its req/s at the smallest size. */
export const FLAT = 0.8;

const pad = (s: string, n: number) => s + ' '.repeat(Math.max(0, n - s.length));
function table(rows: string[][], log: (msg: string) => void): void {
  const widths = rows[0]!.map((_, i) => Math.max(...rows.map((r) => r[i]!.length)));
  for (const [i, r] of rows.entries()) {
    log(`| ${r.map((c, j) => pad(c, widths[j]!)).join(' | ')} |`);
    if (i === 0) log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  }
}

/** The issue's goals: five ratios over the bare route (register page, /api/me, order list, release queue, line status), the search against the page and its flatness, the LCP and the bytes. */
const GOALS = 9;

export function verdicts(m: Record<string, Measured>, searchAt: [number, Measured][], fs: FirstScreenResult | undefined, log: (msg: string) => void, searchNewAt: [number, Measured][] = [], fsAfter?: FirstScreenResult): boolean {
  log('');
  log(`every target, ${m.lines ? '' : '(main size not measured) '}50 connections, Accept-Encoding: gzip, deflate, br:`);
  const all = [...Object.values(m), ...searchAt.filter(([, r]) => r !== m.search).map(([, r]) => r), ...searchNewAt.map(([, r]) => r)];
  table([['target', 'req/s', 'p50 ms', 'p95 ms', 'bytes/response', 'non-2xx', 'alone p50 ms', 'load 1/5/15'],
    ...all.map((r) => [r.label, String(r.rps), String(r.p50 ?? '—'), String(r.p95 ?? '—'), String(r.bytes), String(r.non2xx + r.errors), String(r.aloneP50 ?? ''), r.load])], log);

  const rows: [string, string, string, boolean | undefined][] = [];
  // null: not one answer in the one-connection run (JSON carries NaN as null).
  const alone = (p: Measured) => (p.aloneP50 === undefined ? '' : ` (one at a time: ${p.aloneP50 === null ? 'no answer within its run' : `p50 ${p.aloneP50} ms`})`);
  const ratio = (name: string, goal: number, what: string) => {
    const p = m[name], b = m[`${name}Bare`];
    if (!p || !b) return;
    const r = p.rps / b.rps;
    const drained = p.drainedRps === undefined ? '' : `; ≈ ${p.drainedRps} req/s with the answers after the run`;
    rows.push([`${what}: req/s over the bare route`, `${r.toFixed(2)} (${p.rps} vs ${b.rps}${drained})`, `≥ ${goal}`, r >= goal]);
    rows.push([`${what}: p95 at 50 connections`, `${p.p95 === null ? 'no answer within the run' : `${p.p95} ms`}${alone(p)}`, '(reported)', undefined]);
  };
  ratio('lines', 0.3, 'GET /api/lines page 1 of 50');
  if (m.search && m.lines) {
    const r = m.search.rps / m.lines.rps;
    rows.push(['search=HY&material=PVC by pressure: req/s over the unfiltered page', `${r.toFixed(2)} (${m.search.rps} vs ${m.lines.rps}; p95 ${m.search.p95} ms)`, '≥ 0.8', r >= 0.8]);
  }
  if (searchAt.length > 1) {
    const [[, first], ...rest] = searchAt as [[number, Measured], ...[number, Measured][]];
    const worst = Math.min(...rest.map(([, r]) => r.rps / first.rps));
    rows.push([`the same search at ${searchAt.map(([n]) => n.toLocaleString('en-US')).join(' / ')} lines, req/s`, `${searchAt.map(([, r]) => r.rps).join(' / ')} (worst ${worst.toFixed(2)} of the first; one at a time p50 ${searchAt.map(([, r]) => r.aloneP50 ?? '—').join(' / ')} ms)`, `flat: each ≥ ${FLAT} of the first`, worst >= FLAT]);
  }
  if (searchNewAt.length) {
    // Reported beside the goal: the kept answers make a repeated search cost no query, so this is
    // what the trigram index alone gives when every request asks something new.
    rows.push([`a new search term each request (nothing kept), at ${searchNewAt.map(([n]) => n.toLocaleString('en-US')).join(' / ')} lines, req/s`,
      `${searchNewAt.map(([, r]) => r.rps).join(' / ')} (one at a time p50 ${searchNewAt.map(([, r]) => r.aloneP50 ?? '—').join(' / ')} ms)`, '(reported)', undefined]);
  }
  ratio('me', 0.5, 'GET /api/me');
  ratio('workOrders', 0.3, 'GET /api/work-orders (filtered, sorted page 3)');
  ratio('releaseQueue', 0.3, 'GET /api/release-queue');
  ratio('lineStatus', 0.3, 'GET /api/line-status');
  if (fs?.missing) rows.push(['cold /lines at 4× CPU: LCP median, bytes over the wire', `not measured: ${fs.missing}`, '≤ 2.5 s, ≤ 250 KiB', undefined]);
  else if (fs) {
    const ok = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
    const lcp = ok(fs.lcpMs) ? fs.lcpMs : undefined, kib = ok(fs.bytes) ? fs.bytes / 1024 : undefined;
    rows.push(['cold /lines at 4× CPU, before the load runs: largest contentful paint, median', lcp === undefined ? 'not reported by Chromium' : `${(lcp / 1000).toFixed(2)} s`, '≤ 2.5 s', lcp === undefined ? undefined : lcp <= 2500]);
    if (ok(fs.firstRowMs)) rows.push(['cold /lines at 4× CPU: first row, median', `${(fs.firstRowMs / 1000).toFixed(2)} s`, '(reported)', undefined]);
    rows.push(['cold /lines: bytes over the wire', kib === undefined ? '?' : `${kib.toFixed(0)} KiB`, '≤ 250 KiB', kib === undefined ? undefined : kib <= 250]);
  }
  if (fsAfter && !fsAfter.missing && typeof fsAfter.lcpMs === 'number' && Number.isFinite(fsAfter.lcpMs)) {
    rows.push(['the same, measured again after the load runs: LCP median', `${(fsAfter.lcpMs / 1000).toFixed(2)} s${typeof fsAfter.firstRowMs === 'number' ? ` (first row ${(fsAfter.firstRowMs / 1000).toFixed(2)} s)` : ''}`, '(reported)', undefined]);
  }
  log('');
  log('issue 11, each measure against its goal:');
  table([['measure', 'value', 'goal', 'result'], ...rows.map(([a, b, c, ok]) => [a, b, c, ok === undefined ? '' : ok ? 'pass' : 'FAIL'])], log);
  const failed = rows.filter(([, , , ok]) => ok === false).length;
  const judged = rows.filter(([, , , ok]) => ok !== undefined).length;
  // "Every goal met" only when every goal of the issue's table was measured in this run.
  const missing = GOALS - judged;
  log(failed ? `${failed} of ${judged} goals measured not met${missing > 0 ? `; ${missing} not measured` : ''}` : missing > 0 ? `the ${judged} goals measured were met; ${missing} of the ${GOALS} not measured in this run` : 'every goal met');
  return failed === 0 && missing <= 0;
}
