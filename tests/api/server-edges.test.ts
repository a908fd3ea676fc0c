import { existsSync, readdirSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { config } from '@server/config';
import { sequelize } from '@server/db/sequelize';
import { SIGN_IN_PENDING_MS } from '@server/routes/auth-routes';
import { apiErrorSchema } from '@shared/schemas/errors';
import { useTestApp } from '../helpers/app';
import { APP, Browserless } from '../helpers/browserless';
import { makeLines, uniquePrefix } from '../helpers/line-rows';
import { TEST_PORTS } from '../helpers/ports';

const users = useTestApp({ signIn: ['planner', 'fitter', 'admin'] });

/** A request exactly as written, bytes and all, with the person's session and the app's origin. */
function raw(opts: { method: string; path: string; as?: Browserless; headers?: Record<string, string>; body?: Buffer | string }) {
  return new Promise<{ status: number; headers: Record<string, string | string[] | undefined>; body: any }>((resolve, reject) => {
    const sid = opts.as?.cookie('lw.sid');
    const req = httpRequest(
      { host: '127.0.0.1', port: TEST_PORTS.app, method: opts.method, path: opts.path, headers: { origin: APP, ...(sid ? { cookie: `lw.sid=${sid}` } : {}), ...opts.headers } },
      (res) => {
        let text = '';
        res.setEncoding('utf8').on('data', (c) => (text += c)).on('end', () => {
          resolve({ status: res.statusCode!, headers: res.headers, body: res.headers['content-type']?.includes('json') ? JSON.parse(text) : text });
        });
      },
    );
    req.on('error', reject);
    if (opts.body !== undefined) req.write(opts.body);
    req.end();
  });
}

const expectClientError = (res: { status: number; body: unknown }, status: number) => {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(apiErrorSchema.strict().parse(res.body).error.message.length).toBeGreaterThan(10);
};

describe('a client’s mistake answers 4xx in the one error shape, never 500', () => {
  it('a bad % escape in the address, signed in and signed out', async () => {
    expectClientError(await raw({ method: 'GET', path: '/api/lines/%', as: users.planner }), 400);
    expectClientError(await raw({ method: 'GET', path: '/api/lines/%E0%A4%A', as: users.planner }), 400);
    expect((await raw({ method: 'GET', path: '/api/lines/%' })).status).toBe(401);
  });

  it('a multipart upload cut short, and one without a boundary', async () => {
    const boundary = 'lw-cut-short';
    const cut = `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\nContent-Type: text/csv\r\n\r\nline_number,area\r\n100-A`;
    const headers = { 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(Buffer.byteLength(cut)) };
    expectClientError(await raw({ method: 'POST', path: '/api/line-imports', as: users.planner, headers, body: cut }), 400);
    const noBoundary = { 'content-type': 'multipart/form-data', 'content-length': '5' };
    expectClientError(await raw({ method: 'POST', path: '/api/line-imports', as: users.planner, headers: noBoundary, body: 'hello' }), 400);
  });

  it('a body in an encoding or charset the server does not read', async () => {
    const body = JSON.stringify({ cureScheduleId: 'A', testCap: 'rating' });
    const res = await raw({ method: 'PUT', path: '/api/plant-settings', as: users.admin, headers: { 'content-type': 'application/json', 'content-encoding': 'compress-9000' }, body });
    expectClientError(res, 415);
    expect(res.body.error.message).toContain('compress-9000');
    const charset = await raw({ method: 'PUT', path: '/api/plant-settings', as: users.admin, headers: { 'content-type': 'application/json; charset=klingon-8' }, body });
    expectClientError(charset, 415);
    const broken = await raw({ method: 'PUT', path: '/api/plant-settings', as: users.admin, headers: { 'content-type': 'application/json', 'content-encoding': 'gzip' }, body: gzipSync(body).subarray(0, 12) });
    expectClientError(broken, 400);
  });
});

describe('a body is read only after the origin, sign-in and permission checks', () => {
  it('an anonymous client’s malformed JSON is refused for the missing sign-in, unread', async () => {
    const res = await raw({ method: 'POST', path: '/api/calc/joint', headers: { 'content-type': 'application/json' }, body: '{"not json' });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('a pipefitter’s body to the plant settings is refused for the role, unread; an admin’s is read', async () => {
    const bad = { 'content-type': 'application/json' };
    expect((await raw({ method: 'PUT', path: '/api/plant-settings', as: users.fitter, headers: bad, body: '{"not json' })).status).toBe(403);
    const admin = await raw({ method: 'PUT', path: '/api/plant-settings', as: users.admin, headers: bad, body: '{"not json' });
    expectClientError(admin, 400);
    expect(admin.body.error.message).toBe('The request body is not valid JSON.');
  });
});

describe('sign-in is rate limited per client address', () => {
  const address = () => `192.0.2.${Math.floor(Math.random() * 250) + 1}`;

  it('the fourth start within a minute from one address answers 429 with Retry-After; another address is not held up', async () => {
    const app = createApp({ signInLimit: { perMinute: 3, redisUrl: config.redisUrl } });
    expect(await app.locals.signInLimitConnected).toBe(true); // counted in Redis from the first request
    const from = address();
    for (let i = 0; i < 3; i++) expect((await request(app).get('/auth/login').set('X-Forwarded-For', from)).status).toBe(302);
    const refused = await request(app).get('/auth/login').set('X-Forwarded-For', from);
    expect(refused.status).toBe(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(refused.body.error).toMatchObject({ code: 'too_many_requests', message: expect.stringContaining('Too many sign-in attempts') });
    expect((await request(app).get('/auth/callback?code=x&state=y').set('X-Forwarded-For', from)).status).toBe(429);
    expect((await request(app).get('/auth/login').set('X-Forwarded-For', `${from}0`.slice(0, 15))).status).toBe(302);
  });

  it('with Redis unreachable, sign-in still starts at once and is still limited, in memory', async () => {
    const app = createApp({ signInLimit: { perMinute: 2, redisUrl: 'redis://127.0.0.1:1' } });
    expect(await app.locals.signInLimitConnected).toBe(false);
    const from = address();
    const started = Date.now();
    expect((await request(app).get('/auth/login').set('X-Forwarded-For', from)).status).toBe(302);
    expect(Date.now() - started).toBeLessThan(3000);
    expect((await request(app).get('/auth/login').set('X-Forwarded-For', from)).status).toBe(302);
    expect((await request(app).get('/auth/login').set('X-Forwarded-For', from)).status).toBe(429);
  });

  it('an unfinished sign-in keeps its session minutes, not the half day a signed-in session gets', async () => {
    const b = new Browserless();
    expect((await b.raw('/auth/login')).status).toBe(302);
    const sid = decodeURIComponent(b.cookie('lw.sid')!).replace(/^s:/, '').split('.')[0];
    const [row] = await sequelize.query<{ expire: Date }>('select expire from user_sessions where sid = $1', { bind: [sid], type: 'SELECT' as never });
    const left = new Date(row!.expire).getTime() - Date.now();
    expect(left).toBeGreaterThan(SIGN_IN_PENDING_MS - 60_000);
    expect(left).toBeLessThanOrEqual(SIGN_IN_PENDING_MS + 5_000);
  });
});

describe('answers that must not be kept', () => {
  it('API answers, errors and the CSV export carry Cache-Control: no-store', async () => {
    for (const p of ['/api/lines', '/api/lines/export.csv', '/api/me', '/api/lines/NO-SUCH-LINE']) {
      expect((await raw({ method: 'GET', path: p, as: users.planner })).headers['cache-control'], p).toBe('no-store');
    }
    expect((await raw({ method: 'GET', path: '/api/lines' })).headers['cache-control']).toBe('no-store');
  });

  it('a missing file under /assets/ is a 404, not the app’s page', async () => {
    if (!existsSync(path.join(config.clientDist, 'index.html'))) throw new Error(`no client build in ${config.clientDist}: run vite build first`);
    const res = await raw({ method: 'GET', path: '/assets/no-such-chunk-1234.js' });
    expectClientError(res, 404);
    expect((await raw({ method: 'GET', path: '/lines' })).status).toBe(200);
  });
});

describe('answers and the client’s files travel compressed', () => {
  const assetWithTwins = () => {
    const dir = path.join(config.clientDist, 'assets');
    if (!existsSync(dir)) throw new Error(`no client build in ${config.clientDist}: run vite build first`);
    const file = readdirSync(dir).find((f) => f.endsWith('.js') && existsSync(path.join(dir, `${f}.br`)) && existsSync(path.join(dir, `${f}.gz`)));
    if (!file) throw new Error('the client build has no pre-compressed scripts');
    return `/assets/${file}`;
  };

  it('a list is sent with brotli to a browser that takes it, gzip to one that takes only gzip, and as is otherwise', async () => {
    await makeLines(uniquePrefix('BR'), Array.from({ length: 50 }, () => ({}))); // a full page whatever else the register holds
    const as = (encoding: string) => users.planner.raw('/api/lines?pageSize=50', { headers: { 'accept-encoding': encoding } });
    const br = await as('gzip, deflate, br');
    expect(br.headers.get('content-encoding')).toBe('br');
    expect((await br.json()).rows).toHaveLength(50);
    expect((await as('gzip')).headers.get('content-encoding')).toBe('gzip');
    expect((await as('identity')).headers.get('content-encoding')).toBeNull();
    // a few hundred bytes are not worth compressing
    expect((await users.planner.raw('/api/me', { headers: { 'accept-encoding': 'br' } })).headers.get('content-encoding')).toBeNull();
  });

  it('a hashed script comes from its pre-compressed twin, brotli first, kept for a year; the page and the service worker are asked for again', async () => {
    const asset = assetWithTwins();
    const br = await fetch(`${APP}${asset}`, { headers: { 'accept-encoding': 'gzip, br' } });
    expect(br.status).toBe(200);
    expect(br.headers.get('content-encoding')).toBe('br');
    expect(br.headers.get('content-type')).toMatch(/javascript/);
    expect(br.headers.get('cache-control')).toContain('max-age=31536000, immutable');
    const gz = await fetch(`${APP}${asset}`, { headers: { 'accept-encoding': 'gzip' } });
    expect(gz.headers.get('content-encoding')).toBe('gzip');
    expect(await gz.text()).toBe(await br.text());
    for (const page of ['/', '/lines', '/sw.js', '/manifest.webmanifest']) {
      const res = await fetch(`${APP}${page}`, { headers: { 'accept-encoding': 'br' } });
      expect(res.status, page).toBe(200);
      expect(res.headers.get('cache-control'), page).toBe('no-cache');
    }
  });
});


describe('security headers: the page as a document, API answers as data', () => {
  it('the page carries the whole set, with a content policy that lets it load its own scripts and images', async () => {
    const page = await fetch(`${APP}/lines`);
    expect(page.status).toBe(200);
    const csp = page.headers.get('content-security-policy') ?? '';
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("img-src 'self' data: blob:");
    expect(csp).toContain("frame-ancestors 'self'");
    expect(page.headers.get('cross-origin-opener-policy')).toBe('same-origin');
    expect(page.headers.get('x-content-type-options')).toBe('nosniff');
    expect(page.headers.get('x-frame-options')).toBe('SAMEORIGIN');
  });

  it('an API answer, signed in or refused, allows no content and no framing, is never sniffed and not embeddable elsewhere', async () => {
    const answers = [await users.planner.raw('/api/me'), await users.planner.raw('/api/lines?pageSize=5'), await fetch(`${APP}/api/lines`)];
    expect(answers.map((r) => r.status)).toEqual([200, 200, 401]);
    for (const res of answers) {
      expect(res.headers.get('content-security-policy')).toBe("default-src 'none';frame-ancestors 'none'");
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
      expect(res.headers.get('x-frame-options')).toBe('DENY');
      expect(res.headers.get('cross-origin-resource-policy')).toBe('same-origin');
      expect(res.headers.get('strict-transport-security')).toContain('max-age=');
      expect(res.headers.get('cache-control')).toBe('no-store');
      // the document-only ones are not sent with data
      expect(res.headers.get('cross-origin-opener-policy')).toBeNull();
      expect(res.headers.get('x-xss-protection')).toBeNull();
    }
  });
});
