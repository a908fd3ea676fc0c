import type { ApiError } from '@shared/schemas/errors';

/** The one failure every request turns into: the server's `{ error: { code, message, details } }`. */
export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: Record<string, string[]>,
  ) {
    super(message);
  }
}

async function send(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Response> {
  const isForm = body instanceof FormData;
  try {
    return await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: body === undefined || isForm ? headers : { ...headers, 'content-type': 'application/json' },
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiRequestError(0, 'network', 'The server cannot be reached. Check the network and try again.');
  }
}

/** Any answer that is not 2xx becomes the one error, with the server's words when it sent them. */
async function refusal(res: Response): Promise<ApiRequestError> {
  const text = await res.text().catch(() => '');
  const data = text && res.headers.get('content-type')?.includes('json') ? (JSON.parse(text) as ApiError) : null;
  const err = data?.error;
  return new ApiRequestError(res.status, err?.code ?? 'http_' + res.status, err?.message ?? `The server answered ${res.status}.`, err?.details);
}

/**
 * GETs started at start-up, before the app's code has run (src/app/first-screen-fetch.ts): each is
 * handed to the first GET of the same path, once, if that comes within a few seconds; later GETs fetch anew.
 */
const early = new Map<string, { at: number; response: Promise<Response> }>();
const EARLY_KEPT_MS = 10_000;

export function fetchEarly(path: string): void {
  if (early.has(path)) return;
  const response = send('GET', path);
  response.catch(() => undefined); // the GET that takes it reports the failure
  early.set(path, { at: Date.now(), response });
}

function takeEarly(path: string): Promise<Response> | undefined {
  const started = early.get(path);
  early.delete(path);
  return started && Date.now() - started.at < EARLY_KEPT_MS ? started.response : undefined;
}

async function request<T>(method: string, path: string, body?: unknown, headers?: Record<string, string>): Promise<T> {
  const res = await ((method === 'GET' && takeEarly(path)) || send(method, path, body, headers));
  if (!res.ok) throw await refusal(res);
  const text = await res.text();
  return (text && res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : null) as T;
}

/** A file the server sends (an export): its bytes and the name the server gave it. */
async function download(path: string): Promise<{ blob: Blob; filename: string | null }> {
  const res = await send('GET', path);
  if (!res.ok) throw await refusal(res);
  const disposition = res.headers.get('content-disposition') ?? '';
  const filename = /filename="?([^";]+)"?/.exec(disposition)?.[1] ?? null;
  return { blob: await res.blob(), filename };
}

export const api = {
  get: <T>(path: string) => request<T>('GET', path),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {}),
  put: <T>(path: string, body?: unknown) => request<T>('PUT', path, body ?? {}),
  patch: <T>(path: string, body?: unknown) => request<T>('PATCH', path, body ?? {}),
  delete: <T>(path: string) => request<T>('DELETE', path),
  upload: <T>(path: string, form: FormData) => request<T>('POST', path, form),
  download,
};

/**
 * A POST the server may receive twice (a write from the shift tablet replayed after the network
 * came back): the key lets it answer a replay with the first result. `body` is JSON, or FormData.
 */
export const sendWithKey = <T>(path: string, body: unknown, idempotencyKey: string) =>
  request<T>('POST', path, body, { 'Idempotency-Key': idempotencyKey });

/** Hands a fetched file to the browser as a download. */
export function saveFile(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Builds a query string from defined values; an array's values become one repeated parameter each (`?a=1&a=2`). */
export function toSearch(params: Record<string, unknown>): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) {
    if (v === undefined || v === null || v === '') continue;
    if (Array.isArray(v)) for (const item of v) q.append(k, String(item));
    else q.set(k, String(v));
  }
  const s = q.toString();
  return s ? `?${s}` : '';
}
