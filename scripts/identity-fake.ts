import { generateKeyPairSync } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import express from 'express';
import Provider from 'oidc-provider';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts';

/**
 * A local OpenID Connect provider for development and tests only: real protocol (discovery,
 * authorization code + PKCE, ID token with a groups claim), demo accounts, its own sign-in page.
 */
export interface IdentityFakeOptions {
  port: number;
  appOrigin: string;
  clientId: string;
  clientSecret: string;
  rolesClaim?: string;
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function page(uid: string, error?: string): string {
  const rows = DEMO_ACCOUNTS.map((a) => `<tr><td><code>${a.username}</code></td><td>${esc(a.name)}</td><td>${a.role}</td></tr>`).join('');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Plant directory sign-in (local)</title>
<style>body{font:16px system-ui,sans-serif;background:#e8ecef;color:#1d2731;display:grid;place-items:center;min-height:100vh;margin:0}
main{background:#fff;padding:2rem;border-radius:12px;max-width:26rem;width:100%;box-shadow:0 1px 3px #0002}
label{display:block;margin:.8rem 0 .3rem;font-weight:600}input{width:100%;box-sizing:border-box;font-size:1.1rem;padding:.7rem;border:1px solid #8a96a3;border-radius:8px}
button{margin-top:1.2rem;width:100%;font-size:1.1rem;padding:.8rem;border:0;border-radius:8px;background:#334155;color:#fff}
.err{background:#fee4e2;color:#b42318;padding:.6rem;border-radius:8px}table{width:100%;font-size:.9rem;margin-top:1rem;border-collapse:collapse}td{padding:.2rem .3rem;border-top:1px solid #eee}</style></head>
<body><main><h1 style="font-size:1.3rem">Plant directory — local sign-in</h1>
<p style="color:#4a5866">Development only. Password for every demo account: <code>${DEMO_PASSWORD}</code></p>
${error ? `<p class="err" role="alert">${esc(error)}</p>` : ''}
<form method="post" action="/interaction/${uid}/login">
<label for="username">User name</label><input id="username" name="username" autocomplete="username" autofocus>
<label for="password">Password</label><input id="password" name="password" type="password" autocomplete="current-password">
<button type="submit">Sign in</button></form>
<table><tbody>${rows}</tbody></table></main></body></html>`;
}

function buildProvider(opts: IdentityFakeOptions): Provider {
  const issuer = `http://127.0.0.1:${opts.port}`;
  const rolesClaim = opts.rolesClaim ?? 'roles';
  return new Provider(issuer, {
    clients: [
      {
        client_id: opts.clientId,
        client_secret: opts.clientSecret,
        redirect_uris: [`${opts.appOrigin}/auth/callback`],
        post_logout_redirect_uris: [`${opts.appOrigin}/`],
        grant_types: ['authorization_code'],
        response_types: ['code'],
        token_endpoint_auth_method: 'client_secret_post',
      },
    ],
    claims: { openid: ['sub'], profile: ['name', 'preferred_username', rolesClaim], email: ['email', 'email_verified'] },
    conformIdTokenClaims: false, // put the roles claim in the ID token itself
    pkce: { required: () => true },
    features: { devInteractions: { enabled: false }, rpInitiatedLogout: { enabled: true } },
    interactions: { url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    cookies: { keys: ['linewright-identity-fake-key'] },
    // A fresh signing key each start: the fake keeps nothing, so nothing needs to verify old tokens.
    jwks: { keys: [{ ...generateKeyPairSync('rsa', { modulusLength: 2048 }).privateKey.export({ format: 'jwk' }), use: 'sig', alg: 'RS256', kid: 'fake-1' }] },
    ttl: { Session: 12 * 3600, Interaction: 3600, Grant: 12 * 3600, AccessToken: 3600, IdToken: 3600, AuthorizationCode: 120 },
    async findAccount(_ctx, id) {
      const account = DEMO_ACCOUNTS.find((a) => a.username === id);
      if (!account) return undefined;
      return {
        accountId: id,
        claims: async () => ({ sub: id, name: account.name, preferred_username: id, email: account.email, email_verified: true, [rolesClaim]: [...account.groups] }),
      };
    },
    // First-party client: consent is implied, so the grant is made without a consent screen.
    async loadExistingGrant(ctx) {
      const { client, session } = ctx.oidc;
      if (!client || !session?.accountId) return undefined;
      const existing = session.grantIdFor(client.clientId);
      if (existing) return ctx.oidc.provider.Grant.find(existing);
      const grant = new ctx.oidc.provider.Grant({ clientId: client.clientId, accountId: session.accountId });
      grant.addOIDCScope('openid profile email');
      grant.addOIDCClaims(['name', 'preferred_username', 'email', 'email_verified', rolesClaim]);
      await grant.save();
      session.grantIdFor(client.clientId, grant.jti);
      return grant;
    },
  });
}

export async function startIdentityFake(opts: IdentityFakeOptions): Promise<{ issuer: string; stop(): Promise<void> }> {
  const provider = buildProvider(opts);
  const app = express();
  app.get('/interaction/:uid', async (req, res) => {
    const details = await provider.interactionDetails(req, res);
    res.type('html').send(page(details.uid));
  });
  app.post('/interaction/:uid/login', express.urlencoded({ extended: false }), async (req, res) => {
    const details = await provider.interactionDetails(req, res);
    const account = DEMO_ACCOUNTS.find((a) => a.username === String(req.body.username ?? '').trim());
    if (!account || req.body.password !== DEMO_PASSWORD) {
      res.status(401).type('html').send(page(details.uid, 'That user name and password do not match a demo account.'));
      return;
    }
    await provider.interactionFinished(req, res, { login: { accountId: account.username } }, { mergeWithLastSubmission: false });
  });
  app.use(provider.callback());
  const server: Server = createServer(app);
  // A port in use rejects here (the caller stops what it started) instead of crashing the process.
  await new Promise<void>((resolve, reject) => server.once('error', reject).listen(opts.port, '127.0.0.1', resolve));
  return {
    issuer: `http://127.0.0.1:${opts.port}`,
    stop: () => new Promise((resolve) => (server.closeAllConnections(), server.close(() => resolve()))),
  };
}
