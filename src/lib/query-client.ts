import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiRequestError } from '@/lib/api-client';

/** A session that ended (expired, or signed out in another tab) sends the person to sign in again, then back here. */
function onError(err: unknown): void {
  if (!(err instanceof ApiRequestError) || err.status !== 401) return;
  if (window.location.pathname === '/sign-in') return;
  const here = window.location.pathname + window.location.search;
  window.location.assign(`/sign-in?returnTo=${encodeURIComponent(here)}`);
}

export const queryClient = new QueryClient({
  queryCache: new QueryCache({ onError }),
  mutationCache: new MutationCache({ onError }),
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      retry: (count, err) => !(err instanceof ApiRequestError && err.status >= 400 && err.status < 500) && count < 2,
    },
  },
});
