// Builds the app only when its sources changed since the last build (a content hash stamp).
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { root } from './env.mjs';
import { log, nodeBin, run } from './proc.mjs';

const INPUTS = [
  'app',
  'components',
  'lib',
  'models',
  'public',
  'fonts',
  'worker',
  'proxy.ts',
  'next.config.mjs',
  'tailwind.config.ts',
  'postcss.config.mjs',
  'tsconfig.json',
  'package-lock.json',
];
const STAMP = path.join(root, '.next', 'fallbook-build-stamp');
const SKIP = new Set(['sw.js', 'sw.js.map']);

function walk(dir, hash) {
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, hash);
    else if (!SKIP.has(entry.name) && !entry.name.startsWith('swe-worker')) {
      hash.update(path.relative(root, full));
      hash.update(readFileSync(full));
    }
  }
}

export function sourceHash() {
  const hash = createHash('sha256');
  // NEXT_PUBLIC_* values are compiled into the pages: a change must rebuild.
  for (const [key, value] of Object.entries(process.env)
    .filter(([k, v]) => k.startsWith('NEXT_PUBLIC_') && v)
    .sort())
    hash.update(`${key}=${value}`);
  // The security headers are fixed at build time, and HSTS is sent only when NEXTAUTH_URL is https.
  hash.update(`https=${(process.env.NEXTAUTH_URL ?? '').startsWith('https://')}`);
  // A profiled bench builds with the server's names kept (see below).
  hash.update(`profiled=${Boolean(process.env.BENCH_CPU_PROF)}`);
  for (const input of INPUTS) {
    const full = path.join(root, input);
    if (!existsSync(full)) continue;
    if (statSync(full).isDirectory()) walk(full, hash);
    else hash.update(input).update(readFileSync(full));
  }
  return hash.digest('hex');
}

/** Runs `next build && serwist build` unless the stamp matches the current sources. */
export function ensureBuild({ force = false } = {}) {
  const hash = sourceHash();
  const built = existsSync(STAMP) && readFileSync(STAMP, 'utf8') === hash && existsSync(path.join(root, 'public', 'sw.js'));
  if (built && !force) {
    log('build is up to date');
    return false;
  }
  log('building the app (next build + serwist build)…');
  const env = { ...process.env, NODE_ENV: 'production', NEXT_TELEMETRY_DISABLED: '1' };
  // CPU profiles of the served app (BENCH_CPU_PROF) name its functions: the server bundle keeps them.
  run(process.execPath, [nodeBin('next/dist/bin/next'), 'build', ...(process.env.BENCH_CPU_PROF ? ['--no-mangling'] : [])], { env });
  run(process.execPath, [nodeBin('@serwist/cli/cli.js'), 'build', 'worker/serwist.config.mjs'], { env });
  writeFileSync(STAMP, hash);
  return true;
}
