import type { RequestHandler } from 'express';
import { AppError } from '@server/errors';
import { currentPerson } from '@server/services/people-service';
import { may, refusalFor, type Action } from '@shared/permissions';
import type { Me } from '@shared/schemas/roles';

declare module 'express-session' {
  interface SessionData {
    personId?: string;
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

/** Loads the signed-in person fresh from the database, so a withdrawn role ends at once. */
export const requireSignIn: RequestHandler = async (req, res, next) => {
  const me = req.session.personId ? await currentPerson(req.session.personId) : null;
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
