import path from 'node:path';
import { existsSync } from 'node:fs';
import compression from 'compression';
import express from 'express';
import expressStaticGzip from 'express-static-gzip';
import helmet from 'helmet';
import { config } from '@server/config';
import { errorHandler, notFound } from '@server/middleware/error-handler';
import { COMPRESS_THRESHOLD } from '@server/middleware/kept-answer';
import { sameOrigin } from '@server/middleware/same-origin';
import { limitPerAddress } from '@server/middleware/rate-limit';
import { requireSignIn } from '@server/middleware/auth';
import { sessions } from '@server/middleware/session';
import { authRoutes } from '@server/routes/auth-routes';
import { meRoutes } from '@server/routes/me-routes';
import { peopleRoutes } from '@server/routes/people-routes';
import { lineRoutes } from '@server/routes/line-routes';
import { lineImportRoutes } from '@server/routes/line-import-routes';
import { calcRoutes } from '@server/routes/calc-routes';
import { plantSettingsRoutes } from '@server/routes/plant-settings-routes';
import { healthRoutes } from '@server/routes/health-routes';
import { openApiRoutes } from '@server/routes/openapi-routes';
import { workOrderRoutes } from '@server/routes/work-order-routes';
import { jointTaskRoutes } from '@server/routes/joint-task-routes';
import { scheduleRoutes } from '@server/routes/schedule-routes';
import { fitterRoutes } from '@server/routes/fitter-routes';
import { lockRoutes, orderLockoutRoutes } from '@server/routes/lockout-routes';
import { shiftRoutes } from '@server/routes/shift-routes';
import { photoRoutes } from '@server/routes/photo-routes';
import { holdRoutes, orderTemperatureLogRoutes, temperatureLogRoutes } from '@server/routes/hold-routes';
import { orderRecordRoutes } from '@server/routes/record-routes';
import { lineStatusRoutes, orderReleaseRoutes, releaseQueueRoutes } from '@server/routes/release-routes';

export interface AppOptions {
  /** Sign-in starts and callbacks per client address and minute, and the Redis that counts them (tests change them). */
  signInLimit?: { perMinute: number; redisUrl: string };
}

/** Answers are about one person at one moment: no browser or proxy may keep them. */
const noStore: express.RequestHandler = (_req, res, next) => {
  res.set('Cache-Control', 'no-store');
  next();
};

/** The page, the client's files and the sign-in redirects: documents, with helmet's whole set. */
const documentHeaders = helmet({ contentSecurityPolicy: { directives: { 'img-src': ["'self'", 'data:', 'blob:'], 'upgrade-insecure-requests': null } } });
/**
 * API answers are data for the app's own scripts, never a page: the set OWASP's REST Security Cheat
 * Sheet gives for them — no content and no framing if one is ever opened as a page, nosniff, HSTS,
 * no other origin may embed it, no referrer. The document-only headers (the opener and origin-agent
 * policies, the old IE and Flash ones, DNS prefetch) are left off: about 400 bytes on every answer.
 */
const apiHeaders = helmet({
  contentSecurityPolicy: { useDefaults: false, directives: { 'default-src': ["'none'"], 'frame-ancestors': ["'none'"] } },
  frameguard: { action: 'deny' },
  crossOriginOpenerPolicy: false,
  originAgentCluster: false,
  xDnsPrefetchControl: false,
  xDownloadOptions: false,
  xPermittedCrossDomainPolicies: false,
  xXssProtection: false,
});
const API_PATH = /^\/api(?:\/|$)/;
const securityHeaders: express.RequestHandler = (req, res, next) => (API_PATH.test(req.path) ? apiHeaders : documentHeaders)(req, res, next);

/** Hashed build output: a new build has new names, so a browser may keep these for good. */
const HASHED = /[/\\]assets[/\\][^/\\]+$/;
/** The service worker, the page and the manifest must be asked for again, or a new build is never seen. */
const ASK_AGAIN = /(?:^|[/\\])(?:sw\.js|workbox-[^/\\]*\.js|index\.html|manifest\.webmanifest)(?:\.br|\.gz)?$/;

/**
 * The built client: each file's pre-compressed `.br` or `.gz` twin (written at build time) when the
 * browser takes it, brotli first; otherwise the file itself. API and sign-in paths never look on
 * disk, and a path that does not decode goes on to the routes, which answer it in the error shape.
 */
