// The load side of the work-order bench, run as a child process so the client does not share the
// server's event loop: autocannon at `connections` for `seconds` against one URL, with the session
// cookie. Every response time is kept, so p95 is exact (autocannon's own summary stops at p90 and
// p97.5). Prints one JSON line: requests per second, latency percentiles, errors and non-2xx.

import { createRequire } from 'node:module';

export interface LoadSpec {
  url: string;
  cookie: string;
  connections: number;
  seconds: number;
}

export interface LoadResult {
  requests: number;
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
  non2xx: number;
  errors: number;
}

interface Instance {
  on(event: 'response', fn: (client: unknown, status: number, bytes: number, ms: number) => void): void;
}
type Autocannon = (opts: Record<string, unknown>, done: (err: Error | null, result: { non2xx: number; errors: number; duration: number }) => void) => Instance;
// autocannon ships no types; this is the part of its API the bench uses.
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;

export function load(spec: LoadSpec): Promise<LoadResult> {
  const times: number[] = [];
  return new Promise((resolve, reject) => {
    const instance = autocannon(
      { url: spec.url, connections: spec.connections, duration: spec.seconds, headers: { cookie: spec.cookie, accept: 'application/json' } },
      (err, result) => {
        if (err) return reject(err);
        times.sort((a, b) => a - b);
        const round = (n: number) => Math.round(n * 10) / 10;
        resolve({
          requests: times.length,
          rps: Math.round(times.length / result.duration),
          p50: round(percentile(times, 50)),
          p95: round(percentile(times, 95)),
          p99: round(percentile(times, 99)),
          max: round(times[times.length - 1] ?? NaN),
          non2xx: result.non2xx,
          errors: result.errors,
        });
      },
    );
    instance.on('response', (_client, _status, _bytes, ms) => times.push(ms));
  });
}

if (process.env.BENCH_LOAD) {
  load(JSON.parse(process.env.BENCH_LOAD) as LoadSpec).then(
    (r) => console.log(JSON.stringify(r)),
    (err) => (console.error(err), process.exit(1)),
  );
}
