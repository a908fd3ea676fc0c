import { z } from 'zod';
import { ROLES, type Role } from '@shared/schemas/roles';

/** Parses "claimValue=role,claimValue=role" into a map; a bare role name maps to itself. */
function parseRoleMap(raw: string): Record<string, Role> {
  const map: Record<string, Role> = Object.fromEntries(ROLES.map((r) => [r, r]));
  for (const pair of raw.split(',').map((s) => s.trim()).filter(Boolean)) {
    const [claim, role] = pair.split('=').map((s) => s.trim());
    if (!claim || !role || !(ROLES as readonly string[]).includes(role)) {
      throw new Error(`OIDC_ROLE_MAP entry "${pair}" must read claimValue=role, role one of ${ROLES.join(', ')}`);
    }
    map[claim] = role as Role;
  }
  return map;
}

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().positive().default(5180),
    APP_ORIGIN: z.url().optional(),
    DATABASE_URL: z.string().startsWith('postgres'),
    REDIS_URL: z.string().startsWith('redis'),
    OIDC_ISSUER: z.url().optional(),
    OIDC_CLIENT_ID: z.string().default('linewright'),
    OIDC_CLIENT_SECRET: z.string().default('linewright-local-secret'),
    OIDC_ROLES_CLAIM: z.string().default('roles'),
    OIDC_ROLE_MAP: z.string().default(''),
    SESSION_SECRET: z.string().min(16).optional(),
    TRUST_PROXY: z.string().default('loopback'),
    SMTP_URL: z.string().startsWith('smtp').default('smtp://127.0.0.1:2525'),
    MAIL_FROM: z.string().default('Linewright <linewright@plant.invalid>'),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    IMPORT_INLINE_LIMIT: z.coerce.number().int().nonnegative().default(2000),
    CLIENT_DIST: z.string().default('dist'),
    SIGN_IN_LIMIT_PER_MINUTE: z.coerce.number().int().positive().default(60),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV !== 'production') return;
    if (!env.OIDC_ISSUER) ctx.addIssue({ code: 'custom', path: ['OIDC_ISSUER'], message: 'production needs a configured identity provider issuer' });
    if (!env.SESSION_SECRET) ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'production needs a session secret of 16+ characters' });
    if (!env.APP_ORIGIN) ctx.addIssue({ code: 'custom', path: ['APP_ORIGIN'], message: 'production needs the public address of the app' });
  });

function load() {
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Linewright cannot start; the configuration is incomplete:\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  const origin = env.APP_ORIGIN ?? `http://${env.HOST}:${env.PORT}`;
  return Object.freeze({
    env: env.NODE_ENV,
    isProduction: env.NODE_ENV === 'production',
    host: env.HOST,
    port: env.PORT,
    origin: origin.replace(/\/$/, ''),
    databaseUrl: env.DATABASE_URL,
    redisUrl: env.REDIS_URL,
    oidc: Object.freeze({
      // Development and tests sign in against the local fake unless an issuer is configured.
      issuer: env.OIDC_ISSUER ?? 'http://127.0.0.1:5181',
      clientId: env.OIDC_CLIENT_ID,
      clientSecret: env.OIDC_CLIENT_SECRET,
      rolesClaim: env.OIDC_ROLES_CLAIM,
      roleMap: Object.freeze(parseRoleMap(env.OIDC_ROLE_MAP)),
      redirectUri: `${origin.replace(/\/$/, '')}/auth/callback`,
    }),
    sessionSecret: env.SESSION_SECRET ?? 'linewright-development-only-secret',
    trustProxy: env.TRUST_PROXY,
    smtpUrl: env.SMTP_URL,
    mailFrom: env.MAIL_FROM,
    logLevel: env.LOG_LEVEL,
    importInlineLimit: env.IMPORT_INLINE_LIMIT,
    clientDist: env.CLIENT_DIST,
    signInPerMinute: env.SIGN_IN_LIMIT_PER_MINUTE,
  });
}

export type Config = ReturnType<typeof load>;
export const config: Config = load();