function clientFiles(dist: string): express.RequestHandler {
  const files = expressStaticGzip(dist, {
    index: false, // the page comes from the SPA fallback below, like any other path
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    serveStatic: {
      index: false,
      maxAge: '1h',
      setHeaders: (res, file) => {
        if (ASK_AGAIN.test(file)) res.setHeader('Cache-Control', 'no-cache');
        else if (HASHED.test(file)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
      },
    },
  });
  return (req, res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || /^\/(?:api|auth)(?:\/|$)/.test(req.path)) return next();
    try {
      decodeURIComponent(req.path);
    } catch {
      return next();
    }
    return files(req, res, next);
  };
}

/** Builds the Express app: middleware and routers. It never listens; server/index.ts does. */
export function createApp(opts: AppOptions = {}) {
  const app = express();
  const signInLimit = limitPerAddress({ name: 'sign-in', what: 'sign-in attempts', ...(opts.signInLimit ?? { perMinute: config.signInPerMinute, redisUrl: config.redisUrl }) });
  app.locals.signInLimitConnected = signInLimit.connected;
  app.set('trust proxy', config.trustProxy);
  app.disable('x-powered-by');
  // No ETag on answers made per request: they are `no-store`, so no browser asks again with one, and
  // making it hashed every answer (the client's files keep theirs: serve-static makes its own).
  app.set('etag', false);
  app.use(securityHeaders);
  // Answers made per request (JSON, the CSV export, the page) are compressed on the fly: brotli at
  // quality 4 (compression's default, fast enough per request), gzip level 6 for browsers without
  // brotli; small answers are not worth it. Photos and PDFs are already compressed and their types
  // are not "compressible" (mime-db), and the client's pre-compressed files carry their own
  // Content-Encoding, so neither is compressed again.
  // Who is signed in (`/api/me`, asked on every page load) is always about a hundred bytes, under the
  // threshold: it skips the middleware, whose wrapping of the response is all it would do there.
  const compress = compression({ threshold: COMPRESS_THRESHOLD });
  app.use((req, res, next) => (req.path === '/api/me' ? next() : compress(req, res, next)));
  app.use(['/api', '/auth'], noStore);
  app.use(['/auth/login', '/auth/callback'], signInLimit); // before the session: a refused start stores nothing

  // The client's files are served before the session: an asset never reads or re-sets the session
  // cookie, so the service worker's precache cannot race a sign-in with an older cookie.
  const dist = path.resolve(config.clientDist);
  const hasClient = existsSync(path.join(dist, 'index.html'));
  if (hasClient) {
    app.use(clientFiles(dist));
    app.use('/assets', notFound); // a missing script or style is a 404, never the app's page
  }
  app.use(sessions(config.databaseUrl, config.sessionSecret));

  app.use('/api/health', healthRoutes);
  app.use('/api/openapi.json', openApiRoutes); // public: the API's shape, no data
  app.use('/auth', sameOrigin, authRoutes);
  app.use('/api', sameOrigin, requireSignIn);
  app.use('/api/me', meRoutes);
  app.use('/api/people', peopleRoutes);
  app.use('/api/lines', lineRoutes);
  app.use('/api/line-imports', lineImportRoutes);
  app.use('/api/calc', calcRoutes);
  app.use('/api/plant-settings', plantSettingsRoutes);
  app.use('/api/work-orders', orderLockoutRoutes, orderReleaseRoutes, orderRecordRoutes, orderTemperatureLogRoutes, workOrderRoutes);
  app.use('/api/temperature-logs', temperatureLogRoutes);
  app.use('/api/release-queue', releaseQueueRoutes);
  app.use('/api/line-status', lineStatusRoutes);
  app.use('/api/holds', holdRoutes);
  app.use('/api/locks', lockRoutes);
  app.use('/api/shift', shiftRoutes);
  app.use('/api/photos', photoRoutes);
  app.use('/api/joint-tasks', jointTaskRoutes);
  app.use('/api/schedule', scheduleRoutes);
  app.use('/api/fitters', fitterRoutes);
  app.use('/api', notFound);

  if (hasClient) app.get('/{*splat}', (_req, res) => res.sendFile('index.html', { root: dist, headers: { 'Cache-Control': 'no-cache' } }));
  app.use(notFound);
  app.use(errorHandler);
  return app;
}
