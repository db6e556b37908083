// npm test – own set-up (throwaway database on its own port), then vitest and Playwright.
// Ends with "N passed, N failed" and a non-zero exit on any failure.
// Options: --only unit|integration|e2e (repeatable); anything after -- goes to the runners as filters.
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { loadEnv, root } from './lib/env.mjs';
import { ensureDebianPackages, ensureNodeModules, log, nodeBin, runAsync } from './lib/proc.mjs';

const argv = process.argv.slice(2);
const dashDash = argv.indexOf('--');
const filters = dashDash >= 0 ? argv.slice(dashDash + 1) : [];
const opts = dashDash >= 0 ? argv.slice(0, dashDash) : argv;
const only = opts.flatMap((a, i) => (a === '--only' && opts[i + 1] ? [opts[i + 1]] : []));
const wants = (part) => only.length === 0 || only.includes(part);

const started = Date.now();
ensureNodeModules();
if (wants('e2e')) ensureDebianPackages(['chromium'], 'chromium');
loadEnv('test');

const { bringUpServices } = await import('./lib/stack.mjs');
const { ensureBuild } = await import('./lib/build.mjs');
const { stopDatabase } = await import('./lib/mariadb.mjs');

const results = path.join(root, '.data', 'test-results');
rmSync(results, { recursive: true, force: true });
mkdirSync(results, { recursive: true });

const { db, startedDb, mail, tiles } = await bringUpServices({ freshDatabase: true });
const totals = { passed: 0, failed: 0 };

function readJson(file) {
  return existsSync(file) ? JSON.parse(readFileSync(file, 'utf8')) : null;
}

try {
  if (wants('unit') && filters.length === 0) {
    // One formatter for the code: a file Prettier would change is a failure.
    const code = await runAsync(process.execPath, [nodeBin('prettier/bin/prettier.cjs'), '--check', '--log-level', 'warn', '.']);
    if (code === 0) totals.passed += 1;
    else totals.failed += 1;
    log(`format: ${code === 0 ? 'every file as Prettier writes it' : 'files above differ from Prettier (npm run format fixes them)'}`);
  }
  const projects = ['unit', 'integration'].filter(wants);
  if (projects.length) {
    const out = path.join(results, 'vitest.json');
    const code = await runAsync(process.execPath, [
      nodeBin('vitest/vitest.mjs'),
      'run',
      ...projects.flatMap((p) => ['--project', p]),
      '--reporter=default',
      '--reporter=json',
      `--outputFile.json=${out}`,
      ...filters,
    ]);
    const report = readJson(out);
    const passed = report?.numPassedTests ?? 0;
    // Files that failed without a failing test (e.g. an import error) count once each.
    const brokenFiles = (report?.testResults ?? []).filter((f) => f.status === 'failed' && !f.assertionResults?.some((a) => a.status === 'failed')).length;
    let failed = (report?.numFailedTests ?? 0) + brokenFiles;
    if (code !== 0 && failed === 0) failed = 1; // the runner itself failed
    totals.passed += passed;
    totals.failed += failed;
    log(`vitest: ${passed} passed, ${failed} failed`);
  }

  if (wants('e2e')) {
    try {
      ensureBuild();
    } catch (error) {
      log(`build failed: ${error.message}`);
      totals.failed += 1;
      throw error;
    }
    const out = path.join(results, 'playwright.json');
    const code = await runAsync(process.execPath, [nodeBin('@playwright/test/cli.js'), 'test', ...filters], {
      env: { ...process.env, PLAYWRIGHT_JSON_OUTPUT_NAME: out },
    });
    const stats = readJson(out)?.stats;
    const passed = (stats?.expected ?? 0) + (stats?.flaky ?? 0);
    let failed = stats?.unexpected ?? 0;
    if (code !== 0 && failed === 0) failed = 1;
    totals.passed += passed;
    totals.failed += failed;
    log(`playwright: ${passed} passed, ${failed} failed`);
  }
} catch {
  // Counted above; fall through to the summary line.
} finally {
  await mail.close().catch(() => {});
  await tiles.close().catch(() => {});
  if (startedDb || process.env.CI) await stopDatabase(db);
}

log(`finished in ${((Date.now() - started) / 1000).toFixed(0)} s`);
process.stdout.write(`${totals.passed} passed, ${totals.failed} failed\n`);
process.exit(totals.failed > 0 || totals.passed === 0 ? 1 : 0);
