// Bench: 1,000 ops (5 pushes of 200 new points) through the push route handler on the test database,
// then the same 1,000 again as replays. Starts the test profile's MariaDB if it is not running.
// Run: node node_modules/tsx/dist/cli.mjs --conditions=react-server tests/bench/sync.bench.ts  (or `npm run bench`)
import { randomUUID } from 'node:crypto';
// @ts-expect-error – plain JS modules shared with the bootstrap scripts
import { loadEnv } from '../../scripts/lib/env.mjs';
// @ts-expect-error – as above
import { ensureDatabase, startDatabase, stopDatabase } from '../../scripts/lib/mariadb.mjs';
// @ts-expect-error – as above
import { runTs } from '../../scripts/lib/stack.mjs';

const OPS = 1000;
const BATCH = 200;

async function main() {
  const db = loadEnv('test');
  const started = await startDatabase(db);
  await ensureDatabase(db);
  runTs('scripts/migrate.ts', ['up']);
  const { makeOrganisation } = await import('../integration/support/fixtures');
  const { push, putOp } = await import('../integration/support/sync');
  const { closeSequelize } = await import('@/lib/server/db');
  try {
    const org = await makeOrganisation('bench');
    const ops = Array.from({ length: OPS }, (_, i) => putOp('point', randomUUID(), {
      visitId: org.visit.id, role: 'station', label: `Station ${i}`, lat: 52.4 + i / 1e5, lon: -3.6, accuracyM: 4,
      altitudeM: 230 + i / 100, altitudeAccuracyM: 6, chainageM: i, capturedAt: '2026-08-01T10:00:00Z',
    }));
    const run = async (label: string, expected: string) => {
      const batches: number[] = [];
      for (let i = 0; i < OPS; i += BATCH) {
        const t0 = performance.now();
        const { status, results } = await push(org.advisor, { ops: ops.slice(i, i + BATCH) });
        batches.push(performance.now() - t0);
        if (status !== 200 || results.some((r) => r.status !== expected)) throw new Error(`${label}: push answered ${status}`);
      }
      const totalMs = batches.reduce((a, b) => a + b, 0);
      const sorted = [...batches].sort((a, b) => a - b);
      const round = (x: number) => Math.round(x * 10) / 10;
      return { name: label, ops: OPS, batch: BATCH, totalMs: round(totalMs), opsPerSecond: Math.round((OPS / totalMs) * 1000),
        medianBatchMs: round(sorted[Math.floor(sorted.length / 2)] ?? NaN), maxBatchMs: round(sorted[sorted.length - 1] ?? NaN) };
    };
    const rows = [await run('push new points', 'applied'), await run('replay the same ops', 'replayed')];
    console.table(rows);
    console.log(`BENCH ${JSON.stringify({ bench: 'sync-push', node: process.version, rows,
      headline: { label: `push ${OPS} new ops in batches of ${BATCH}, ops/s`, value: rows[0]?.opsPerSecond ?? null } })}`);
  } finally {
    await closeSequelize();
    if (started) await stopDatabase(db);
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
