import { execFileSync, spawnSync } from 'node:child_process';

/** The Debian packages the product's services come from; dpkg says whether each is installed. */
export type ServicePackage = 'postgresql' | 'redis-server' | 'chromium';

function installed(pkg: string): boolean {
  const r = spawnSync('dpkg-query', ['-W', '-f=${Status}', pkg], { encoding: 'utf8' });
  return r.status === 0 && r.stdout.includes('install ok installed');
}

/** Installs what is missing with apt-get, as root (or through sudo when it is there). */
export function ensureDebianPackages(pkgs: ServicePackage[]): void {
  const missing = pkgs.filter((p) => !installed(p));
  if (missing.length === 0) return;
  console.log(`[linewright] installing Debian packages: ${missing.join(', ')} …`);
  const asRoot = process.getuid?.() === 0;
  const run = (args: string[]) => {
    const [cmd, ...rest] = asRoot ? args : ['sudo', ...args];
    execFileSync(cmd, rest, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  };
  run(['apt-get', 'update', '-qq']);
  run(['apt-get', 'install', '-y', '-qq', '--no-install-recommends', ...missing]);
}
