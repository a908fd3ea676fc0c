import { chmodSync, existsSync, mkdirSync, mkdtempSync, readdirSync, rmdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CLUSTERS_ROOT, clusterDirFor, projectClusterDir, startPostgres, type PostgresHandle } from '../../scripts/lib/postgres';

/**
 * `npm start` from a home folder (mode 700): PostgreSQL runs as the postgres user, which cannot
 * enter such a folder, so the cluster lives under /var/lib/linewright, one folder per project path.
 * Needs no other service; the real start runs only as root (as CI does).
 */
const asRoot = process.getuid?.() === 0;
if (!asRoot) console.warn('[postgres-place] not root: skipping the real PostgreSQL start (PostgreSQL runs as the postgres user only when started as root)');

describe('the cluster folder for a project path', () => {
  it('is one folder under /var/lib/linewright per absolute path, the same every time', () => {
    const a = clusterDirFor('/srv/plant/linewright');
    expect(a).toMatch(/^\/var\/lib\/linewright\/[0-9a-f]{12}\/pg$/);
    expect(path.dirname(path.dirname(a))).toBe(CLUSTERS_ROOT);
    expect(clusterDirFor('/srv/plant/linewright')).toBe(a);
    expect(clusterDirFor('/srv/plant/./linewright/')).toBe(a);
    expect(clusterDirFor('/srv/plant/linewright2')).not.toBe(a);
    expect(clusterDirFor('/home/kit/linewright')).not.toBe(a);
  });

  it('as root, is that folder for a new project; a cluster already in data/pg stays there; not root, data/pg', () => {
    const project = mkdtempSync(path.join(os.tmpdir(), 'lw-place-pure-'));
    try {
      expect(projectClusterDir(project, true)).toBe(clusterDirFor(project));
      expect(projectClusterDir(project, false)).toBe(path.join(project, 'data', 'pg'));
      mkdirSync(path.join(project, 'data', 'pg'), { recursive: true });
      expect(projectClusterDir(project, true)).toBe(clusterDirFor(project)); // an empty data/pg is no cluster
      writeFileSync(path.join(project, 'data', 'pg', 'PG_VERSION'), '15\n');
      expect(projectClusterDir(project, true)).toBe(path.join(project, 'data', 'pg'));
    } finally {
      rmSync(project, { recursive: true, force: true });
    }
  });
});

/** The first loopback port in 6300–6399 nothing listens on. */
async function freePort(): Promise<number> {
  for (let port = 6300; port <= 6399; port++) {
    const free = await new Promise<boolean>((resolve) => {
      const s = net.createServer().once('error', () => resolve(false));
      s.listen(port, '127.0.0.1', () => s.close(() => resolve(true)));
    });
    if (free) return port;
  }
  throw new Error('no free loopback port in 6300–6399');
}

const answers = (port: number) =>
  new Promise<boolean>((resolve) => {
    const s = net.connect(port, '127.0.0.1', () => (s.end(), resolve(true)));
    s.on('error', () => resolve(false));
  });

async function query(url: string, sql: string): Promise<unknown[]> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(sql)).rows;
  } finally {
    await client.end();
  }
}

describe.skipIf(!asRoot)('npm start from a home folder (mode 700), as root', () => {
  let home: string;
  let project: string;
  let port: number;
  let handle: PostgresHandle | undefined;
  const hadClustersRoot = existsSync(CLUSTERS_ROOT);

  beforeAll(async () => {
    home = mkdtempSync(path.join(os.tmpdir(), 'lw-home-'));
    chmodSync(home, 0o700);
    project = path.join(home, 'linewright');
    mkdirSync(project);
    port = await freePort();
  });

  afterAll(() => {
    handle?.stop();
    if (project) rmSync(path.dirname(clusterDirFor(project)), { recursive: true, force: true });
    if (!hadClustersRoot && existsSync(CLUSTERS_ROOT) && readdirSync(CLUSTERS_ROOT).length === 0) rmdirSync(CLUSTERS_ROOT);
    if (home) rmSync(home, { recursive: true, force: true });
  });

  it('the old place, data/pg inside the project, is out of the postgres user\'s reach, and the error says what to do', () => {
    expect(() => startPostgres({ dir: path.join(project, 'data', 'pg'), port, database: 'x' })).toThrow(
      new RegExp(`postgres user, which cannot reach .*: ${home} does not let other users pass.*chmod o\\+x ${home}`),
    );
  });

  it('starts a cluster outside the project, answers select 1, and the next start reuses it with its data', async () => {
    rmSync(path.join(project, 'data'), { recursive: true, force: true });
    const dir = projectClusterDir(project);
    expect(dir).toBe(clusterDirFor(project));
    expect(dir.startsWith(`${CLUSTERS_ROOT}/`)).toBe(true);

    handle = startPostgres({ dir, port, database: 'linewright_place', fsync: false });
    expect(statSync(dir).uid).toBe(Number(execFileSync('id', ['-u', 'postgres']).toString()));
    expect(await query(handle.url, 'select 1 as one')).toEqual([{ one: 1 }]);
    await query(handle.url, "create table kept (note text); insert into kept values ('still here')");
    handle.stop();
    handle = undefined;
    expect(await answers(port)).toBe(false);

    // The next `npm start` finds the same folder for the same project, and the data in it.
    const again = projectClusterDir(project);
    expect(again).toBe(dir);
    handle = startPostgres({ dir: again, port, database: 'linewright_place', fsync: false });
    expect(await query(handle.url, 'select note from kept')).toEqual([{ note: 'still here' }]);
    handle.stop();
    handle = undefined;
    expect(await answers(port)).toBe(false);

    rmSync(path.dirname(dir), { recursive: true, force: true });
    expect(existsSync(dir)).toBe(false);
  });
});
