import { writeFileSync } from 'node:fs';
import path from 'node:path';
import type { ChildProcess } from 'node:child_process';
import { ensureDebianPackages } from './lib/debian';
import { clusterDirFor, projectClusterDir, startPostgres } from './lib/postgres';
import { startRedis, waitForPort } from './lib/redis';
import { ROOT, runBin, runTs, startTs } from './lib/processes';
import { startIdentityFake } from './identity-fake';
import { startMailSink } from './mail-sink';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_ROLE_MAP } from './demo-accounts';

/** `npm start`: every service on loopback, the demo plant once, the built client, API and worker. */
const PORTS = { app: 5180, idp: 5181, mailHttp: 5182, smtp: 2525, pg: 54330, redis: 63790 };
const DATA = path.join(ROOT, 'data');
const log = (msg: string) => console.log(`[linewright] ${msg}`);
/** What has been started, newest last; a failure while starting stops these again. */
const started: (() => unknown)[] = [];

async function main() {
  const dev = process.argv.includes('--dev');
  ensureDebianPackages(['postgresql', 'redis-server']);
  // As root, the cluster lives outside the project (the postgres user cannot enter a home folder);
  // a cluster made earlier in data/pg stays there. Same project folder, same cluster, every time.
  const pgDir = projectClusterDir(ROOT);
  const inProject = pgDir.startsWith(DATA + path.sep);
  log(`PostgreSQL data in ${pgDir}`);
  const moveTo = path.dirname(clusterDirFor(ROOT));
  const pg = startPostgres({
    dir: pgDir,
    port: PORTS.pg,
    database: 'linewright',
    // The one way out besides chmod, for an old cluster in data/pg: move it to where new clusters go.
    unreachableHint: inProject && process.getuid?.() === 0 ? `move the cluster out of the project: install -d -m 755 ${path.dirname(moveTo)} ${moveTo} && mv ${pgDir} ${moveTo}/` : undefined,
  });
  started.push(() => pg.stop());
  // Names the project a folder under /var/lib/linewright belongs to, for whoever finds it there later.
  if (!inProject) writeFileSync(path.join(path.dirname(pgDir), 'project'), `${ROOT}\n`);
  const redis = await startRedis({ port: PORTS.redis, dir: path.join(DATA, 'redis') });
  started.push(() => redis.stop());
  const origin = `http://127.0.0.1:${PORTS.app}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'development',
    PORT: String(PORTS.app),
    APP_ORIGIN: dev ? 'http://127.0.0.1:5173' : origin,
    DATABASE_URL: pg.url,
    REDIS_URL: redis.url,
    OIDC_ISSUER: `http://127.0.0.1:${PORTS.idp}`,
    OIDC_ROLE_MAP: DEMO_ROLE_MAP,
    SMTP_URL: `smtp://127.0.0.1:${PORTS.smtp}`,
  };
  const idp = await startIdentityFake({ port: PORTS.idp, appOrigin: env.APP_ORIGIN!, clientId: 'linewright', clientSecret: 'linewright-local-secret' });
  started.push(() => idp.stop());
  const mail = await startMailSink({ smtpPort: PORTS.smtp, httpPort: PORTS.mailHttp });
  started.push(() => mail.stop());
  log('migrating the database…');
  runTs('migration', 'server/db/migrate.ts', env);
  runTs('demo plant', 'scripts/seed-demo.ts', env);
  if (!dev) {
    log('building the client…');
    runBin('client build', 'vite', ['build', '--logLevel', 'warn'], { ...env, NODE_ENV: 'production' }); // React's production build, whatever the server's mode
  }
  const children: ChildProcess[] = [startTs('server/index.ts', { ...env, LW_PROCESS: 'api' }), startTs('worker/index.ts', { ...env, LW_PROCESS: 'worker' })];
  if (dev) children.push(startTs('scripts/vite-dev.ts', env));
  started.push(() => children.forEach((c) => c.exitCode === null && c.kill('SIGTERM')));
  await waitForPort(PORTS.app, 120_000); // a busy machine loads the server's TypeScript slowly

  const accounts = DEMO_ACCOUNTS.map((a) => `    ${a.username.padEnd(11)} ${a.role.padEnd(11)} ${a.name}`).join('\n');
  console.log(`
  Linewright is up.

  Open        ${env.APP_ORIGIN}
  Sign in     with a demo account below, password "${DEMO_PASSWORD}"
${accounts}
  Mail        captured mail is at ${mail.viewerUrl}
  Data        PostgreSQL in ${inProject ? path.relative(ROOT, pgDir) : pgDir}, Redis in ${path.relative(ROOT, DATA)}/redis (kept between runs)

  Ctrl-C stops everything.
`);

  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    log('stopping…');
    await Promise.all(children.map((c) => new Promise<void>((r) => (c.exitCode !== null ? r() : (c.once('exit', () => r()), c.kill('SIGTERM'))))));
    await Promise.all([idp.stop(), mail.stop(), redis.stop()]);
    pg.stop();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
  for (const c of children) c.on('exit', (code) => !stopping && (log(`a process stopped (exit ${code}); stopping the rest`), void stop()));
}

main().catch(async (err) => {
  console.error(`[linewright] could not start: ${err.message}`);
  for (const stop of started.reverse()) await Promise.resolve(stop()).catch(() => {});
  process.exit(1);
});
