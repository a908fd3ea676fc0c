import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chmodSync, chownSync, existsSync, mkdirSync, readdirSync } from 'node:fs';
import path from 'node:path';

/** The newest PostgreSQL the Debian package installed: 15 on bookworm, 17 on trixie. */
export function pgBin(): string {
  const root = '/usr/lib/postgresql';
  const versions = existsSync(root) ? readdirSync(root).filter((v) => existsSync(path.join(root, v, 'bin', 'postgres'))) : [];
  versions.sort((a, b) => Number(b) - Number(a));
  if (!versions[0]) throw new Error(`no PostgreSQL server under ${root}; install the Debian package "postgresql"`);
  return path.join(root, versions[0], 'bin');
}

/** Where `npm start` keeps its clusters when it runs as root: a place the postgres user can always reach. */
export const CLUSTERS_ROOT = '/var/lib/linewright';

/**
 * The cluster folder for the project at `projectRoot`, as root: one folder per project path
 * (a short hash of the absolute path), outside the project, because a project in a home folder
 * (mode 700) is closed to the postgres user that PostgreSQL must run as. Pure: touches nothing.
 */
export function clusterDirFor(projectRoot: string): string {
  const hash = createHash('sha256').update(path.resolve(projectRoot)).digest('hex').slice(0, 12);
  return path.join(CLUSTERS_ROOT, hash, 'pg');
}

/**
 * The cluster `npm start` uses for the project at `projectRoot`:
 * - a cluster already in the project's `data/pg` (made before clusters moved out) stays there and
 *   keeps its data — nothing is moved;
 * - not root: `data/pg` too (PostgreSQL then runs as this user, who can reach their own project);
 * - otherwise `clusterDirFor(projectRoot)`.
 */
export function projectClusterDir(projectRoot: string, asRoot = process.getuid?.() === 0): string {
  const inProject = path.join(path.resolve(projectRoot), 'data', 'pg');
  if (!asRoot || existsSync(path.join(inProject, 'PG_VERSION'))) return inProject;
  return clusterDirFor(projectRoot);
}

export interface PostgresHandle {
  url: string;
  stop(): void;
}

/** PostgreSQL refuses to run as root: as root, its cluster belongs to the postgres user. */
function asOwner(cmd: string, args: string[]): string[] {
  return process.getuid?.() === 0 ? ['runuser', '-u', 'postgres', '--', cmd, ...args] : [cmd, ...args];
}

function run(cmd: string, args: string[], quiet = true): void {
  const [c, ...rest] = asOwner(cmd, args);
  execFileSync(c, rest, { stdio: quiet ? 'pipe' : 'inherit' });
}

const asPostgres = (...args: string[]) => spawnSync('runuser', ['-u', 'postgres', '--', ...args]).status === 0;

/** Creates `dir` and any missing folder above it, passable by every user whatever the umask. */
function makeDir(dir: string): void {
  const first = mkdirSync(dir, { recursive: true });
  if (!first) return;
  for (let d = dir; ; d = path.dirname(d)) {
    chmodSync(d, 0o755);
    if (d === first || d === path.dirname(d)) break;
  }
}

function ownByPostgres(dir: string, hint?: string): void {
  if (process.getuid?.() !== 0) return;
  const uid = Number(execFileSync('id', ['-u', 'postgres']).toString());
  const gid = Number(execFileSync('id', ['-g', 'postgres']).toString());
  chownSync(dir, uid, gid);
  // The cluster folder is the postgres user's, but every folder above it must let that user pass.
  if (asPostgres('test', '-w', dir)) return;
  const above: string[] = [];
  for (let d = path.dirname(dir); d !== path.dirname(d); d = path.dirname(d)) above.unshift(d);
  const closed = above.find((d) => !asPostgres('test', '-x', d));
  const what = closed
    ? `${closed} does not let other users pass (a home folder with mode 700, say). Let it pass with: chmod o+x ${closed}`
    : `check the permissions of ${dir} and the folders above it (the postgres user needs x on each, w on ${dir})`;
  throw new Error(`PostgreSQL runs as the postgres user, which cannot reach ${dir}: ${what}${hint ? `; or ${hint}` : ''}`);
}

/**
 * Creates (once) and starts a cluster in `dir`, listening on 127.0.0.1:`port` only. `unreachableHint`
 * is added to the error when the postgres user cannot reach `dir` (another way out than chmod).
 */
export function startPostgres(opts: { dir: string; port: number; database: string; fsync?: boolean; unreachableHint?: string }): PostgresHandle {
  const { dir, port, database } = opts;
  const BIN = pgBin();
  makeDir(dir);
  ownByPostgres(dir, opts.unreachableHint);
  if (!existsSync(path.join(dir, 'PG_VERSION'))) {
    // A throw-away cluster (fsync off) need not wait for initdb to sync its files either.
    const noSync = opts.fsync === false ? ['--no-sync'] : [];
    run(`${BIN}/initdb`, ['-D', dir, '-U', 'linewright', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8', ...noSync]);
  }
  const settings = [`-p ${port}`, `-k ${dir}`, "-c listen_addresses=127.0.0.1"];
  if (opts.fsync === false) settings.push('-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off');
  const status = spawnSync(asOwner(`${BIN}/pg_ctl`, ['-D', dir, 'status'])[0], asOwner(`${BIN}/pg_ctl`, ['-D', dir, 'status']).slice(1));
  if (status.status !== 0) {
    run(`${BIN}/pg_ctl`, ['-D', dir, '-l', path.join(dir, 'server.log'), '-w', '-o', settings.join(' '), 'start']);
  }
  const psql = (sql: string) =>
    execFileSync(`${BIN}/psql`, ['-h', '127.0.0.1', '-p', String(port), '-U', 'linewright', '-d', 'postgres', '-tAc', sql]).toString().trim();
  if (psql(`select 1 from pg_database where datname = '${database}'`) !== '1') {
    psql(`create database "${database}"`);
  }
  return {
    url: `postgres://linewright@127.0.0.1:${port}/${database}`,
    stop: () => {
      try {
        run(`${BIN}/pg_ctl`, ['-D', dir, '-m', 'fast', '-w', 'stop']);
      } catch {
        /* already stopped */
      }
    },
  };
}
