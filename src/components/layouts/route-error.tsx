import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { ApiRequestError } from '@/lib/api-client';

export function RouteError() {
  const err = useRouteError();
  const message =
    err instanceof ApiRequestError ? err.message : isRouteErrorResponse(err) ? `${err.status} ${err.statusText}` : 'Something went wrong while loading this page.';
  return (
    <div role="alert" className="mx-auto mt-16 max-w-lg rounded-xl border border-refuse/30 bg-refuse-light p-6">
      <h1 className="text-lg font-semibold text-refuse">This page could not be shown</h1>
      <p className="mt-2">{message}</p>
      <Link to="/lines" className="mt-4 inline-block font-medium text-tide underline">
        Back to the line register
      </Link>
    </div>
  );
}
