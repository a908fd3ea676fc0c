import { chmodSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { spawn } from 'node:child_process';
import os from 'node:os';
import path from 'node:path';
import { ensureDebianPackages } from './lib/debian';
import { startPostgres } from './lib/postgres';
import { startRedis } from './lib/redis';
import { BIN, ROOT, runBin, runTs } from './lib/processes';
import { startIdentityFake } from './identity-fake';
import { startMailSink } from './mail-sink';
import { DEMO_ROLE_MAP } from './demo-accounts';
import { TEST_PORTS } from '../tests/helpers/ports';

/** `npm test`: throw-away PostgreSQL and Redis on ports of their own, every test, then clean up. */
async function main(): Promise<number> {
  if (!process.argv.includes('--serve')) {
    // The layout rules and the types first: a break there fails the run before any service starts.
    console.log('[linewright] lint (eslint) and type check (tsc)…');
    runBin('lint', 'eslint', ['--max-warnings', '0', '.'], process.env);
    runBin('type check', 'tsc', ['--noEmit', '-p', '.'], process.env);
  }
  ensureDebianPackages(['postgresql', 'redis-server', 'chromium']);
  const tmp = mkdtempSync(path.join(os.tmpdir(), 'linewright-test-'));
  chmodSync(tmp, 0o755);
  // Whatever has started is stopped again, even when a later service fails to start.
  const stops: (() => unknown)[] = [];
  try {
    const pg = startPostgres({ dir: path.join(tmp, 'pg'), port: TEST_PORTS.pg, database: 'linewright_test', fsync: false });
    stops.push(() => pg.stop());
    const redis = await startRedis({ port: TEST_PORTS.redis });
    stops.push(() => redis.stop());
    const origin = `http://127.0.0.1:${TEST_PORTS.app}`;
    // A run on another port base builds the client into a folder of its own, so two runs side by side never share one.
    const clientDist = TEST_PORTS.app === 5290 ? 'dist' : `.tmp/dist-${TEST_PORTS.app}`;
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      LW_TEST_PORT_BASE: String(TEST_PORTS.app),
      NODE_ENV: 'test',
      LOG_LEVEL: process.env.LOG_LEVEL ?? 'silent',
      PORT: String(TEST_PORTS.app),
      APP_ORIGIN: origin,
      DATABASE_URL: pg.url,
      REDIS_URL: redis.url,
      OIDC_ISSUER: `http://127.0.0.1:${TEST_PORTS.idp}`,
      OIDC_ROLE_MAP: DEMO_ROLE_MAP,
      SMTP_URL: `smtp://127.0.0.1:${TEST_PORTS.smtp}`,
      IMPORT_INLINE_LIMIT: '50',
      SIGN_IN_LIMIT_PER_MINUTE: '100000', // every test signs in from 127.0.0.1; the limit's own test sets its own
      CLIENT_DIST: clientDist,
    };
    const idp = await startIdentityFake({ port: TEST_PORTS.idp, appOrigin: origin, clientId: 'linewright', clientSecret: 'linewright-local-secret' });
    stops.push(() => idp.stop());
    const mail = await startMailSink({ smtpPort: TEST_PORTS.smtp, httpPort: TEST_PORTS.mailHttp });
    stops.push(() => mail.stop());
    runTs('migration', 'server/db/migrate.ts', env);
    if (process.argv.includes('--serve')) return await serve(env);
    runBin('client build', 'vite', ['build', '--logLevel', 'warn', '--outDir', clientDist, '--emptyOutDir'], { ...env, NODE_ENV: 'production' }); // React's production build, whatever the server's mode
    // Not spawnSync: the sign-in fake and the mail sink live in this process and must keep answering.
    const vitest = spawn(BIN('vitest'), ['run', ...process.argv.slice(2)], { cwd: ROOT, env, stdio: 'inherit' });
    return await new Promise<number>((resolve) => vitest.on('exit', (code) => resolve(code ?? 1)));
  } finally {
    for (const stop of stops.reverse()) await stop();
    rmSync(tmp, { recursive: true, force: true });
  }
}

/**
 * `tsx scripts/test.ts --serve`: keeps the test services up and writes their environment to
 * .tmp/test-env-<port>.sh, so a developer can run `set -a; . .tmp/test-env-5290.sh; npx vitest run <file>`.
 */
async function serve(env: NodeJS.ProcessEnv): Promise<number> {
  const keys = ['LW_TEST_PORT_BASE', 'NODE_ENV', 'LOG_LEVEL', 'PORT', 'APP_ORIGIN', 'DATABASE_URL', 'REDIS_URL', 'OIDC_ISSUER', 'OIDC_ROLE_MAP', 'SMTP_URL', 'IMPORT_INLINE_LIMIT', 'CLIENT_DIST', 'SIGN_IN_LIMIT_PER_MINUTE'];
  mkdirSync(path.join(ROOT, '.tmp'), { recursive: true });
  const file = path.join(ROOT, '.tmp', `test-env-${TEST_PORTS.app}.sh`);
  writeFileSync(file, keys.map((k) => `${k}='${env[k]}'`).join('\n') + '\n');
  console.log(`[linewright] test services are up; environment in ${path.relative(ROOT, file)}. Ctrl-C stops them.`);
  await new Promise<void>((resolve) => process.once('SIGINT', resolve).once('SIGTERM', resolve));
  return 0;
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(`[linewright] tests could not run: ${err.stack ?? err}`);
    process.exit(1);
  },
);
