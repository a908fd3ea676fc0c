import session from 'express-session';
import type { RequestHandler } from 'express';
import { SessionStore } from '@server/db/session-store';

/** A signed-in session ends after this long without a request. */
export const SESSION_IDLE_MS = 12 * 60 * 60 * 1000;
/** How stale a signed-in session's expiry may get before a request extends it (a write and a Set-Cookie). */
export const SESSION_EXTEND_AFTER_MS = 5 * 60 * 1000;

/**
 * Sessions in PostgreSQL, not rolling: a request extends the session (stores the new expiry and
 * sends the cookie again) only when its expiry was last set more than SESSION_EXTEND_AFTER_MS ago,
 * so a person working steadily costs one write every few minutes, not one per request. The idle
 * end is therefore 12 h after the last request, less at most those few minutes.
 */
export function sessions(databaseUrl: string, secret: string): RequestHandler[] {
  const store = new SessionStore(databaseUrl);
  const middleware = session({
    name: 'lw.sid', // its own name: on loopback the sign-in fake's cookies share the host
    store,
    secret,
    resave: false,
    saveUninitialized: false,
    rolling: false,
    cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: SESSION_IDLE_MS },
  });
  return [middleware, extendWhenStale];
}

const extendWhenStale: RequestHandler = (req, _res, next) => {
  const s = req.session;
  // Only a signed-in session is extended; an unfinished sign-in keeps its few minutes.
  if (s?.personId && s.cookie.originalMaxAge && s.cookie.maxAge !== undefined) {
    const setAgo = s.cookie.originalMaxAge - s.cookie.maxAge;
    // A change to the session makes express-session save it (new expiry) and send the cookie again.
    if (setAgo > SESSION_EXTEND_AFTER_MS) s.extendedAt = Date.now();
  }
  next();
};
