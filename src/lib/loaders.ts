import type { DefaultError, EnsureQueryDataOptions, QueryKey } from '@tanstack/react-query';
import type { ShouldRevalidateFunctionArgs } from 'react-router-dom';
import { ApiRequestError } from '@/lib/api-client';
import { queryClient } from '@/lib/query-client';

/**
 * A page's loader: fetches what the page reads, but a refusal (a 4xx: not found, not allowed, not
 * an id) is the server's answer about this request, which the page shows in its own words inside
 * the shell, from its query's error. Anything else (5xx, no network) goes to the route's error page.
 */
export async function ensureOrShowRefusal<TQueryFnData, TError = DefaultError, TData = TQueryFnData, TQueryKey extends QueryKey = QueryKey>(
  options: EnsureQueryDataOptions<TQueryFnData, TError, TData, TQueryKey>,
): Promise<null> {
  try {
    await queryClient.ensureQueryData(options);
  } catch (err) {
    if (!(err instanceof ApiRequestError && err.status >= 400 && err.status < 500)) throw err;
  }
  return null;
}

/**
 * For a list page whose paging, sorting and filtering live in the URL: moving within the page is
 * fetched by the list's own query (which keeps the old page on screen), not by re-running the loader.
 */
export const revalidateOnOtherPagesOnly = ({ currentUrl, nextUrl, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) =>
  currentUrl.pathname === nextUrl.pathname ? false : defaultShouldRevalidate;
