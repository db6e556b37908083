// npm start – set up everything on a fresh machine and serve Fallbook on http://localhost:3000.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { ensureEnvFile, loadEnv, root } from './lib/env.mjs';
import { log, ensureNodeModules } from './lib/proc.mjs';

const started = Date.now();
let stopping = false;
ensureNodeModules();
if (ensureEnvFile()) log('created .env from .env.example (with a fresh NEXTAUTH_SECRET)');
loadEnv('local');

// Imported after the packages are installed: these need node_modules.
const { bringUpServices } = await import('./lib/stack.mjs');
const { ensureBuild } = await import('./lib/build.mjs');
const { stopDatabase } = await import('./lib/mariadb.mjs');
const { DEMO_ACCOUNTS_TEXT } = await import('./lib/demo-accounts.mjs');
const { nodeBin } = await import('./lib/proc.mjs');

const { db, mail, tiles } = await bringUpServices();
ensureBuild();

const port = process.env.PORT || '3000';
const host = process.env.HOST || '127.0.0.1';
const next = spawn(
  process.execPath,
  ['--import', pathToFileURL(path.join(root, 'scripts/lib/refuse-trace.mjs')).href, nodeBin('next/dist/bin/next'), 'start', '-H', host, '-p', port],
  {
    stdio: 'inherit',
    env: { ...process.env, NODE_ENV: 'production' },
  },
);

// The scheduled jobs (the daily digest) run in a process of their own beside the app: one per start,
// however many app servers share the database.
const jobs = spawn(process.execPath, [nodeBin('tsx/dist/cli.mjs'), '--conditions=react-server', 'scripts/digest-job.ts'], {
  cwd: root,
  stdio: 'inherit',
  env: { ...process.env, NODE_ENV: 'production' },
});
jobs.on('exit', (code) => {
  if (code && !stopping) log(`the scheduled jobs stopped (exit ${code}); the app keeps running without the daily digest`);
});

if (await waitForHealth(`http://127.0.0.1:${port}/api/health`)) {
  log(`ready in ${((Date.now() - started) / 1000).toFixed(1)} s: open ${process.env.NEXTAUTH_URL || `http://localhost:${port}`}`);
  process.stdout.write(DEMO_ACCOUNTS_TEXT);
}

async function waitForHealth(url, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until && !stopping) {
    try {
      if ((await fetch(url)).ok) return true;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

async function stop(code = 0) {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  next.kill('SIGTERM');
  jobs.kill('SIGTERM');
  await mail.close().catch(() => {});
  await tiles.close().catch(() => {});
  await stopDatabase(db);
  log('stopped');
  process.exit(code);
}
process.on('SIGINT', () => void stop(0));
process.on('SIGTERM', () => void stop(0));
next.on('exit', (code) => void stop(code ?? 0));
