import type { RequestHandler } from 'express';
import { AppError } from '@server/errors';
import { currentPerson } from '@server/services/people-service';
import { ROLE_LABELS, type Me, type Role } from '@shared/schemas/roles';

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
      query: unknown;
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

const describe = (roles: readonly Role[], joiner = ' or ') => roles.map((r) => ROLE_LABELS[r].toLowerCase()).join(joiner);
const withArticle = (words: string) => `${/^[aeiou]/.test(words) ? 'an' : 'a'} ${words}`;

/** Allows the request when the person holds any of `roles`; otherwise 403 naming who may. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (_req, res, next) => {
    if (!res.locals.me.roles.some((r) => roles.includes(r))) {
      throw AppError.forbidden(`Only ${withArticle(describe(roles))} may do this; your roles are ${describe(res.locals.me.roles, ' and ') || 'none'}.`);
    }
    next();
  };
}
