// Machine set-up shared by `npm start` and `npm test`. Node built-ins only: this runs before
// node_modules exists on a fresh machine.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync, readdirSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';

export const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..', '..');

export function log(message) {
  process.stdout.write(`\x1b[32m[lapwing]\x1b[0m ${message}\n`);
}

export function fail(message) {
  process.stderr.write(`\x1b[31m[lapwing]\x1b[0m ${message}\n`);
  process.exit(1);
}

/** Runs a command to completion with inherited output; exits the process with a message on failure. */
export function run(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: 'inherit', cwd: root, ...options });
  if (result.error) fail(`${command} could not start: ${result.error.message}`);
  if (result.status !== 0) fail(`${command} ${args.join(' ')} failed with exit code ${result.status}`);
}

const isRoot = process.getuid?.() === 0;

/** Prefixes a command with sudo when we are not root and sudo exists. */
function asAdmin(command, args) {
  if (isRoot) return [command, args];
  return ['sudo', ['-n', command, ...args]];
}

/**
 * Installs the npm dependencies when node_modules is missing or was installed from another
 * package-lock.json. The lock's hash is stamped into node_modules after a successful install.
 */
export function ensureNodeModules() {
  const lockPath = path.join(root, 'package-lock.json');
  const stampPath = path.join(root, 'node_modules', '.lapwing-lock-hash');
  const lockHash = createHash('sha256').update(readFileSync(lockPath)).digest('hex');
  if (existsSync(stampPath) && readFileSync(stampPath, 'utf8') === lockHash) return;
  // A clean install on a fresh clone; an in-place sync when node_modules exists but is stale.
  const fresh = !existsSync(path.join(root, 'node_modules'));
  log(`Installing npm dependencies (npm ${fresh ? 'ci' : 'install'})…`);
  run('npm', [fresh ? 'ci' : 'install', '--no-audit', '--no-fund']);
  writeFileSync(stampPath, lockHash);
}

/** Installs Debian packages with apt when `isPresent()` says they are missing. */
export function ensureAptPackages(packages, isPresent) {
  if (isPresent()) return;
  log(`Installing ${packages.join(', ')} with apt (one time)…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run(...asAdmin('apt-get', ['update', '-qq']), { env });
  run(...asAdmin('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages]), { env });
  if (!isPresent()) fail(`apt installed ${packages.join(', ')} but they are still not usable.`);
}

/** The bin folder of the newest PostgreSQL server installed from Debian's packages, or null. */
export function postgresBinDir() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base)
    .filter((v) => existsSync(path.join(base, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], 'bin') : null;
}

export function ensurePostgres() {
  ensureAptPackages(['postgresql'], () => postgresBinDir() !== null);
  return postgresBinDir();
}

export function ensureChromium() {
  ensureAptPackages(['chromium'], () => existsSync('/usr/bin/chromium'));
}

/** A TCP port that is free on 127.0.0.1 right now. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

/** True when something accepts connections on 127.0.0.1:port. */
export function portInUse(port) {
  return new Promise((resolve) => {
    const server = createServer();
    server.once('error', () => resolve(true));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(false)));
  });
}
