// The first screen as a person on a shop-floor tablet waits for it: a cold `/lines` in Debian's
// Chromium (playwright-core) with the CPU slowed 4× (CDP Emulation.setCPUThrottlingRate), signed in,
// run after run, each in a fresh browser context (empty HTTP cache, no service worker, no IndexedDB).
//
// Each run records, in milliseconds from the start of the navigation:
//   - lcpMs       the largest contentful paint (a buffered PerformanceObserver, read once the page is quiet);
//   - firstRowMs  when the register's first table row is in the page (a MutationObserver installed before any script);
//   - bytes       everything the page fetched over the wire for that screen: CDP Network.loadingFinished
//                 encodedDataLength (compressed body + headers), summed over the page's requests until the
//                 first row is drawn, the LCP is known and the network has been quiet for 500 ms;
//   - swBytes     what the service worker fetches afterwards for its offline precache (the app shell for the
//                 shift tablet), counted apart: it starts only once the person is known, it is not waited for,
//                 and a later visit never fetches it again. `bytes` is the cold first screen; `bytes + swBytes`
//                 is what a first visit costs in all.
//
// As a library (bench/speed-bench.ts):
//   const r = await measureFirstScreen({ baseUrl: 'http://127.0.0.1:6443', cookie: 'lw.sid=s%3A…', runs: 5 });
//   r.lcpMs, r.firstRowMs, r.bytesPerRun, r.swBytesPerRun, r.median.{lcpMs, firstRowMs, bytes, swBytes}
// `cookie` is a session cookie, e.g. forged like bench/work-orders-bench.ts does (a user_sessions row and
// express-session's signature); `forgeSession()` below writes one for a person given by id.
//
// As a script, against the test services (`LW_TEST_PORT_BASE=6300 npx tsx scripts/test.ts --serve`) and a
// client built into CLIENT_DIST (`NODE_ENV=production npx vite build --outDir .tmp/dist-6300 --emptyOutDir`):
//   set -a; . .tmp/test-env-6300.sh; set +a
//   npx tsx bench/first-screen.ts [--runs 5] [--path /lines] [--lines 20165] [--cpu 4] [--cookie 'lw.sid=…']
// It fills the register up to --lines lines through the import service if it holds fewer (the demo plant's
// lines, then seeded bench lines), signs a planner in with a forged session unless --cookie is given, starts
// the app (server/index.ts, on PORT) unless something already answers there, measures, prints the medians
// and stops what it started. The machine's load average is printed beside them: the figures move with it.

import { spawn, type ChildProcess } from 'node:child_process';
import { createHmac, randomUUID } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import type { Browser, CDPSession } from 'playwright-core';
import { launchChromium, VIEWPORTS } from '../tests/helpers/chromium';

export interface FirstScreenOptions {
  /** The app's origin, e.g. http://127.0.0.1:6300 */
  baseUrl: string;
  /** A session cookie, `name=value` (express-session's signed `lw.sid`). */
  cookie: string;
  runs?: number;
  path?: string;
  /** CPU slowdown for the page (CDP Emulation.setCPUThrottlingRate). */
  cpuSlowdown?: number;
  viewport?: { width: number; height: number };
  /** What counts as the first row; the register's by default. */
  rowSelector?: string;
  /** Give up on a run after this long. */
  timeoutMs?: number;
  /** Also wait for the service worker's precache and count its bytes (default true). */
  countServiceWorker?: boolean;
  log?: (msg: string) => void;
}

export interface FirstScreenRun {
  lcpMs: number;
  firstRowMs: number;
  /** The LCP element: tag and the start of its text, to see what the paint was. */
  lcpElement: string;
  /** When the page, its style, script, first paint, /api/me, the register's page and the font arrived (ms). */
  timeline: string;
  bytes: number;
  requests: number;
  swBytes: number;
  swRequests: number;
  /** Bytes by kind (script, stylesheet, font, fetch, document, …) for the first screen. */
  bytesByType: Record<string, number>;
}

