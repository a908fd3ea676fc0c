import type { DehydratedState, Mutation, Query } from '@tanstack/react-query';
import type { PersistedClient, Persister, PersistQueryClientOptions } from '@tanstack/react-query-persist-client';
import { createStore, del, get, set, type UseStore } from 'idb-keyval';
import { ApiRequestError } from '@/lib/api-client';

// What the shift tablet keeps in IndexedDB across a reload or a dead battery: the writes it has not
// sent yet (and the ones the server refused, so the fitter still sees why), and the shift view's and
// the joints' last answers, so the tablet opens them without a network. The client state is stored
// as it is (structured clone), so a photo's Blob survives; only errors are flattened, because a
// structured clone keeps an Error's message but not our status and code.

const WEEK_MS = 7 * 24 * 60 * 60 * 1000;
/** Longer than any shift and weekend: a write queued on Friday is still there on Monday. Every query kept must live as long (`gcTime`). */
export const TABLET_CACHE_MAX_AGE = WEEK_MS;
/** A refused write stays listed this long after it was queued, unless the fitter dismisses it first. */
const REFUSED_KEPT_MS = 3 * 24 * 60 * 60 * 1000;
/** The query keys whose answers are kept: the fitter's shift, their joints, and who is signed in. */
export const KEPT_QUERY_ROOTS = ['shift', 'joint-task', 'auth'] as const;
export const TABLET_WRITE_KEY = ['tablet-write'] as const;

const KEY = 'query-client';
let store: UseStore | undefined;
/** Opened on first use, so merely importing this (a unit test, a server render) touches no IndexedDB. */
const tabletStore = () => (store ??= createStore('linewright-tablet', 'cache'));

interface StoredError {
  status: number;
  code: string;
  message: string;
  details?: Record<string, string[]>;
}

function flatten(err: unknown): StoredError | null {
  if (!err) return null;
  if (err instanceof ApiRequestError) return { status: err.status, code: err.code, message: err.message, details: err.details };
  return { status: 0, code: 'client', message: err instanceof Error ? err.message : String(err) };
}

function revive(err: unknown): ApiRequestError | null {
  if (!err || typeof err !== 'object') return null;
  const e = err as Partial<StoredError>;
  return new ApiRequestError(e.status ?? 0, e.code ?? 'client', e.message ?? 'Not sent.', e.details);
}

type DehydratedMutation = DehydratedState['mutations'][number];

/** For storage: a write still waiting is stored paused, so it is sent again (same key) once restored; errors become plain objects. */
function forStorage(client: PersistedClient): PersistedClient {
  const { queries, mutations } = client.clientState;
  return {
    ...client,
    clientState: {
      queries: queries.map(({ promise: _promise, ...q }) => ({ ...q, state: { ...q.state, error: null, fetchFailureReason: null } })),
      mutations: mutations.map((m) => ({
        ...m,
        state: {
          ...m.state,
          isPaused: m.state.isPaused || m.state.status === 'pending',
          error: flatten(m.state.error) as unknown as Error,
          failureReason: flatten(m.state.failureReason) as unknown as Error,
        },
      })),
    },
  };
}

function fromStorage(client: PersistedClient | undefined): PersistedClient | undefined {
  if (!client) return undefined;
  const keep = (m: DehydratedMutation) => m.state.status !== 'error' || client.timestamp - m.state.submittedAt < REFUSED_KEPT_MS;
  const mutations = client.clientState.mutations.filter(keep).map((m) => ({
    ...m,
    state: { ...m.state, error: revive(m.state.error), failureReason: revive(m.state.failureReason) },
  }));
  return { ...client, clientState: { ...client.clientState, mutations } };
}

/** Changes to the writes are saved at once (a reload right after a tap must not lose it); query answers at most five times a second. */
const writesSignature = (c: PersistedClient) => c.clientState.mutations.map((m) => `${m.state.submittedAt}:${m.state.status}`).join('|');
let waiting: PersistedClient | null = null;
let timer: ReturnType<typeof setTimeout> | undefined;
let savedSignature = '';

async function flush(): Promise<void> {
  clearTimeout(timer);
  timer = undefined;
  const client = waiting;
  waiting = null;
  if (!client) return;
  savedSignature = writesSignature(client);
  await set(KEY, client, tabletStore());
}

// The screen going off or the page going away: save what is waiting now.
if (typeof window !== 'undefined') {
  window.addEventListener('pagehide', () => void flush());
  document.addEventListener('visibilitychange', () => document.visibilityState === 'hidden' && void flush());
}

export const tabletPersister: Persister = {
  persistClient: (client) => {
    waiting = forStorage(client);
    if (writesSignature(waiting) !== savedSignature) return flush();
    timer ??= setTimeout(() => void flush(), 200);
  },
  restoreClient: async () => fromStorage(await get<PersistedClient>(KEY, tabletStore())),
  removeClient: () => del(KEY, tabletStore()),
};

const isTabletWrite = (m: Mutation<unknown, Error, unknown, unknown>) => m.options.mutationKey?.[0] === TABLET_WRITE_KEY[0];
const isKept = (q: Query) => q.state.status === 'success' && (KEPT_QUERY_ROOTS as readonly unknown[]).includes(q.queryKey[0]);

/**
 * No `buster`: a new build must not throw away the writes an older one queued (their function comes
 * from `setMutationDefaults`, not from storage, so the new build sends them).
 */
export const tabletPersistOptions = {
  persister: tabletPersister,
  maxAge: TABLET_CACHE_MAX_AGE,
  dehydrateOptions: {
    shouldDehydrateQuery: isKept,
    shouldDehydrateMutation: (m) => isTabletWrite(m) && (m.state.status === 'pending' || m.state.status === 'error'),
  },
} satisfies Omit<PersistQueryClientOptions, 'queryClient'>;
