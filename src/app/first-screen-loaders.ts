import { onlineManager } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { ensureOrShowRefusal, revalidateOnOtherPagesOnly } from '@/lib/loaders';
import { lineQueries } from '@/features/lines/api';
import { filtersFromSearch } from '@/features/lines/filters';
import { shiftQueries } from '@/features/shift/api';

// The loaders of the pages people land on (the register; a fitter's shift) live in the first bundle,
// not in the page's chunk: their data is asked for at once, beside the sign-in check and the page's
// code, instead of after the chunk has arrived and run (0.5–0.9 s later on a tablet's CPU).

export async function linesLoader({ request }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(lineQueries.list(filtersFromSearch(new URL(request.url).searchParams)));
  return null;
}
export const linesShouldRevalidate = revalidateOnOtherPagesOnly;

/** Offline, the page opens on what the tablet kept; with nothing kept it says so instead of waiting on the loader. */
export const shiftLoader = () => (onlineManager.isOnline() ? ensureOrShowRefusal(shiftQueries.mine()) : null);

/**
 * Called at start-up, before the tablet's stored cache is restored and the router made: when the
 * address is the register, its data and its page's code are asked for at once (the router's loader
 * and lazy import then find them under way). (Only answers the tablet never keeps
 * are fetched this early; the shift waits for the router, so offline it still opens on the kept one.)
 */
export function prefetchFirstScreen(location: Location): void {
  if (location.pathname !== '/lines') return;
  void queryClient.prefetchQuery(lineQueries.list(filtersFromSearch(new URLSearchParams(location.search))));
  void import('@/app/routes/lines').catch(() => undefined); // the router's import reports a failure
}
