import { Router } from 'express';
import { z } from 'zod';
import { config } from '@server/config';
import { validate } from '@server/middleware/validate';
import { beginSignIn, completeSignIn, signOutUrl } from '@server/services/sign-in-service';
import type { Request } from 'express';

const regenerate = (req: Request) => new Promise<void>((ok, fail) => req.session.regenerate((e) => (e ? fail(e) : ok())));
const save = (req: Request) => new Promise<void>((ok, fail) => req.session.save((e) => (e ? fail(e) : ok())));
const destroy = (req: Request) => new Promise<void>((ok) => req.session.destroy(() => ok()));

// Only paths inside the app may be returned to, never another site.
const returnTo = z.object({ returnTo: z.string().regex(/^\/(?!\/)[^\s\\]*$/).optional().catch(undefined) });

/** How long an unfinished sign-in's session lives. */
export const SIGN_IN_PENDING_MS = 10 * 60 * 1000;

export const authRoutes = Router();

authRoutes.get('/login', validate({ query: returnTo }, async ({ query }, req, res) => {
  const { url, pending } = await beginSignIn(query.returnTo ?? '/');
  req.session.signIn = pending;
  // An unfinished sign-in is kept only as long as a person takes to type a password; the session
  // made at the callback gets the full length (a signed-in person's session keeps its own).
  if (!req.session.personId) req.session.cookie.maxAge = SIGN_IN_PENDING_MS;
  await save(req);
  res.redirect(url);
}));

authRoutes.get('/callback', async (req, res) => {
  const pending = req.session.signIn;
  const me = await completeSignIn(new URL(req.originalUrl, config.origin), pending);
  await regenerate(req); // a fresh session id at sign-in: no fixation
  req.session.personId = me.id;
  await save(req);
  res.redirect(pending?.returnTo ?? '/');
});

authRoutes.post('/logout', async (req, res) => {
  await destroy(req);
  res.clearCookie('lw.sid');
  res.json({ redirectTo: (await signOutUrl()) ?? '/' });
});
