import type { RequestHandler } from 'express';
import { config } from '@server/config';
import { AppError } from '@server/errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests that do not come from the app's own pages. Browsers send
 * Origin on every cross-origin and same-origin POST/PUT/DELETE; a request without one is refused
 * too, so a form posted from elsewhere cannot ride on the session cookie.
 */
export const sameOrigin: RequestHandler = (req, _res, next) => {
  if (SAFE.has(req.method)) return next();
  const origin = req.get('origin');
  if (origin !== config.origin) {
    throw AppError.forbidden(origin ? `Requests from ${origin} may not change anything here.` : 'A change must come from the Linewright app itself (no Origin header).');
  }
  next();
};
