import { createBrowserRouter, redirect, type LoaderFunction, type ShouldRevalidateFunction } from 'react-router-dom';
import { signedInPerson } from '@/lib/offline-writes';
import { may } from '@shared/permissions';
import { AppShell } from '@/components/layouts/app-shell';
import { RouteError } from '@/components/layouts/route-error';
import { linesLoader, linesShouldRevalidate, shiftLoader } from '@/app/first-screen-loaders';
// The register's page is in the first bundle, not a chunk of its own: it is where planners land. As a
// chunk, its code and then its six small imports were found one after the other behind the shell's
// first render: 0.3–0.4 s of a tablet's first screen.
import LinesPage from '@/app/routes/lines';

const toSignIn = (request: Request) => {
  const url = new URL(request.url);
  return redirect(`/sign-in?returnTo=${encodeURIComponent(url.pathname + url.search)}`);
};

/**
 * Every page behind sign-in: its data is asked for beside the sign-in check, not after it (the API
 * refuses it anyway without a session), and without a person the visitor goes to the sign-in page
 * and comes back after (offline: the person this tablet saw last).
 */
const signedIn = (load?: LoaderFunction): LoaderFunction => async (args) => {
  const [me, data] = await Promise.allSettled([signedInPerson(), load ? load(args) : null]);
  if (me.status === 'rejected') throw me.reason;
  if (!me.value) throw toSignIn(args.request);
  if (data.status === 'rejected') throw data.reason;
  return data.value;
};

type PageModule = { default: React.ComponentType; loader?: LoaderFunction; shouldRevalidate?: ShouldRevalidateFunction };
/** A page's code, loaded when first opened; its loader (if any) is wrapped in the sign-in check. */
const page = (load: () => Promise<PageModule>) => async () => {
  const m = await load();
  return { Component: m.default, loader: signedIn(m.loader), ...(m.shouldRevalidate && { shouldRevalidate: m.shouldRevalidate }) };
};
/** The sign-in page: open to everyone. */
const publicPage = (load: () => Promise<PageModule>) => async () => {
  const m = await load();
  return { Component: m.default, ...(m.loader && { loader: m.loader }), ...(m.shouldRevalidate && { shouldRevalidate: m.shouldRevalidate }) };
};
/** A page whose loader is in the first bundle (see first-screen-loaders.ts): only its component comes lazily. */
const pageWithLoader = (load: () => Promise<PageModule>) => async () => ({ Component: (await load()).default });

/** A fitter's home is their shift; everyone else starts at the line register (signed out: signedIn sends them to sign in). */
async function home() {
  const me = await signedInPerson();
  return me ? redirect(may(me, 'joints.record') ? '/shift' : '/lines') : null;
}

/** While the first page's code and data load, the shell is drawn and its page area waits empty. */
function PageLoading() {
  return <p role="status" className="sr-only">Loading the page…</p>;
}

// The shell route has no loader, so it draws at once (the person's name fills in when /api/me answers);
// each page's loader checks the sign-in beside fetching its data.
const routes = () => createBrowserRouter([
  { path: '/sign-in', lazy: publicPage(() => import('@/app/routes/sign-in')), errorElement: <RouteError /> },
  {
    path: '/',
    element: <AppShell />,
    errorElement: <RouteError />,
    children: [
      {
        // A page that fails to load shows its error inside the shell, with the navigation kept.
        errorElement: <RouteError />,
        HydrateFallback: PageLoading,
        children: [
          { index: true, loader: signedIn(home) },
          { path: 'shift', loader: signedIn(shiftLoader), lazy: pageWithLoader(() => import('@/app/routes/shift')) },
          { path: 'joints/:id', lazy: page(() => import('@/app/routes/joint')) },
          { path: 'lines', loader: signedIn(linesLoader), shouldRevalidate: linesShouldRevalidate, Component: LinesPage },
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
let shown: () => void;
/** Resolves once the first page is on screen (or its error is) and the browser has a moment to spare. */
export const firstPageShown = new Promise<void>((resolve) => (shown = resolve));
const whenIdle = (fn: () => void) => (typeof requestIdleCallback === 'function' ? requestIdleCallback(fn, { timeout: 3000 }) : setTimeout(fn, 500));

/** Made on first use (it starts loading the page at once), after the tablet's stored cache is restored. */
export const appRouter = () => {
  if (!router) {
    const made = (router = routes());
    if (made.state.initialized) whenIdle(shown);
    else {
      const stop = made.subscribe((state) => {
        if (!state.initialized) return;
        stop();
        whenIdle(shown);
      });
    }
  }
  return router;
};
