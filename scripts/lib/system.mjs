// Installs what a fresh Debian machine lacks: npm packages from the lock file and Debian packages.
import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';

export const root = new URL('../..', import.meta.url).pathname.replace(/\/$/, '');

export function run(cmd, args, options = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...options });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} exited with ${r.status ?? r.signal}`);
  return r;
}

export function has(command) {
  return spawnSync('sh', ['-c', `command -v ${command}`], { stdio: 'ignore' }).status === 0;
}

/** npm packages from the lock file, when node_modules is missing or older than the lock. */
export function ensureNodeModules() {
  const installed = join(root, 'node_modules', '.package-lock.json');
  // npm writes its own copy of the lock when it installs; a lock changed since then (a pull that
  // adds a package) means node_modules is stale.
  if (existsSync(installed) && statSync(installed).mtimeMs >= statSync(join(root, 'package-lock.json')).mtimeMs) return;
  console.log('Installing npm packages from package-lock.json …');
  run('npm', ['ci', '--no-audit', '--no-fund']);
}

/** Debian packages by the command each one provides; installs the missing ones in one apt run. */
export function ensureDebianPackages(wanted) {
  const missing = Object.entries(wanted).filter(([command]) => !has(command)).map(([, pkg]) => pkg);
  if (missing.length === 0) return;
  if (process.getuid && process.getuid() !== 0) {
    throw new Error(`Missing Debian packages: ${missing.join(' ')}. Install them as root: apt-get install -y ${missing.join(' ')}`);
  }
  console.log(`Installing Debian packages: ${missing.join(' ')} …`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update', '-q'], { env, stdio: ['ignore', 'ignore', 'inherit'] });
  run('apt-get', ['install', '-y', '-q', '--no-install-recommends', ...missing], { env, stdio: ['ignore', 'ignore', 'inherit'] });
}
