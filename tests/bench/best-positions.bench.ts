// Bench: bestPositions over an invented 500-station reach (124,750 pairs), median of 5 runs after 1 warm-up.
// Run: node node_modules/tsx/dist/cli.mjs tests/bench/best-positions.bench.ts  (or `npm run bench` for all benches)
import { bestPositions, type BestPositionsInput, type ProfileStation } from '@/lib/engine';

const WARMUPS = 1;
const RUNS = 5;

/** An invented creek: 2.5 km at 5 m spacing, a gentle bed with a 3 m cascade every 150 m and pools; every 37th station floods. */
function reach(n: number): BestPositionsInput {
  const stations: ProfileStation[] = Array.from({ length: n }, (_, i) => {
    const c = i * 5;
    return { id: `s${i}`, chainageM: c, levelM: 200 - 0.03 * c - 3 * Math.floor(c / 150) - 1.5 * Math.sin(c / 40), flags: i % 37 === 0 ? ['no-pump-site'] : [] };
  });
  return {
    stations,
    tank: { chainageM: 1200, offsetM: 150, levelM: 200 },
    flowMeasurements: [{ method: 'volumetric', season: 'dry', trials: [{ volumeL: 20, seconds: 10 }, { volumeL: 20, seconds: 11 }] }],
    demand: [{ kind: 'beef-cow-nursing', count: 20 }, { kind: 'person-tap-on-plot', count: 4 }],
  };
}

interface Row { name: string; stations: number; pairs: number; feasible: number; screenedInFull: number; medianMs: number; minMs: number; maxMs: number }

function time(n: number): Row {
  const input = reach(n);
  let last = bestPositions(input);
  for (let i = 1; i < WARMUPS; i++) bestPositions(input);
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    last = bestPositions(input);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const round = (x: number) => Math.round(x * 10) / 10;
  return {
    name: 'bestPositions 200 ranking + 10,000 full draws', stations: n, pairs: last.pairsConsidered, feasible: last.pairsFeasible, screenedInFull: last.screenedInFull,
    medianMs: round(times[Math.floor(RUNS / 2)] ?? NaN), minMs: round(times[0] ?? NaN), maxMs: round(times[RUNS - 1] ?? NaN),
  };
}

const rows = [time(100), time(500)];
console.table(rows);
const key = rows.find((r) => r.stations === 500);
console.log(`BENCH ${JSON.stringify({ bench: 'best-positions', runs: RUNS, warmups: WARMUPS, node: process.version, rows, headline: { label: 'bestPositions, 500 stations, median', ms: key?.medianMs ?? null } })}`);
