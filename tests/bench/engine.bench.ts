// Bench: screenSite with Monte Carlo at several sample counts (median of 11 runs after 3 warm-ups).
// Run: node node_modules/tsx/dist/cli.mjs tests/bench/engine.bench.ts  (or `npm run bench` for all benches)
import { screenSite, type SiteReadingsInput } from '@/lib/engine';
import { clearGo, conditionalSmallDeliveryPipe } from '@/tests/unit/engine/fixtures/demo-sites';

interface Row {
  name: string;
  samples: number;
  medianMs: number;
  minMs: number;
  maxMs: number;
}

const WARMUPS = 3;
const RUNS = 11;

function time(name: string, site: SiteReadingsInput, samples: number): Row {
  const input: SiteReadingsInput = { ...site, monteCarlo: { samples, seed: 1 } };
  for (let i = 0; i < WARMUPS; i++) screenSite(input);
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    screenSite(input);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const round = (x: number) => Math.round(x * 100) / 100;
  return { name, samples, medianMs: round(times[Math.floor(RUNS / 2)] ?? NaN), minMs: round(times[0] ?? NaN), maxMs: round(times[RUNS - 1] ?? NaN) };
}

const rows: Row[] = [
  time('screenSite clear go', clearGo, 1000),
  time('screenSite clear go', clearGo, 10000),
  time('screenSite long delivery run', conditionalSmallDeliveryPipe, 10000),
];

console.table(rows);
const key = rows.find((r) => r.samples === 10000);
console.log(`BENCH ${JSON.stringify({ bench: 'engine', runs: RUNS, warmups: WARMUPS, node: process.version, rows, headline: { label: 'screenSite, 10,000 samples, median', ms: key?.medianMs ?? null },
  budgets: rows.filter((r) => r.samples === 10000).map((r) => ({ name: `${r.name}, 10,000 samples, median in Node`, value: r.medianMs, op: '<=', limit: 50, unit: 'ms', met: r.medianMs <= 50 })) })}`);
