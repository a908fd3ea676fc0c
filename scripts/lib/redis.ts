import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import net from 'node:net';

export interface RedisHandle {
  url: string;
  stop(): Promise<void>;
}

const answers = (port: number) =>
  new Promise<boolean>((resolve) => {
    const s = net.connect(port, '127.0.0.1', () => (s.end(), resolve(true)));
    s.on('error', () => resolve(false));
  });

async function waitForPort(port: number, timeoutMs = 10_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (await answers(port)) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`nothing answered on 127.0.0.1:${port} within ${timeoutMs} ms`);
}

/**
 * Redis on loopback. `--hz 100` makes BullMQ's delayed jobs fire about 10 ms late instead of 100;
 * noeviction because a queue must never lose a job to memory pressure.
 */
export async function startRedis(opts: { port: number; dir?: string }): Promise<RedisHandle> {
  const args = ['--bind', '127.0.0.1', '--port', String(opts.port), '--hz', '100', '--maxmemory-policy', 'noeviction', '--save', ''];
  if (opts.dir) {
    mkdirSync(opts.dir, { recursive: true });
    args.push('--dir', opts.dir, '--appendonly', 'yes');
  } else {
    args.push('--appendonly', 'no');
  }
  // Otherwise the wait below would take whatever answers there (a Redis left running, another service) for ours.
  if (await answers(opts.port)) throw new Error(`something already answers on 127.0.0.1:${opts.port}; stop it, or choose other ports`);
  const child: ChildProcess = spawn('/usr/bin/redis-server', args, { stdio: ['ignore', 'ignore', 'inherit'] });
  // A redis-server that exits at once (bad flag, a port taken meanwhile) fails the start instead of hanging it.
  const exited = new Promise<never>((_, reject) => {
    child.once('error', reject);
    child.once('exit', (code) => reject(new Error(`redis-server on port ${opts.port} stopped at start (exit ${code}); is the port in use?`)));
  });
  exited.catch(() => {});
  try {
    await Promise.race([waitForPort(opts.port), exited]);
  } catch (err) {
    child.kill('SIGTERM');
    throw err;
  }
  return {
    url: `redis://127.0.0.1:${opts.port}`,
    stop: () =>
      new Promise((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

export { waitForPort };
