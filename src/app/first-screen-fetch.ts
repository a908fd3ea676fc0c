import { fetchEarly } from '@/lib/api-client';
import { ME_PATH } from '@/lib/auth';
import { filtersFromSearch, lineListPath } from '@/features/lines/filters';

// The first import of src/main.tsx, so it runs before the rest of the app's code (React, the router,
// the query client) has started up, a few hundred ms on a tablet's CPU: who is signed in and, on the
// register, its first page are asked for at once. The query functions then take these answers
// (api-client's fetchEarly) instead of asking again. It imports nothing heavy, so it runs first.

if (window.location.pathname !== '/sign-in') {
  fetchEarly(ME_PATH);
  if (window.location.pathname === '/lines') {
    fetchEarly(lineListPath(filtersFromSearch(new URLSearchParams(window.location.search))));
  }
}
