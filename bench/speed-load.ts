// The client side of the speed bench, run as child processes so that neither shares the server's
// event loop. With BENCH_LOAD: autocannon against one URL with the session cookie and a browser's
// Accept-Encoding; every response time and size is kept (p95 exact; bytes as sent, compressed or
// not). With BENCH_FIRST_SCREEN: the client engineer's `measureFirstScreen` from
// bench/first-screen.ts (cold /lines in Chromium at 4× CPU slowdown), looked up at run time so the
// bench still runs, and says so, where that file or function is missing. Each prints one JSON line.

import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

import type { LoadSpec } from './work-orders-load';
export type { LoadSpec };

export interface LoadResult {
  requests: number;
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  /** Mean bytes of a response as sent over the wire (headers included). */
  bytes: number;
  non2xx: number;
  errors: number;
}

export interface FirstScreenSpec {
  baseUrl: string;
  cookie: string;
  runs: number;
  log?: (msg: string) => void;
}

/** What the bench reads of measureFirstScreen's answer; every name it might use is tried. */
export interface FirstScreenResult {
  lcpMs?: number;
  firstRowMs?: number;
  bytes?: number;
  missing?: string;
  raw?: unknown;
}

interface Instance {
  on(event: 'response', fn: (client: unknown, status: number, bytes: number, ms: number) => void): void;
}
type Autocannon = (opts: Record<string, unknown>, done: (err: Error | null, result: { non2xx: number; errors: number; duration: number }) => void) => Instance;
// autocannon ships no types; this is the part of its API the bench uses.
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
const round = (n: number) => Math.round(n * 10) / 10;

export function load(spec: LoadSpec): Promise<LoadResult> {
  const times: number[] = [];
  let bytes = 0;
  return new Promise((resolve, reject) => {
    const headers = { cookie: spec.cookie, accept: 'application/json', 'accept-encoding': 'gzip, deflate, br' };
    // A 30 s timeout: a slow route's answers are counted, not dropped as errors at autocannon's default 10 s.
    // `{n}` in the URL: a new number in each request's place (a search nothing has kept yet).
    let n = 100;
    const u = new URL(spec.url);
    const requests = spec.url.includes('%7Bn%7D') || spec.url.includes('{n}')
      ? [{ setupRequest: (req: Record<string, unknown>) => ({ ...req, path: `${u.pathname}${u.search}`.replace(/\{n\}|%7Bn%7D/, String(n++)) }) }]
      : undefined;
    const instance = autocannon({ url: spec.url, connections: spec.connections, duration: spec.seconds, timeout: 30, headers, requests }, (err, result) => {
      if (err) return reject(err);
      times.sort((a, b) => a - b);
      resolve({
        requests: times.length, rps: Math.round(times.length / result.duration),
        p50: round(percentile(times, 50)), p95: round(percentile(times, 95)), p99: round(percentile(times, 99)),
        bytes: Math.round(bytes / Math.max(1, times.length)), non2xx: result.non2xx, errors: result.errors,
      });
    });
    instance.on('response', (_client, _status, size, ms) => {
      times.push(ms);
      bytes += size;
    });
  });
}

type Measure = (opts: FirstScreenSpec) => Promise<unknown>;
const num = (o: Record<string, unknown>, ...names: string[]) => names.map((n) => o[n]).find((v): v is number => typeof v === 'number' && Number.isFinite(v)); // NaN: not seen (Chromium reported no LCP)

/** Calls bench/first-screen.ts's measureFirstScreen when it is there; its answer's shape is read loosely. */
export async function firstScreen(spec: FirstScreenSpec): Promise<FirstScreenResult> {
  const file = path.join(import.meta.dirname, 'first-screen.ts');
  if (!existsSync(file)) return { missing: 'bench/first-screen.ts is not there' };
  const mod = (await import(pathToFileURL(file).href)) as { measureFirstScreen?: Measure };
  if (typeof mod.measureFirstScreen !== 'function') return { missing: 'bench/first-screen.ts exports no measureFirstScreen' };
  const raw = await mod.measureFirstScreen({ ...spec, log: (msg: string) => console.error(`[bench]   first screen ${msg}`) });
  const r = (raw ?? {}) as Record<string, unknown>;
  const median = (typeof r.median === 'object' && r.median ? r.median : r) as Record<string, unknown>;
  return {
    lcpMs: num(median, 'lcpMs', 'lcpMedianMs', 'medianLcpMs', 'lcp'),
    firstRowMs: num(median, 'firstRowMs', 'firstRowMedianMs', 'medianFirstRowMs', 'firstRow'),
    bytes: num(median, 'bytes', 'transferBytes', 'bytesOverWire', 'wireBytes', 'transferredBytes'),
    raw,
  };
}

if (process.env.BENCH_LOAD) {
  load(JSON.parse(process.env.BENCH_LOAD) as LoadSpec).then((r) => console.log(JSON.stringify(r)), (err) => (console.error(err), process.exit(1)));
} else if (process.env.BENCH_FIRST_SCREEN) {
  firstScreen(JSON.parse(process.env.BENCH_FIRST_SCREEN) as FirstScreenSpec).then(
    (r) => (console.log(JSON.stringify(r)), process.exit(0)),
    (err) => (console.error(err), process.exit(1)),
  );
}
