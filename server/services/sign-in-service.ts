import * as oidc from 'openid-client';
import { config } from '@server/config';
import { AppError } from '@server/errors';
import { logger } from '@server/logger';
import { recordSignIn } from '@server/services/people-service';
import type { Me, Role } from '@shared/schemas/roles';

let discovered: Promise<oidc.Configuration> | null = null;

/** Discovers the provider once; a failure is forgotten so the next sign-in tries again. */
function provider(): Promise<oidc.Configuration> {
  discovered ??= oidc
    .discovery(new URL(config.oidc.issuer), config.oidc.clientId, { redirect_uris: [config.oidc.redirectUri] }, oidc.ClientSecretPost(config.oidc.clientSecret), {
      // Only the local fake speaks plain http, and only on loopback outside production.
      execute: !config.isProduction && config.oidc.issuer.startsWith('http://') ? [oidc.allowInsecureRequests] : [],
    })
    .catch((err) => {
      discovered = null;
      logger.error({ err }, 'identity provider discovery failed');
      throw new AppError(503, 'identity_provider_unreachable', 'The sign-in service cannot be reached just now. Try again in a minute.');
    });
  return discovered;
}

export interface PendingSignIn {
  state: string;
  nonce: string;
  codeVerifier: string;
  returnTo: string;
}

/** Step one: the address to send the browser to, and the secrets to keep in its session. */
export async function beginSignIn(returnTo: string): Promise<{ url: string; pending: PendingSignIn }> {
  const cfg = await provider();
  const pending = { state: oidc.randomState(), nonce: oidc.randomNonce(), codeVerifier: oidc.randomPKCECodeVerifier(), returnTo };
  const url = oidc.buildAuthorizationUrl(cfg, {
    redirect_uri: config.oidc.redirectUri,
    scope: 'openid profile email',
    state: pending.state,
    nonce: pending.nonce,
    code_challenge: await oidc.calculatePKCECodeChallenge(pending.codeVerifier),
    code_challenge_method: 'S256',
  });
  return { url: url.href, pending };
}

function mapRoles(claim: unknown): Role[] {
  const values = Array.isArray(claim) ? claim : typeof claim === 'string' ? claim.split(/[\s,]+/) : [];
  const roles = new Set<Role>();
  for (const v of values) {
    const role = config.oidc.roleMap[String(v)];
    if (role) roles.add(role);
  }
  return [...roles];
}

/** Step two: exchanges the code (checking state, nonce and PKCE) and records the person. */
export async function completeSignIn(callbackUrl: URL, pending: PendingSignIn | undefined): Promise<Me> {
  if (!pending) throw AppError.badRequest('This sign-in has expired or was started in another browser. Start again.');
  const cfg = await provider();
  let claims: oidc.IDToken | undefined;
  try {
    const tokens = await oidc.authorizationCodeGrant(cfg, callbackUrl, {
      pkceCodeVerifier: pending.codeVerifier,
      expectedState: pending.state,
      expectedNonce: pending.nonce,
      idTokenExpected: true,
    });
    claims = tokens.claims();
  } catch (err) {
    logger.warn({ err }, 'sign-in callback refused');
    throw AppError.badRequest('The sign-in could not be completed. Start again.');
  }
  if (!claims) throw AppError.badRequest('The identity provider sent no identity.');
  return recordSignIn({
    issuer: claims.iss,
    subject: claims.sub,
    name: String(claims.name ?? claims.preferred_username ?? claims.email ?? claims.sub),
    email: typeof claims.email === 'string' ? claims.email : null,
    roles: mapRoles(claims[config.oidc.rolesClaim]),
  });
}

export async function signOutUrl(): Promise<string | null> {
  try {
    const cfg = await provider();
    if (!cfg.serverMetadata().end_session_endpoint) return null;
    return oidc.buildEndSessionUrl(cfg, { client_id: config.oidc.clientId, post_logout_redirect_uri: `${config.origin}/` }).href;
  } catch {
    return null;
  }
}
