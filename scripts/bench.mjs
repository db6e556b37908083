// npm run bench – sets up like npm test (test profile database, demo data, fake mail, the production build),
// builds the empty App Router floor app, serves both, then runs every tests/bench/*.bench.ts with tsx
// (react-server conditions, so server code loads) in turn. Each bench prints "BENCH {json}" lines with rows,
// recorded figures and budgets; the run is appended to the dated history in bench/results.json and printed
// as tables. Exit 1 on a failed bench or a missed budget, by the verdict of tests/bench/support/budgets.ts
// (unit-tested on recorded figures); never part of npm test. Pass names to run only some benches:
// npm run bench -- sync office
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadEnv, root } from './lib/env.mjs';
import { ensureDebianPackages, ensureNodeModules, log } from './lib/proc.mjs';

const started = Date.now();
ensureNodeModules();
ensureDebianPackages(['chromium'], 'chromium');
loadEnv('test');
// The pages are measured as `npm start` serves them: without the e2e tests' hooks, which a test build
// loads on every field page (the app's save and sync modules, Dexie with them) before anything else.
// A bench after `npm test` therefore builds once more (the build stamp includes NEXT_PUBLIC_* values).
process.env.NEXT_PUBLIC_FALLBOOK_TEST_HOOKS = '';

const { bringUpServices } = await import('./lib/stack.mjs');
const { ensureBuild } = await import('./lib/build.mjs');
const { ensureFloorBuild, floorDir } = await import('./lib/floor-app.mjs');
const { startNext } = await import('./lib/next-server.mjs');
const { stopDatabase } = await import('./lib/mariadb.mjs');

const wanted = process.argv.slice(2).filter((a) => !a.startsWith('-'));
const benchDir = path.join(root, 'tests', 'bench');
const tsx = path.join(root, 'node_modules', 'tsx', 'dist', 'cli.mjs');
const files = readdirSync(benchDir)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => wanted.length === 0 || wanted.some((w) => f.startsWith(w)))
  .sort();

/** Runs a bench with its output shown as it comes; resolves with its exit status and stdout. */
function runStreaming(args, env) {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, args, { cwd: root, env, stdio: ['ignore', 'pipe', 'inherit'] });
    let stdout = '';
    child.stdout.on('data', (chunk) => {
      stdout += chunk;
      process.stdout.write(chunk);
    });
    child.on('exit', (code, signal) => resolve({ status: code ?? (signal ? 1 : 0), stdout }));
  });
}

const { db, startedDb, mail, tiles } = await bringUpServices({ freshDatabase: true });
const servers = [];
const results = [];
let failed = 0;
try {
  ensureBuild();
  ensureFloorBuild();
  const port = Number(process.env.PORT);
  const app = await startNext({ cwd: root, port, probe: '/api/health', label: 'app' });
  servers.push(app);
  // The floor listens a few ports above the app, inside this checkout's offset band.
  const floor = await startNext({ cwd: floorDir, port: port + 5, label: 'floor' });
  servers.push(floor);
  const env = { ...process.env, BENCH_APP_URL: app.url, BENCH_APP_PID: String(app.pid), BENCH_FLOOR_URL: floor.url, BENCH_FLOOR_PID: String(floor.pid) };

  for (const file of files) {
    process.stdout.write(`\nbench: ${file}\n`);
    const run = await runStreaming([tsx, '--conditions=react-server', path.join('tests', 'bench', file)], env);
    const lines = (run.stdout ?? '').split('\n').filter((l) => l.startsWith('BENCH '));
    if (run.status !== 0 || lines.length === 0) {
      failed++;
      process.stderr.write(`bench: ${file} failed (exit ${run.status}, ${lines.length} BENCH line(s))\n`);
    }
    for (const line of lines) results.push({ file, ...JSON.parse(line.slice('BENCH '.length)) });
  }
} finally {
  for (const server of servers.reverse()) await server.stop();
  await mail.close().catch(() => {});
  await tiles.close().catch(() => {});
  if (startedDb || process.env.CI) await stopDatabase(db);
}

// The dated history: every run is kept (its figures, budgets and machine), newest last. A partial run
// (names given) also carries the other benches' latest results, so the last entry is always whole.
const resultsFile = path.join(root, 'bench', 'results.json');
const history = existsSync(resultsFile) ? JSON.parse(readFileSync(resultsFile, 'utf8')) : { runs: [] };
const runs = Array.isArray(history.runs) ? history.runs : [];
if (wanted.length > 0 && runs.length > 0) {
  const ran = new Set(results.map((r) => r.bench));
  results.unshift(...runs[runs.length - 1].results.filter((r) => !ran.has(r.bench)));
}
const budgets = results.flatMap((r) => (r.budgets ?? []).map((b) => ({ bench: r.bench, ...b })));
const missed = budgets.filter((b) => !b.met);
const { tsImport } = await import('tsx/esm/api');
const { verdict } = await tsImport('../tests/bench/support/budgets.ts', import.meta.url);
const exitCode = verdict(budgets, failed);
mkdirSync(path.join(root, 'bench'), { recursive: true });
const run = {
  at: new Date().toISOString(),
  benches: wanted.length > 0 ? wanted : 'all',
  verdict: exitCode === 0 ? 'green' : 'red',
  cpu: os.cpus()[0]?.model ?? 'unknown',
  cpus: os.cpus().length,
  node: process.version,
  results,
  budgets,
};
writeFileSync(resultsFile, `${JSON.stringify({ runs: [...runs, run] }, null, 1)}\n`);

console.log('\nfigures');
console.table(results.flatMap((r) => (r.rows ?? []).map((row) => ({ bench: r.bench, ...row }))));
console.log('budgets');
console.table(
  budgets.map((b) => ({ bench: b.bench, budget: b.name, value: b.value, limit: `${b.op} ${b.limit}`, unit: b.unit ?? '', met: b.met ? 'yes' : 'MISSED' })),
);
log(
  `added this run to bench/results.json (${results.length} bench result(s), ${failed} failed, ${budgets.length - missed.length}/${budgets.length} budgets met) in ${((Date.now() - started) / 1000).toFixed(0)} s`,
);
process.exit(exitCode);
