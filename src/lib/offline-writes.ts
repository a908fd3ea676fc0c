import { useSyncExternalStore } from 'react';
import { onlineManager, useMutation, useMutationState, type Mutation } from '@tanstack/react-query';
import { ApiRequestError, sendWithKey } from '@/lib/api-client';
import { authQueries, personChecked } from '@/lib/auth';
import { queryClient } from '@/lib/query-client';
import { KEPT_QUERY_ROOTS, TABLET_CACHE_MAX_AGE, TABLET_WRITE_KEY } from '@/lib/tablet-cache';
import type { Me } from '@shared/schemas/roles';

// Writes from the shift tablet that survive a dropped network and a reload (STACK.md): each is a
// mutation under one key whose function is set here at module load (functions are not persisted),
// in one scope so they are sent in the order they were made, each with its own Idempotency-Key so
// the server answers a replay with the first result. Offline, a write pauses; online again, it goes.

export { TABLET_WRITE_KEY };

export interface TabletWrite {
  path: string;
  /** JSON, or for a photo its Blob and step (sent as multipart fields `photo` and `step`). */
  body: unknown | { photo: Blob; step: string };
  idempotencyKey: string;
  /** "J2 · Dry fit": what the waiting list shows. */
  label: string;
  kind: 'json' | 'photo';
  /** Who made it: a write is sent only while they are the one signed in, so it is never recorded under someone else's name. */
  by: { id: string; name: string } | null;
}

/** A write to queue, with a fresh key; the person signed in now is named as its author. */
export function tabletWrite(path: string, body: TabletWrite['body'], label: string, kind: TabletWrite['kind'] = 'json'): TabletWrite {
  const me = queryClient.getQueryData(authQueries.me().queryKey);
  return { path, body, label, kind, idempotencyKey: newIdempotencyKey(), by: me ? { id: me.id, name: me.name } : null };
}

/** randomUUID exists only in a secure context; a tablet on the plant's plain-http address still gets 128 random bits. */
export const newIdempotencyKey = () =>
  typeof crypto.randomUUID === 'function' ? crypto.randomUUID() : Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, '0')).join('');

// v5 assumes online until an event says otherwise: a reload while offline would fire the restored writes and lose them.
if (typeof navigator !== 'undefined') onlineManager.setOnline(navigator.onLine);

/** Whether the tablet believes it is online (the browser's online and offline events). */
export const useOnline = () => useSyncExternalStore((onChange) => onlineManager.subscribe(onChange), () => onlineManager.isOnline());

let personAskedThisLoad = false;
let announceSignedIn: () => void;
/**
 * Resolves once the server has named the person signed in, in this page load. The service worker
 * registers only then: its first precache (a hundred requests) during the sign-in round trip raced
 * the session cookie (each static answer re-sets it while express-session runs before the static
 * files) and sent the person back to sign in.
 */
export const signedInThisLoad = new Promise<void>((resolve) => (announceSignedIn = resolve));

/**
 * Who is signed in. Asked of the server once per page load (a restored cache may still hold the
 * person who signed out), then read from the cache as before. Offline, or when the server cannot be reached, the
 * person this tablet saw last.
 */
export async function signedInPerson(): Promise<Me | null> {
  const options = authQueries.me();
  const offlineAnswer = async () => {
    await tabletCacheRestored; // the register may open before the stored cache is back; the person kept is in it
    const saved = queryClient.getQueryData(options.queryKey);
    if (saved !== undefined) return personChecked(saved);
    throw new ApiRequestError(0, 'network', 'This tablet is offline and has not signed in before. Connect to the network to sign in.');
  };
  if (!onlineManager.isOnline()) return offlineAnswer();
  try {
    const me = personAskedThisLoad ? await queryClient.ensureQueryData(options) : await queryClient.fetchQuery({ ...options, staleTime: 0 });
    personAskedThisLoad = true;
    if (me) announceSignedIn();
    return personChecked(me);
  } catch (err) {
    if (err instanceof ApiRequestError && err.status === 0) return offlineAnswer();
    throw err;
  }
}

async function send(write: TabletWrite): Promise<unknown> {
  const me = await signedInPerson();
  if (!me) throw new ApiRequestError(401, 'unauthenticated', 'Sign in again to send what this tablet holds.');
  if (write.by && write.by.id !== me.id) {
    throw new ApiRequestError(409, 'other_person', `${write.by.name} made this on this tablet; it is sent only while ${write.by.name} is signed in.`);
  }
  if (write.kind === 'json') return sendWithKey(write.path, write.body, write.idempotencyKey);
  const { photo, step } = write.body as { photo: Blob; step: string };
  const form = new FormData();
  form.append('step', step);
  form.append('photo', photo, 'photo.jpg');
  return sendWithKey(write.path, form, write.idempotencyKey);
}

/** The server's answer while the first try of the same key is still being recorded (a replay racing it). */
const WRITE_IN_PROGRESS = 'write_in_progress';

