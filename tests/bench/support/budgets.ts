// The bench's comparison logic, pure: statistics over recorded samples, budgets as ratios to (or
// allowances over) the bare framework measured in the same run, and the run's verdict. A budget
// never compares with a fixed number of milliseconds: the machine's speed moves between runs and
// within one, so the app is always measured beside the floor, in interleaved repetitions (app,
// floor, app, floor…), and each budget reads the median over those pairs.

export interface Budget {
  name: string;
  value: number;
  op: '<=' | '>=' | '==';
  limit: number;
  unit?: string;
  met: boolean;
}

/** The q-quantile (0..1) of the numbers, nearest-rank. */
export function quantile(values: number[], q: number): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[rank] ?? NaN;
}

/** The median of the numbers (the mean of the middle two for an even count). */
export function median(values: number[]): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

/** Rounds to the given number of decimals. */
export const round = (x: number, decimals = 1) => Math.round(x * 10 ** decimals) / 10 ** decimals;

/** A budget line: the value, the comparison and whether it holds (a value that is not a number never does). */
export function budget(name: string, value: number, op: Budget['op'], limit: number, unit?: string): Budget {
  const met = op === '<=' ? value <= limit : op === '>=' ? value >= limit : value === limit;
  return { name, value, op, limit, unit, met: Number.isFinite(value) && met };
}

/** Samples of the app and of the floor taken in alternation: pair i is app[i] beside floor[i]. */
export interface Paired {
  app: number[];
  floor: number[];
}

function pairs(p: Paired): [number, number][] {
  if (p.app.length !== p.floor.length) throw new Error(`unpaired samples: ${p.app.length} of the app, ${p.floor.length} of the floor`);
  return p.app.map((a, i) => [a, p.floor[i] as number]);
}

/** The median over the pairs of app ÷ floor. */
export const pairedRatio = (p: Paired) => median(pairs(p).map(([a, f]) => a / f));

/** The median over the pairs of app − floor. */
export const pairedExtra = (p: Paired) => median(pairs(p).map(([a, f]) => a - f));

/** The app may cost at most `max` times the floor (median of the pairs' ratios). */
export const ratioBudget = (name: string, p: Paired, max: number) => budget(name, round(pairedRatio(p), 2), '<=', max, '× floor');

/** The app may take at most `allowance` more than the floor (median of the pairs' differences). */
export const extraBudget = (name: string, p: Paired, allowance: number, unit = 'ms') => budget(name, round(pairedExtra(p)), '<=', allowance, `${unit} over floor`);

// ---- The budgets of each bench, from its recorded figures ----

/** The sync bench's figures: 50 devices pushing and pulling at once, beside the floor's empty handler. */
export interface SyncFigures {
  /** p99 of a 50-op push, ms, per interleaved run. */
  pushP99Ms: Paired;
  /** CPU per request (push or pull) of the serving process, ms, per interleaved run. */
  cpuMsPerRequest: Paired;
  /** The route's ops/s ÷ the raw connector's ops/s, per back-to-back pair. */
  pushRawRatios: number[];
  /** Requests of the load that failed or answered wrongly. */
  errors: number;
}

export const SYNC_LIMITS = { pushP99Ratio: 2, cpuRatio: 2, pushRawRatio: 0.5 } as const;

export function syncBudgets(f: SyncFigures): Budget[] {
  return [
    ratioBudget('50 devices: p99 of a 50-op push', f.pushP99Ms, SYNC_LIMITS.pushP99Ratio),
    ratioBudget('50 devices: CPU per request', f.cpuMsPerRequest, SYNC_LIMITS.cpuRatio),
    budget('push route / raw insert rate', round(median(f.pushRawRatios), 3), '>=', SYNC_LIMITS.pushRawRatio),
    budget('50 devices: errors', f.errors, '==', 0),
  ];
}

/** The start-up bench's figures: long-task time of each page's load under a 4× slower CPU, beside the floor's. */
export interface StartupFigures {
  pages: { name: string; longTaskMs: Paired }[];
}

/**
 * What each page may add to the empty page's start-up work: a document (sign-in, the sheet) little
 * more than an empty page, the field book (which opens its offline store and syncs) a little more.
 */
export const STARTUP_ALLOWANCE_MS: Record<string, number> = { 'sign-in': 100, sheet: 100, 'field home': 200, capture: 200 };

export function startupBudgets(f: StartupFigures): Budget[] {
  return f.pages.map((page) => {
    const allowance = STARTUP_ALLOWANCE_MS[page.name];
    if (allowance === undefined) throw new Error(`no start-up allowance for the page "${page.name}"`);
    return extraBudget(`${page.name}: long-task time at 4× slower CPU`, page.longTaskMs, allowance);
  });
}

/** The Lighthouse bench's figures: each page's category scores, one per audit. */
export interface LighthouseFigures {
  pages: { name: string; performance: number[]; accessibility: number[]; bestPractices: number[] }[];
}

/**
 * Accessibility and best practices are budgets (they do not move with the machine); the performance
 * score swings ten points with the machine for unchanged code, so it is reported beside the floor's,
 * and the start-up bench budgets the work behind it instead.
 */
export function lighthouseBudgets(f: LighthouseFigures): Budget[] {
  return f.pages.flatMap((page) => [
    budget(`${page.name}: accessibility`, median(page.accessibility), '==', 100),
    budget(`${page.name}: best practices`, median(page.bestPractices), '>=', 95),
  ]);
}

/** The run's verdict: 0 when every bench ran and every budget held, 1 otherwise. */
export function verdict(budgets: Budget[], failedBenches: number): 0 | 1 {
  return failedBenches === 0 && budgets.length > 0 && budgets.every((b) => b.met) ? 0 : 1;
}
