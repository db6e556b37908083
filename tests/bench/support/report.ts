// Shared helpers of the benches: medians and percentiles, budgets, and the BENCH line the harness reads.

export interface Budget { name: string; value: number; op: '<=' | '>=' | '=='; limit: number; unit?: string; met: boolean }

/** The q-quantile (0..1) of the numbers, nearest-rank. */
export function quantile(values: number[], q: number): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[rank] ?? NaN;
}

/** The median of the numbers. */
export const median = (values: number[]) => quantile(values, 0.5);

/** Rounds to the given number of decimals. */
export const round = (x: number, decimals = 1) => Math.round(x * 10 ** decimals) / 10 ** decimals;

/** A budget line: the value, the comparison and whether it holds. */
export function budget(name: string, value: number, op: Budget['op'], limit: number, unit?: string): Budget {
  const met = op === '<=' ? value <= limit : op === '>=' ? value >= limit : value === limit;
  return { name, value, op, limit, unit, met: Number.isFinite(value) && met };
}

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
