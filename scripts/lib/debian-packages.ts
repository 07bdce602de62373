// Makes sure the Debian packages the project needs are present. Installs them with apt-get when we
// run as root (a fresh lab machine or CI); otherwise stops with the exact command to run.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export interface DebianPackage {
  name: string;
  /** A file the package installs; its presence means the package is there. */
  probe: string;
}

export const MARIADB: DebianPackage = { name: 'mariadb-server', probe: '/usr/sbin/mariadbd' };
export const CHROMIUM: DebianPackage = { name: 'chromium', probe: '/usr/bin/chromium' };
export const POPPLER: DebianPackage = { name: 'poppler-utils', probe: '/usr/bin/pdftoppm' };
// `npm run cluster` also needs galera-4, mariadb-backup, socat (scripts/lib/galera.ts) and
// haproxy (scripts/lib/haproxy.ts); they are declared beside the code that uses them.

export function ensureDebianPackages(packages: DebianPackage[]): void {
  const missing = packages.filter((p) => !existsSync(p.probe));
  if (missing.length === 0) return;
  const names = missing.map((p) => p.name).join(' ');
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) {
    throw new Error(`Voltcrib needs the Debian package(s) ${names}. Run as root:\n  apt-get update && apt-get install -y ${names}`);
  }
  console.log(`[setup] installing Debian package(s): ${names} (about a minute)…`);
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  const result = spawnSync('apt-get', ['install', '-y', '-qq', ...missing.map((p) => p.name)], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  if (result.status !== 0) throw new Error(`apt-get install ${names} failed (exit ${result.status})`);
}
