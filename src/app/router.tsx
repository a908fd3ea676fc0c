import { createBrowserRouter, redirect, type LoaderFunctionArgs, type ShouldRevalidateFunction } from 'react-router-dom';
import { signedInPerson } from '@/lib/offline-writes';
import { may } from '@shared/permissions';
import { AppShell } from '@/components/layouts/app-shell';
import { RouteError } from '@/components/layouts/route-error';

/** Every page behind sign-in: without a person, go to the sign-in page and come back after (offline: the person this tablet saw last). */
async function requireMe({ request }: LoaderFunctionArgs) {
  const me = await signedInPerson();
  if (!me) {
    const url = new URL(request.url);
    throw redirect(`/sign-in?returnTo=${encodeURIComponent(url.pathname + url.search)}`);
  }
  return null;
}

const page = (load: () => Promise<{ default: React.ComponentType; loader?: (a: LoaderFunctionArgs) => unknown; shouldRevalidate?: ShouldRevalidateFunction }>) => async () => {
  const m = await load();
  return { Component: m.default, loader: m.loader, shouldRevalidate: m.shouldRevalidate };
};

/** A fitter's home is their shift; everyone else starts at the line register (signed out: requireMe sends them to sign in). */
async function home() {
  const me = await signedInPerson();
  return me ? redirect(may(me, 'joints.record') ? '/shift' : '/lines') : null;
}

const routes = () => createBrowserRouter([
  { path: '/sign-in', lazy: page(() => import('@/app/routes/sign-in')), errorElement: <RouteError /> },
  {
    path: '/',
    loader: requireMe,
    element: <AppShell />,
    errorElement: <RouteError />,
    children: [
      {
        // A page that fails to load shows its error inside the shell, with the navigation kept.
        errorElement: <RouteError />,
        children: [
          { index: true, loader: home },
          { path: 'shift', lazy: page(() => import('@/app/routes/shift')) },
          { path: 'joints/:id', lazy: page(() => import('@/app/routes/joint')) },
          { path: 'lines', lazy: page(() => import('@/app/routes/lines')) },
          { path: 'lines/:lineNumber', lazy: page(() => import('@/app/routes/line-detail')) },
          { path: 'work-orders', lazy: page(() => import('@/app/routes/work-orders')) },
          { path: 'work-orders/new', lazy: page(() => import('@/app/routes/work-order-new')) },
          { path: 'work-orders/:id', lazy: page(() => import('@/app/routes/work-order-detail')) },
          { path: 'work-orders/:id/edit', lazy: page(() => import('@/app/routes/work-order-edit')) },
          { path: 'schedule', lazy: page(() => import('@/app/routes/schedule')) },
          { path: 'release', lazy: page(() => import('@/app/routes/release')) },
          { path: 'imports/new', lazy: page(() => import('@/app/routes/import-new')) },
          { path: 'imports/:id', lazy: page(() => import('@/app/routes/import-detail')) },
          { path: 'calculator', lazy: page(() => import('@/app/routes/calculator')) },
          { path: 'admin/people', lazy: page(() => import('@/app/routes/admin-people')) },
          { path: 'admin/plant', lazy: page(() => import('@/app/routes/admin-plant')) },
          { path: '*', lazy: page(() => import('@/app/routes/not-found')) },
        ],
      },
    ],
  },
]);

let router: ReturnType<typeof routes> | undefined;
/** Made on first use (it starts loading the page at once), after the tablet's stored cache is restored. */
export const appRouter = () => (router ??= routes());
