// Shared helpers of the benches: the BENCH line the harness reads, and the served app and floor.
import type { Budget } from './budgets';

/** Prints the rows and the machine-readable line that scripts/bench.mjs merges. */
export function report(bench: string, rows: Record<string, unknown>[], budgets: Budget[], extra: Record<string, unknown> = {}) {
  console.table(rows);
  for (const b of budgets) console.log(`${b.met ? 'ok    ' : 'MISSED'} ${b.name}: ${b.value}${b.unit ? ` ${b.unit}` : ''} (budget ${b.op} ${b.limit})`);
  console.log(`BENCH ${JSON.stringify({ bench, node: process.version, rows, budgets, ...extra })}`);
}

/** The base URL of the app the harness serves (npm run bench), or of a server started by hand. */
export function appUrl(): string {
  const url = process.env.BENCH_APP_URL;
  if (!url) throw new Error('BENCH_APP_URL is not set: run the benches with npm run bench');
  return url;
}

/** The empty App Router app the harness serves beside it (the bare-framework floor): URL and process id. */
export function floorApp(): { url: string; pid: number } {
  const url = process.env.BENCH_FLOOR_URL;
  const pid = Number(process.env.BENCH_FLOOR_PID);
  if (!url || !pid) throw new Error('BENCH_FLOOR_URL and BENCH_FLOOR_PID are not set: run the benches with npm run bench');
  return { url, pid };
}
