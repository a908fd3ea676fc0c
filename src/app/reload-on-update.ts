import { appRouter } from '@/app/router';

/**
 * A new build's service worker has taken over. The page is not reloaded under the fitter's hands (a
 * hold counting down, a step half filled in, photos taken but not recorded): the next move to
 * another page loads it from the new build instead. Queued writes are in IndexedDB either way.
 */
export function reloadOnNextPage(): void {
  appRouter().subscribe((state) => {
    const to = state.navigation.location;
    if (to) window.location.assign(to.pathname + to.search + to.hash);
  });
}
