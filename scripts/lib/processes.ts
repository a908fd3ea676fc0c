import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import path from 'node:path';

export const ROOT = path.resolve(import.meta.dirname, '..', '..');
const TSX = path.join(ROOT, 'node_modules', '.bin', 'tsx');
const BIN = (name: string) => path.join(ROOT, 'node_modules', '.bin', name);

/** Runs a command to completion in the project folder; a failure stops the script with its message. */
export function runOrFail(what: string, cmd: string, args: string[], env: NodeJS.ProcessEnv): void {
  const r = spawnSync(cmd, args, { cwd: ROOT, env, stdio: 'inherit' });
  if (r.status !== 0) throw new Error(`${what} failed (exit ${r.status ?? r.signal})`);
}

export const runTs = (what: string, file: string, env: NodeJS.ProcessEnv, args: string[] = []) => runOrFail(what, TSX, [file, ...args], env);
export const runBin = (what: string, name: string, args: string[], env: NodeJS.ProcessEnv) => runOrFail(what, BIN(name), args, env);

/** Starts a long-running TypeScript entry point; its output goes to this terminal. */
export function startTs(file: string, env: NodeJS.ProcessEnv): ChildProcess {
  return spawn(TSX, [file], { cwd: ROOT, env, stdio: 'inherit' });
}

export { BIN };