export interface FirstScreenResult {
  runs: FirstScreenRun[];
  lcpMs: number[];
  firstRowMs: number[];
  bytesPerRun: number[];
  swBytesPerRun: number[];
  /** The median run's figures; `bytes` is the median first-screen bytes. */
  median: { lcpMs: number; firstRowMs: number; bytes: number; swBytes: number };
  bytes: number;
  loadAverage: number[];
}

export const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length === 0 ? NaN : s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};

/** Installed before any of the page's scripts: when the first row is in the page, and every LCP entry. */
const PAGE_PROBE = (rowSelector: string) => `
  (() => {
    const w = window;
    w.__firstRowMs = null;
    w.__lcp = null;
    let seen;
    w.__firstRow = new Promise((resolve) => (seen = resolve));
    const check = () => {
      if (w.__firstRowMs === null && document.querySelector(${JSON.stringify(rowSelector)})) {
        w.__firstRowMs = performance.now();
        mo.disconnect();
        seen(w.__firstRowMs);
      }
    };
    const mo = new MutationObserver(check);
    mo.observe(document, { childList: true, subtree: true });
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) {
        const el = e.element;
        w.__lcp = { ms: e.startTime, element: el ? el.tagName.toLowerCase() + ' ' + (el.textContent || '').trim().slice(0, 40) : '(removed)' };
      }
    }).observe({ type: 'largest-contentful-paint', buffered: true });
  })();
`;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function oneRun(browser: Browser, o: Required<Omit<FirstScreenOptions, 'log'>>, trace?: string): Promise<FirstScreenRun> {
  const url = new URL(o.path, o.baseUrl);
  const eq = o.cookie.indexOf('=');
  const context = await browser.newContext({ viewport: o.viewport });
  await context.addCookies([{ name: o.cookie.slice(0, eq), value: o.cookie.slice(eq + 1), url: url.origin }]);
  try {
    // The service worker's own fetches (its precache) are not the page's: counted apart.
    let swBytes = 0;
    let swRequests = 0;
    let lastSwAt = 0;
    context.on('requestfinished', (req) => {
      if (!req.serviceWorker()) return;
      void req.sizes().then((s) => {
        swBytes += s.responseBodySize + s.responseHeadersSize;
        swRequests++;
        lastSwAt = Date.now();
      }, () => undefined);
    });

    const page = await context.newPage();
    // BENCH_FIRST_SCREEN_TRACE=<dir>: a Chromium performance trace of each measured run (open it in the DevTools' Performance panel).
    if (trace && !process.env.BENCH_FIRST_SCREEN_JS_PROFILE) await browser.startTracing(page, { path: trace, screenshots: false, categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'v8.execute', 'blink.user_timing', 'loading'] });
    await page.addInitScript(PAGE_PROBE(o.rowSelector));
    const cdp: CDPSession = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    // BENCH_FIRST_SCREEN_JS_PROFILE=<dir>: a V8 CPU profile of the page's scripts per measured run (beside a trace, when both are asked).
    const jsProfile = trace && process.env.BENCH_FIRST_SCREEN_JS_PROFILE ? path.join(process.env.BENCH_FIRST_SCREEN_JS_PROFILE, path.basename(trace).replace(/\.json$/, '.cpuprofile')) : undefined;
    if (jsProfile) {
      await cdp.send('Profiler.enable');
      await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
      await cdp.send('Profiler.start');
    }
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: o.cpuSlowdown });

    const types = new Map<string, string>();
    const pending = new Set<string>();
    let lastNetworkAt = Date.now();
    let bytes = 0;
    let requests = 0;
    const bytesByType: Record<string, number> = {};
    cdp.on('Network.requestWillBeSent', (e) => {
      types.set(e.requestId, (e.type ?? 'Other').toLowerCase());
      pending.add(e.requestId);
      lastNetworkAt = Date.now();
    });
    let counting = true;
    cdp.on('Network.loadingFinished', (e) => {
      pending.delete(e.requestId);
      lastNetworkAt = Date.now();
      if (!counting) return;
      const type = types.get(e.requestId) ?? 'other';
      bytes += e.encodedDataLength;
      requests++;
      bytesByType[type] = (bytesByType[type] ?? 0) + e.encodedDataLength;
    });
    cdp.on('Network.loadingFailed', (e) => {
      pending.delete(e.requestId);
      lastNetworkAt = Date.now();
    });

    await page.goto(url.href, { waitUntil: 'commit', timeout: o.timeoutMs });
    if (new URL(page.url()).pathname === '/sign-in') throw new Error('the cookie did not sign in: the page went to /sign-in');
    // One call that waits in the page for the row (no polling: a selector polled every few ms would take the page's main thread).
    const appeared = await page.evaluate(
      (timeoutMs) => Promise.race([(window as unknown as { __firstRow: Promise<number> }).__firstRow, new Promise<null>((r) => setTimeout(() => r(null), timeoutMs))]),
      o.timeoutMs,
    );
    if (appeared === null) throw new Error(`no row matching ${o.rowSelector} within ${o.timeoutMs} ms on ${page.url()}`);
    // The first screen is done when the row has been there for 1.5 s (fonts found only once the text is laid
    // out, a late LCP entry) and the network has been quiet for 500 ms.
    const rowSeenAt = Date.now();
    const deadline = rowSeenAt + o.timeoutMs;
    while ((Date.now() - rowSeenAt < 1500 || pending.size > 0 || Date.now() - lastNetworkAt < 500) && Date.now() < deadline) await sleep(50);
    // The LCP as the browser has it now: a new buffered observer is handed every entry so far in its first callback.
    const probe = await page.evaluate(async () => {
      const w = window as unknown as { __firstRowMs: number; __lcp: { ms: number; element: string } | null };
      const last = await new Promise<PerformanceEntry | undefined>((resolve) => {
        new PerformanceObserver((list) => resolve(list.getEntries().at(-1))).observe({ type: 'largest-contentful-paint', buffered: true });
        setTimeout(() => resolve(undefined), 2000);
      });
      const lcp = last ? { ms: last.startTime, element: w.__lcp && w.__lcp.ms === last.startTime ? w.__lcp.element : '(removed)' } : w.__lcp;
      // When the page's first paint came and its main requests had arrived, to see what the LCP waited for.
      // (No named functions in here: tsx would wrap them in a helper the page does not have.)
      const res = performance.getEntriesByType('resource') as PerformanceResourceTiming[];
      const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming | undefined;
      const times: [string, number | undefined][] = [
        ['html', nav?.responseEnd],
        ['FCP', performance.getEntriesByName('first-contentful-paint')[0]?.startTime],
        ...([['css', /^\/assets\/.*\.css$/], ['js', /^\/assets\/index-.*\.js$/], ['me', /^\/api\/me$/], ['lines', /^\/api\/lines$/], ['font', /\.woff2$/]] as const)
          .map(([name, re]): [string, number | undefined] => [name, res.find((r) => re.test(new URL(r.name).pathname))?.responseEnd]),
      ];
      const timeline = times.map(([name, t]) => `${name} ${t === undefined ? '?' : t.toFixed(0)}`).join(', ');
      return { firstRowMs: w.__firstRowMs, lcp, timeline };
    });
    counting = false;
    if (jsProfile) {
      const { profile } = await cdp.send('Profiler.stop');
      const { mkdirSync, writeFileSync } = await import('node:fs');
      mkdirSync(path.dirname(jsProfile), { recursive: true });
      writeFileSync(jsProfile, JSON.stringify(profile));
    }
    if (trace && !process.env.BENCH_FIRST_SCREEN_JS_PROFILE) await browser.stopTracing();

    if (o.countServiceWorker) {
      // The precache starts once the person is known; wait for the worker to be ready and its fetches to stop.
      const ready = await page.evaluate(() => Promise.race([navigator.serviceWorker?.ready.then(() => true), new Promise<boolean>((r) => setTimeout(() => r(false), 20_000))])).catch(() => false);
      if (ready) while (Date.now() - lastSwAt < 1000 && Date.now() < deadline) await sleep(100);
    }
    return {
      lcpMs: probe.lcp?.ms ?? NaN,
      lcpElement: probe.lcp?.element ?? '(none)',
      firstRowMs: probe.firstRowMs,
      timeline: probe.timeline,
      bytes,
      requests,
      swBytes,
      swRequests,
      bytesByType,
    };
  } finally {
    await context.close();
  }
}

