// npm run bench – runs every tests/bench/*.bench.ts with tsx (react-server conditions, so server code loads) in turn, merges their "BENCH {json}" lines
// into bench/results.json and prints a table. A bench that fails or prints no BENCH line fails the run.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const benchDir = path.join(root, 'tests', 'bench');
const tsx = path.join(root, 'node_modules', 'tsx', 'dist', 'cli.mjs');
const files = readdirSync(benchDir).filter((f) => f.endsWith('.bench.ts')).sort();

const results = [];
let failed = 0;
for (const file of files) {
  process.stdout.write(`bench: ${file}\n`);
  const run = spawnSync(process.execPath, [tsx, '--conditions=react-server', path.join('tests', 'bench', file)], { cwd: root, encoding: 'utf8' });
  process.stdout.write(run.stdout ?? '');
  process.stderr.write(run.stderr ?? '');
  const lines = (run.stdout ?? '').split('\n').filter((l) => l.startsWith('BENCH '));
  if (run.status !== 0 || lines.length === 0) {
    failed++;
    process.stderr.write(`bench: ${file} failed (exit ${run.status}, ${lines.length} BENCH line(s))\n`);
    continue;
  }
  for (const line of lines) results.push({ file, ...JSON.parse(line.slice('BENCH '.length)) });
}

mkdirSync(path.join(root, 'bench'), { recursive: true });
const out = { at: new Date().toISOString(), cpu: os.cpus()[0]?.model ?? 'unknown', cpus: os.cpus().length, node: process.version, results };
writeFileSync(path.join(root, 'bench', 'results.json'), `${JSON.stringify(out, null, 2)}\n`);

console.log('\nsummary');
console.table(results.flatMap((r) => (r.rows ?? []).map((row) => ({ bench: r.bench, ...row }))));
console.log(`wrote bench/results.json (${results.length} bench result(s), ${failed} failed)`);
process.exit(failed > 0 ? 1 : 0);
