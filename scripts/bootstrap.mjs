// Plain Node (no TypeScript, no packages): runs before node_modules may exist.
// Installs npm packages when node_modules is absent or older than package-lock.json,
// then hands over to the TypeScript script named on the command line (through tsx).
import { spawnSync, spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const stamp = path.join(root, 'node_modules', '.linewright-lock-hash');

function lockHash() {
  const lock = path.join(root, 'package-lock.json');
  return createHash('sha256').update(readFileSync(existsSync(lock) ? lock : path.join(root, 'package.json'))).digest('hex');
}

function ensurePackages() {
  const want = lockHash();
  if (existsSync(stamp) && readFileSync(stamp, 'utf8') === want) return;
  console.log('[linewright] installing npm packages (node_modules is missing or out of date)…');
  const cmd = existsSync(path.join(root, 'package-lock.json')) ? ['ci', '--no-audit', '--no-fund'] : ['install'];
  const result = spawnSync('npm', cmd, { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    console.error('[linewright] npm install failed; see the messages above.');
    process.exit(result.status ?? 1);
  }
  writeFileSync(stamp, want);
}

const [script, ...rest] = process.argv.slice(2);
if (!script) {
  console.error('usage: node scripts/bootstrap.mjs <script.ts> [args]');
  process.exit(2);
}
ensurePackages();
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
const child = spawn(tsx, [path.join(root, script), ...rest], { cwd: root, stdio: 'inherit' });
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 130 : 1)));