/** Cold first screens, one fresh browser context per run; see the top of this file. */
export async function measureFirstScreen(opts: FirstScreenOptions): Promise<FirstScreenResult> {
  const o = {
    runs: 5, path: '/lines', cpuSlowdown: 4, viewport: VIEWPORTS.tablet, rowSelector: 'main table tbody tr', timeoutMs: 30_000, countServiceWorker: true,
    ...opts,
  };
  const log = opts.log ?? (() => undefined);
  const browser = await launchChromium();
  const runs: FirstScreenRun[] = [];
  try {
    // One untimed run: Chromium's own start-up (and the server's first requests) would otherwise land on run 1.
    await oneRun(browser, { ...o, countServiceWorker: false });
    for (let i = 1; i <= o.runs; i++) {
      const r = await oneRun(browser, o, process.env.BENCH_FIRST_SCREEN_TRACE && path.join(process.env.BENCH_FIRST_SCREEN_TRACE, `run-${i}.json`));
      runs.push(r);
      log(`run ${i}: LCP ${r.lcpMs.toFixed(0)} ms (${r.lcpElement}), first row ${r.firstRowMs.toFixed(0)} ms (${r.timeline}), ${kib(r.bytes)} in ${r.requests} requests; service worker ${kib(r.swBytes)} in ${r.swRequests}`);
    }
  } finally {
    await browser.close();
  }
  const pick = (f: (r: FirstScreenRun) => number) => runs.map(f);
  const result = {
    runs,
    lcpMs: pick((r) => r.lcpMs),
    firstRowMs: pick((r) => r.firstRowMs),
    bytesPerRun: pick((r) => r.bytes),
    swBytesPerRun: pick((r) => r.swBytes),
    loadAverage: os.loadavg(),
  };
  const m = { lcpMs: median(result.lcpMs), firstRowMs: median(result.firstRowMs), bytes: median(result.bytesPerRun), swBytes: median(result.swBytesPerRun) };
  return { ...result, median: m, bytes: m.bytes };
}

