// Bench: Lighthouse 12 (mobile emulation, simulated throttling: its defaults) in Debian's Chromium on the
// sign-in page, the field home and a sheet, and the empty App Router page (the floor) in the same run:
// accessibility and best practices as budgets, the performance score reported beside the floor's
// (it moves with the machine: the start-up bench budgets the work behind it), median of 7 runs, interleaved so every page sees the
// same machine load. Before each audit the bench waits for the machine to be quiet: an audit ends
// while the page's service worker may still be downloading its precache from the app server and the
// browser is shutting down, and on two cores that would weigh on the next page's audit (the field
// home after the sign-in page: 95 with no pause, 97 with a fixed 5 s one). Run with npm run bench (it
// serves the app and the floor).
import { spawnSync } from 'node:child_process';
import { pageBenchContext } from './support/demo';
import { waitForQuietMachine } from './support/proc';
import { lighthouseBudgets, median, type LighthouseFigures } from './support/budgets';
import { report } from './support/report';

const RUNS = 7;

interface Target { name: string; url: string; cookie?: string }
type Scores = {
  performance: number; accessibility: number; bestPractices: number; failing: string[]; metrics?: Record<string, number>;
  /** The page's own scripts that ran before its first paint, of all it ran (see lighthouse-run.mjs). */
  scripts?: { beforePaint: number; total: number; paintMs: number } | null;
};

/** One audit in a child process (plain Node, fresh browser: no cache or worker carried over). */
function audit(target: Target): Scores {
  const once = () => spawnSync(process.execPath, ['tests/bench/support/lighthouse-run.mjs', target.url, ...(target.cookie ? [target.cookie] : [])],
    { encoding: 'utf8', timeout: 180_000 });
  let run = once();
  // Lighthouse now and then loses the trace of a load (NO_NAVSTART: "Please run Lighthouse again"):
  // that says nothing about the page, so the audit is run again (twice at most).
  for (let retry = 0; retry < 2 && run.status !== 0 && /run Lighthouse again/.test(run.stderr); retry++) {
    console.log(`${target.name}: Lighthouse lost the trace, running the audit again`);
    run = once();
  }
  if (run.status !== 0) throw new Error(`Lighthouse failed on ${target.url}: ${run.stderr}`);
  const scores = JSON.parse(run.stdout.trim().split('\n').pop() ?? '{}') as Scores;
  if (scores.failing.length) console.log(`${target.name}: audits not passed: ${scores.failing.join(', ')}`);
  const s = scores.scripts;
  console.log(`${target.name}: performance ${scores.performance}, ${JSON.stringify(scores.metrics ?? {})}${s ? `, first paint at ${s.paintMs} ms with ${s.beforePaint} of ${s.total} scripts run before it` : ''}`);
  return scores;
}

async function main() {
  const { app, floorUrl, advisor, visitId, farmer } = await pageBenchContext();
  const targets: Target[] = [
    { name: 'empty App Router page (floor)', url: `${floorUrl}/` },
    { name: 'sign-in /login', url: `${app}/login` },
    { name: 'field home /field', url: `${app}/field`, cookie: advisor.header },
    { name: 'sheet /sheets/[visitId]', url: `${app}/sheets/${visitId}`, cookie: farmer.header },
  ];
  // Each page is asked for once before the audits, as the other benches warm their routes: the
  // first request of a route loads its server code (the sheet's first answer took 351 ms, the next
  // ones about 30), which says nothing about the page a running server serves.
  for (const target of targets) {
    const res = await fetch(target.url, { headers: target.cookie ? { cookie: target.cookie } : {} });
    await res.arrayBuffer();
    if (res.status !== 200) throw new Error(`${target.url} answered ${res.status}`);
  }
  const samples = new Map<string, Scores[]>();
  const waits: number[] = [];
  let notQuiet = 0;
  for (let run = 0; run < RUNS; run++) {
    for (const target of targets) {
      const settled = await waitForQuietMachine();
      waits.push(settled.waitedMs);
      if (!settled.quiet) notQuiet++;
      samples.set(target.name, [...(samples.get(target.name) ?? []), audit(target)]);
    }
  }
  const med = (name: string, key: 'performance' | 'accessibility' | 'bestPractices') => median((samples.get(name) ?? []).map((s) => s[key]));
  const floor = targets[0]!.name;
  const rows: Record<string, unknown>[] = targets.map((t) => ({
    name: t.name, performance: med(t.name, 'performance'), accessibility: med(t.name, 'accessibility'), bestPractices: med(t.name, 'bestPractices'),
    perfVsFloor: med(t.name, 'performance') - med(floor, 'performance'),
    runs: (samples.get(t.name) ?? []).map((s) => `${s.performance}/${s.accessibility}/${s.bestPractices}`).join(' '),
    // Per run: scripts run before the first paint, of all the page ran (the simulated LCP counts those).
    scriptsBeforePaint: (samples.get(t.name) ?? []).map((s) => (s.scripts ? `${s.scripts.beforePaint}/${s.scripts.total}` : '?')).join(' '),
  }));
  const scoresOf = (name: string, key: 'performance' | 'accessibility' | 'bestPractices') => (samples.get(name) ?? []).map((s) => s[key]);
  const figures: LighthouseFigures = {
    pages: targets.slice(1).map((t) => ({
      name: t.name,
      performance: scoresOf(t.name, 'performance'),
      accessibility: scoresOf(t.name, 'accessibility'),
      bestPractices: scoresOf(t.name, 'bestPractices'),
    })),
  };
  const budgets = lighthouseBudgets(figures);
  rows.push({ name: 'waits for a quiet machine before each audit (s)', runs: `median ${median(waits) / 1000}, longest ${Math.max(...waits) / 1000}, ${notQuiet} not quiet within 15 s` });
  report('lighthouse', rows, budgets, { lighthouse: '12.2.3', figures });
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
