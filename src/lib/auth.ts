import { useSyncExternalStore } from 'react';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiRequestError } from '@/lib/api-client';
import type { Me } from '@shared/schemas/roles';

/** Who is signed in (401: nobody); also asked for at start-up by src/app/first-screen-fetch.ts. */
export const ME_PATH = '/api/me';

export const authQueries = {
  all: () => ['auth'] as const,
  me: () =>
    queryOptions({
      queryKey: [...authQueries.all(), 'me'],
      queryFn: async (): Promise<Me | null> => {
        try {
          return await api.get<Me>(ME_PATH);
        } catch (err) {
          if (err instanceof ApiRequestError && err.status === 401) return null;
          throw err;
        }
      },
      staleTime: 60_000,
    }),
};

export function useMe(): Me {
  const { data } = useQuery(authQueries.me());
  if (!data) throw new Error('useMe outside a signed-in route');
  return data;
}

// Whether this page load has settled who is signed in (signedInPerson in offline-writes.ts: the server's
// answer, or offline the person the tablet saw last). The shell draws at once, before that answer: until
// then it names nobody and offers no action, so a stored answer from an earlier load (a fitter who has
// since signed out) is never shown as the person signed in now.
let checked = false;
const checkedListeners = new Set<() => void>();
const subscribeChecked = (onChange: () => void) => {
  checkedListeners.add(onChange);
  return () => void checkedListeners.delete(onChange);
};

/** Called by signedInPerson with its answer, which it hands back. */
export function personChecked(me: Me | null): Me | null {
  if (!checked) {
    checked = true;
    for (const listener of checkedListeners) listener();
  }
  return me;
}

/** The signed-in person once this load has checked who it is; undefined until then (and null when nobody is). */
export function useCheckedPerson(): Me | null | undefined {
  const isChecked = useSyncExternalStore(subscribeChecked, () => checked);
  const { data } = useQuery(authQueries.me());
  return isChecked ? data : undefined;
}

export async function signOut(): Promise<void> {
  const { redirectTo } = await api.post<{ redirectTo: string }>('/auth/logout');
  window.location.assign(redirectTo);
}
