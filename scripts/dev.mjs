// npm run dev – the same services as npm start, then `next dev` (no service worker in dev).
import { spawn } from 'node:child_process';
import { ensureEnvFile, loadEnv } from './lib/env.mjs';
import { ensureNodeModules } from './lib/proc.mjs';

ensureNodeModules();
ensureEnvFile();
loadEnv('local');
const { bringUpServices } = await import('./lib/stack.mjs');
const { stopDatabase } = await import('./lib/mariadb.mjs');
const { nodeBin } = await import('./lib/proc.mjs');

const { db, mail, tiles } = await bringUpServices();
const next = spawn(process.execPath, [nodeBin('next/dist/bin/next'), 'dev', '-H', process.env.HOST || '127.0.0.1', '-p', process.env.PORT || '3000'], {
  stdio: 'inherit',
  env: { ...process.env, NODE_ENV: 'development' },
});

async function stop() {
  next.kill('SIGTERM');
  await mail.close().catch(() => {});
  await tiles.close().catch(() => {});
  await stopDatabase(db);
  process.exit(0);
}
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());