export const kib = (b: number) => `${(b / 1024).toFixed(0)} KiB`;

/** express-session's cookie: "s:" + the id + "." + its HMAC-SHA256 in base64 without padding (cookie-signature). */
export const signedSessionCookie = (sid: string, secret: string, name = 'lw.sid') =>
  `${name}=${encodeURIComponent(`s:${sid}.${createHmac('sha256', secret).update(sid).digest('base64').replace(/=+$/, '')}`)}`;

/** A session row for `personId`, written straight into user_sessions; returns its cookie. Import after the environment is set. */
export async function forgeSession(personId: string, secret: string): Promise<string> {
  const { sequelize } = await import('../server/db/sequelize');
  const sid = randomUUID();
  const expires = new Date(Date.now() + 12 * 3_600_000);
  const sess = { cookie: { originalMaxAge: 12 * 3_600_000, expires: expires.toISOString(), secure: false, httpOnly: true, path: '/', sameSite: 'lax' }, personId };
  await sequelize.query('insert into user_sessions (sid, sess, expire) values (:sid, :sess, :expire)', { replacements: { sid, sess: JSON.stringify(sess), expire: expires } });
  return signedSessionCookie(sid, secret);
}

// ---- the script

async function fillRegister(target: number, log: (m: string) => void) {
  const { Line } = await import('../server/db/models/line');
  const { Person } = await import('../server/db/models/person');
  const { uploadImport, confirmImport } = await import('../server/services/line-imports/import-service');
  const { demoPlant, toCsv } = await import('../scripts/demo-plant');
  const { benchFile } = await import('./bench-file');
  const [planner] = await Person.findOrCreate({ where: { issuer: 'bench', subject: 'first-screen-planner' }, defaults: { issuer: 'bench', subject: 'first-screen-planner', name: 'Bench Planner', email: null, rolesFromIdp: ['planner'], lastSignInAt: null } });
  const me = { id: planner.id, name: planner.name, email: null, roles: ['planner' as const] };
  const have = await Line.count();
  if (have < target) {
    log(`the register holds ${have} lines; importing up to ${target}…`);
    const { lines } = demoPlant();
    const demoHere = await Line.count({ where: { lineNumber: lines[0]!.line_number } });
    const files: [string, string][] = demoHere ? [] : [['lines.csv', toCsv(lines)]];
    const rest = target - have - (demoHere ? 0 : lines.length);
    if (rest > 0) files.push(['bench-lines.csv', benchFile(rest)]);
    for (const [filename, csv] of files) {
      const preview = await uploadImport(me, { filename, buffer: Buffer.from(csv) }, { inline: true });
      await confirmImport(me, preview.id, { inline: true });
    }
    log(`the register holds ${await Line.count()} lines`);
  }
  return planner.id;
}

