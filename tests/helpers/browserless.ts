import { randomUUID } from 'node:crypto';
import { TEST_PORTS } from './ports';
import { DEMO_PASSWORD } from '../../scripts/demo-accounts';

export const APP = `http://127.0.0.1:${TEST_PORTS.app}`;

/**
 * A minimal browser for API tests: a cookie jar keyed by host (as browsers do, ports share
 * cookies), manual redirects, and the app's Origin on every request.
 */
export class Browserless {
  private jar = new Map<string, string>();

  private cookieHeader(): string {
    return [...this.jar].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  private keep(res: Response): void {
    for (const line of res.headers.getSetCookie()) {
      const [pair, ...attrs] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attrs.some((a) => /max-age=0|expires=thu, 01 jan 1970/i.test(a.trim()));
      if (expired || value === '') this.jar.delete(name);
      else this.jar.set(name, value);
    }
  }

  hasCookie(name: string): boolean {
    return this.jar.has(name);
  }

  cookie(name: string): string | undefined {
    return this.jar.get(name);
  }

  async raw(url: string, init: RequestInit & { origin?: string | null } = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.jar.size) headers.set('cookie', this.cookieHeader());
    const origin = init.origin === undefined ? APP : init.origin;
    if (origin && init.method && init.method !== 'GET') headers.set('origin', origin);
    const res = await fetch(url.startsWith('http') ? url : `${APP}${url}`, { ...init, headers, redirect: 'manual' });
    this.keep(res);
    return res;
  }

  /** Follows redirects like a browser would (POST becomes GET after 302/303). */
  async follow(url: string, init: RequestInit = {}): Promise<Response> {
    let res = await this.raw(url, init);
    let hops = 0;
    while (res.status >= 300 && res.status < 400 && hops++ < 15) {
      const next = new URL(res.headers.get('location')!, res.url || url).href;
      res = await this.raw(next);
    }
    return res;
  }

  async json<T = any>(method: string, path: string, body?: unknown, opts: { origin?: string | null; headers?: Record<string, string> } = {}) {
    const res = await this.raw(path, {
      method,
      origin: opts.origin,
      headers: { ...(body === undefined ? {} : { 'content-type': 'application/json' }), ...opts.headers },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await res.text();
    return { status: res.status, body: (text && res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text) as T, headers: res.headers };
  }

  get = <T = any>(path: string) => this.json<T>('GET', path);
  post = <T = any>(path: string, body?: unknown) => this.json<T>('POST', path, body ?? {});
  put = <T = any>(path: string, body?: unknown) => this.json<T>('PUT', path, body ?? {});
  del = <T = any>(path: string) => this.json<T>('DELETE', path);
  /** A write as the shift tablet sends it: with an Idempotency-Key (a new one unless given). */
  tablet = <T = any>(path: string, body: unknown, key: string = randomUUID()) => this.json<T>('POST', path, body, { headers: { 'Idempotency-Key': key } });

  async upload<T = any>(path: string, filename: string, content: string | Buffer, field = 'file') {
    const form = new FormData();
    form.append(field, new Blob([typeof content === 'string' ? content : new Uint8Array(content)]), filename);
    const res = await this.raw(path, { method: 'POST', body: form });
    const text = await res.text();
    return { status: res.status, body: (text ? JSON.parse(text) : null) as T };
  }

  /** The whole sign-in: app → identity provider → its sign-in page → back to the app's callback. */
  async signIn(username: string, password = DEMO_PASSWORD): Promise<Response> {
    const page = await this.follow('/auth/login');
    const html = await page.text();
    const action = html.match(/action="([^"]+)"/)?.[1];
    if (!action) throw new Error(`no sign-in form (status ${page.status})`);
    const formUrl = new URL(action, page.url).href;
    return this.follow(formUrl, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ username, password }).toString(),
    });
  }
}

export async function signedIn(username: string): Promise<Browserless> {
  const b = new Browserless();
  const res = await b.signIn(username);
  if (!b.hasCookie('lw.sid') || res.status !== 200) throw new Error(`sign-in as ${username} did not complete (status ${res.status})`);
  return b;
}
