import type { RequestHandler } from 'express';
import { AppError } from '@server/errors';
import { currentPerson, toMe } from '@server/services/people-service';
import { may, refusalFor, type Action } from '@shared/permissions';
import type { Me } from '@shared/schemas/roles';

declare module 'express-session' {
  interface SessionData {
    personId?: string;
    /** When the expiry was last extended (server/middleware/session.ts): changing it is what saves the session. */
    extendedAt?: number;
    signIn?: { state: string; nonce: string; codeVerifier: string; returnTo: string };
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      me: Me;
    }
  }
}

/**
 * The signed-in person, fresh from the database on every request so a withdrawn role ends at once:
 * read with the session itself (server/db/session-store.ts), or looked up when the session did not
 * come from the store on this request.
 */
export const requireSignIn: RequestHandler = async (req, res, next) => {
  const id = req.session.personId;
  const read = req.sessionPerson;
  const me = !id ? null : read?.id === id ? toMe(read) : await currentPerson(id);
  if (!me) throw AppError.unauthenticated();
  res.locals.me = me;
  next();
};

/** Allows the request when the person's roles may do `action` (shared/permissions.ts); otherwise 403 naming who may. */
export function requirePermission(action: Action): RequestHandler {
  return (_req, res, next) => {
    if (!may(res.locals.me, action)) throw AppError.forbidden(refusalFor(action, res.locals.me.roles));
    next();
  };
}