/**
 * Retry while the network or the session is away (the write waits, in order); a few times on a
 * server fault or while the server still records the same key's first try; never on a refusal.
 */
function retryWrite(failures: number, err: unknown): boolean {
  if (!(err instanceof ApiRequestError)) return false;
  if (err.status === 0 || err.status === 401) return true;
  if (err.status >= 500 || err.status === 408 || err.status === 429 || err.code === WRITE_IN_PROGRESS) return failures < 5;
  return false;
}

/** What a write may have changed: the shift, its joints and the orders they belong to (also after a refusal: another tablet may have been first). */
const refreshAfterWrite = () =>
  Promise.all([
    queryClient.invalidateQueries({ queryKey: ['shift'] }),
    queryClient.invalidateQueries({ queryKey: ['joint-task'] }),
    queryClient.invalidateQueries({ queryKey: ['work-orders'] }),
  ]);

queryClient.setMutationDefaults(TABLET_WRITE_KEY, {
  mutationFn: (write: TabletWrite) => send(write),
  scope: { id: 'tablet-writes' },
  retry: retryWrite,
  retryDelay: (failures) => Math.min(30_000, 1000 * 2 ** failures),
  // A refused write stays listed (with the server's words) until the fitter dismisses it or it ages out of the tablet's store.
  gcTime: TABLET_CACHE_MAX_AGE,
  onSettled: refreshAfterWrite,
});
// The answers the tablet keeps must outlive the stored cache's age, or they are dropped before they are saved.
for (const root of KEPT_QUERY_ROOTS) queryClient.setQueryDefaults([root], { gcTime: TABLET_CACHE_MAX_AGE });

let restored: () => void;
/** Resolves once the tablet's stored cache has been read back into the query client (or could not be read). */
export const tabletCacheRestored = new Promise<void>((resolve) => (restored = resolve));
export const tabletCacheUnreadable = () => restored();

/** After the stored cache is restored: send what waited (not awaited: the app opens while they go). */
export function resumeWrites(): void {
  restored();
  void queryClient.resumePausedMutations();
}

/** The mutation for tablet writes. Callbacks run only while this component lives; the refresh after a write always runs. */
export function useTabletWrite<TData = unknown>(options: { onSuccess?: (data: TData, write: TabletWrite) => void; onError?: (err: Error, write: TabletWrite) => void } = {}) {
  const { onSuccess, onError } = options;
  return useMutation<TData, Error, TabletWrite>({
    mutationKey: TABLET_WRITE_KEY,
    onSuccess: onSuccess && ((data, write) => onSuccess(data, write)),
    onError: onError && ((err, write) => onError(err, write)),
  });
}

type WriteMutation = Mutation<unknown, Error, TabletWrite, unknown>;
const writeOf = (m: Mutation<unknown, Error, unknown, unknown>) => m.state.variables as TabletWrite;

/** The writes not yet sent (offline, retrying, or queued behind another). */
export function useWaitingWrites(): { count: number; labels: string[] } {
  const labels = useMutationState({ filters: { mutationKey: TABLET_WRITE_KEY, status: 'pending' }, select: (m) => writeOf(m).label });
  return { count: labels.length, labels };
}

export interface FailedWrite {
  id: number;
  write: TabletWrite;
  message: string;
  /** The server refused it (a 4xx with its reason): sending it again would be refused again. */
  refused: boolean;
}

/** Writes that did not go through, with why; they stay until dismissed. */
export function useFailedWrites(): FailedWrite[] {
  return useMutationState({
    filters: { mutationKey: TABLET_WRITE_KEY, status: 'error' },
    select: (m) => {
      const err = m.state.error;
      const refused = err instanceof ApiRequestError && err.status >= 400 && err.status < 500 && err.code !== 'other_person';
      return { id: m.mutationId, write: writeOf(m), message: err?.message ?? 'Not sent.', refused };
    },
  });
}

/** The waiting and failed writes to one address (a joint's steps, its photos). */
export function useWritesTo(path: string): { waiting: TabletWrite[]; failed: FailedWrite[] } {
  const waiting = useMutationState({
    filters: { mutationKey: TABLET_WRITE_KEY, status: 'pending', predicate: (m) => writeOf(m).path === path },
    select: writeOf,
  });
  const failed = useFailedWrites().filter((f) => f.write.path === path);
  return { waiting, failed };
}

const findWrite = (id: number) => queryClient.getMutationCache().getAll().find((m) => m.mutationId === id) as WriteMutation | undefined;

export function dismissWrite(id: number): void {
  const m = findWrite(id);
  if (m) queryClient.getMutationCache().remove(m);
}

/** Queues a write that failed without the server refusing it (a server fault, another person signed in) again, with its key. */
export function sendAgain(id: number): void {
  const m = findWrite(id);
  if (!m?.state.variables) return;
  const write = m.state.variables;
  queryClient.getMutationCache().remove(m);
  queryClient.getMutationCache().build(queryClient, { mutationKey: TABLET_WRITE_KEY }).execute(write).catch(() => undefined);
}
