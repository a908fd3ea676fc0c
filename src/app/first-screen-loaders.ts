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

/**
 * The register is asked for here but not waited on: its page (heading, search, filters) draws as soon
 * as the sign-in check has answered, and the table fills in when the register answers (the page shows
 * its own loading line, and a failure in its own words). Waiting held the whole first screen on the
 * slowest request of the load.
 */
export function linesLoader({ request }: LoaderFunctionArgs) {
  void queryClient.prefetchQuery(lineQueries.list(filtersFromSearch(new URL(request.url).searchParams)));
  return null;
}
export const linesShouldRevalidate = revalidateOnOtherPagesOnly;

/** Offline, the page opens on what the tablet kept; with nothing kept it says so instead of waiting on the loader. */
export const shiftLoader = () => (onlineManager.isOnline() ? ensureOrShowRefusal(shiftQueries.mine()) : null);

/**
 * Called at start-up, before the tablet's stored cache is restored and the router made: when the
 * address is the register, its query starts at once, taking the answer first-screen-fetch.ts asked
 * for (the router's loader then finds it under way; the page's code is asked for there too). (Only
 * answers the tablet never keeps are fetched this early; the shift waits for the router, so offline
 * it still opens on the kept one.)
 */
export function prefetchFirstScreen(location: Location): void {
  if (location.pathname !== '/lines') return;
  void queryClient.prefetchQuery(lineQueries.list(filtersFromSearch(new URLSearchParams(location.search))));
}