async function answers(baseUrl: string) {
  try {
    await fetch(new URL('/api/health', baseUrl));
    return true;
  } catch {
    return false;
  }
}

async function main() {
  const { values } = parseArgs({
    options: { runs: { type: 'string', default: '5' }, path: { type: 'string', default: '/lines' }, lines: { type: 'string', default: '20165' }, cpu: { type: 'string', default: '4' }, cookie: { type: 'string' }, base: { type: 'string' } },
  });
  const log = (m: string) => console.log(`[first-screen] ${m}`);
  if (!process.env.DATABASE_URL) throw new Error('set the environment first: set -a; . .tmp/test-env-6300.sh; set +a');
  const baseUrl = values.base ?? process.env.APP_ORIGIN ?? `http://127.0.0.1:${process.env.PORT}`;
  const { config } = await import('../server/config');
  const { sequelize } = await import('../server/db/sequelize');
  let app: ChildProcess | undefined;
  try {
    const personId = await fillRegister(Number(values.lines), log);
    const cookie = values.cookie ?? (await forgeSession(personId, config.sessionSecret));
    if (!(await answers(baseUrl))) {
      log(`starting the app on ${baseUrl} (client from ${config.clientDist})`);
      app = spawn(path.join(import.meta.dirname, '..', 'node_modules', '.bin', 'tsx'), ['server/index.ts'], { cwd: path.join(import.meta.dirname, '..'), env: process.env, stdio: 'inherit' });
      for (let i = 0; i < 100 && !(await answers(baseUrl)); i++) await sleep(200);
    }
    const r = await measureFirstScreen({ baseUrl, cookie, runs: Number(values.runs), path: values.path, cpuSlowdown: Number(values.cpu), log });
    const byType = Object.entries(r.runs[0]?.bytesByType ?? {}).map(([t, b]) => `${t} ${kib(b)}`).join(', ');
    log(`${values.path}, CPU ${values.cpu}× slower, ${r.runs.length} cold runs (medians): LCP ${r.median.lcpMs.toFixed(0)} ms, first row ${r.median.firstRowMs.toFixed(0)} ms, ` +
      `${kib(r.median.bytes)} over the wire for the first screen (run 1: ${byType}); the service worker's precache after it ${kib(r.median.swBytes)}`);
    log(`LCP runs: ${r.lcpMs.map((x) => x.toFixed(0)).join(', ')} ms; first row runs: ${r.firstRowMs.map((x) => x.toFixed(0)).join(', ')} ms; load average ${r.loadAverage.map((x) => x.toFixed(2)).join(' ')}`);
  } finally {
    app?.kill('SIGINT');
    await sequelize.close();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  main().then(() => process.exit(0), (err) => { console.error(err); process.exit(1); });
}
