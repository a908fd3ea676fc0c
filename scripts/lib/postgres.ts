import { execFileSync, spawnSync } from 'node:child_process';
import { chownSync, existsSync, mkdirSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

/** The newest PostgreSQL the Debian package installed: 15 on bookworm, 17 on trixie. */
export function pgBin(): string {
  const root = '/usr/lib/postgresql';
  const versions = existsSync(root) ? readdirSync(root).filter((v) => existsSync(path.join(root, v, 'bin', 'postgres'))) : [];
  versions.sort((a, b) => Number(b) - Number(a));
  if (!versions[0]) throw new Error(`no PostgreSQL server under ${root}; install the Debian package "postgresql"`);
  return path.join(root, versions[0], 'bin');
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

function ownByPostgres(dir: string): void {
  if (process.getuid?.() !== 0) return;
  const uid = Number(execFileSync('id', ['-u', 'postgres']).toString());
  const gid = Number(execFileSync('id', ['-g', 'postgres']).toString());
  chownSync(dir, uid, gid);
  // The cluster folder is the postgres user's, but every folder above it must let that user pass.
  if (spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-w', dir]).status !== 0) {
    let closed = path.dirname(dir);
    for (let d = closed; d !== path.dirname(d); d = path.dirname(d)) if ((statSync(d).mode & 0o001) === 0) closed = d;
    throw new Error(
      `the postgres user cannot reach ${dir}: ${closed} is closed to other users (a home folder with mode 700, say). ` +
        `Put the project somewhere else, or let others pass with: chmod o+x ${closed}`,
    );
  }
}

/** Creates (once) and starts a cluster in `dir`, listening on 127.0.0.1:`port` only. */
export function startPostgres(opts: { dir: string; port: number; database: string; fsync?: boolean }): PostgresHandle {
  const { dir, port, database } = opts;
  const BIN = pgBin();
  mkdirSync(dir, { recursive: true });
  ownByPostgres(dir);
  if (!existsSync(path.join(dir, 'PG_VERSION'))) {
    run(`${BIN}/initdb`, ['-D', dir, '-U', 'linewright', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8']);
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
