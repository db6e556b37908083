// Small process helpers for the bootstrap scripts.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { root } from './env.mjs';

export function log(message) {
  process.stdout.write(`[fallbook] ${message}\n`);
}

export function fail(message) {
  process.stderr.write(`[fallbook] ${message}\n`);
  process.exit(1);
}

/** Runs a command to completion with inherited output; throws on a non-zero exit. */
export function run(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: 'inherit', cwd: root, ...options });
  if (result.error) throw result.error;
  if (result.status !== 0) {
    throw new Error(`${command} ${args.join(' ')} exited with ${result.status}`);
  }
}

/** Runs a command and resolves with its exit code (never throws on failure). */
export function runAsync(command, args, options = {}) {
  return new Promise((resolve) => {
    const child = spawn(command, args, { stdio: 'inherit', cwd: root, ...options });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on('error', () => resolve(1));
  });
}

export function isRoot() {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

export function hasCommand(file) {
  return ['/usr/sbin', '/usr/bin', '/sbin', '/bin'].some((dir) => existsSync(path.join(dir, file)));
}

/** Installs Debian packages when a needed program is missing (root only). */
export function ensureDebianPackages(packages, probe) {
  if (hasCommand(probe)) return;
  if (!isRoot()) {
    fail(`${probe} is missing. Install it with: sudo apt-get install -y ${packages.join(' ')}`);
  }
  log(`installing ${packages.join(', ')} from Debian's packages (once)…`);
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages], {
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

/** Runs `npm ci` when node_modules is missing or older than the lock file. */
export function ensureNodeModules() {
  const lock = path.join(root, 'package-lock.json');
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  log('installing npm packages (npm ci)…');
  run('npm', ['ci', '--no-audit', '--no-fund']);
}

export function readJson(file) {
  return JSON.parse(readFileSync(file, 'utf8'));
}

/** Node binary path of a package's CLI, run with the current Node. */
export function nodeBin(relative) {
  return path.join(root, 'node_modules', relative);
}
