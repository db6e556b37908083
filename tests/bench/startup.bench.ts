// Bench: the start-up work a phone's CPU does for each page. Debian's Chromium loads the page with
// its CPU slowed 4× (as Lighthouse's mobile audit assumes of a mid-range phone) in a fresh context
// (no cache, no service worker, no offline store), records a performance trace from the navigation
// until the load event has fired and the network has then been quiet for a second, and sums
// the page's main-thread tasks of 50 ms or more (the long tasks: what keeps a phone from answering
// a tap). The empty App Router page (the floor) is loaded the same way in alternation with each
// page (floor, page, floor, page…), and each page's budget is the median over the pairs of its
// long-task time minus the floor's. Run with npm run bench.
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from '@playwright/test';
import { median, pairedExtra, round, startupBudgets, type Paired } from './support/budgets';
import { pageBenchContext } from './support/demo';
import { waitForQuietMachine } from './support/proc';
import { report } from './support/report';
import { mainThreadWork, TraceWithoutPage, type MainThreadWork } from './support/trace';

const LOADS = Number(process.env.BENCH_STARTUP_LOADS) || 7;
const CPU_SLOWDOWN = 4;

interface Target {
  name: string;
  url: string;
  cookie?: { name: string; value: string };
}

/**
 * How long the network must stay quiet, from the load event on, for the page's start-up to count as
 * over: at 4× slower CPU a page hydrating after its load event goes several hundred milliseconds
 * before asking for its next chunk or starting its first sync.
 */
const QUIET_MS = 1000;

/**
 * Watches the page's requests (its workers' included) from before the navigation; `after()`, called
 * at the load event, resolves once no request has been in flight for QUIET_MS since. (Chromium's own
 * network-idle signal can fire before the load event while a throttled CPU evaluates scripts and
 * nothing is on the wire: a window closed then misses most of the start-up, floor and page alike.)
 */
function networkQuiet(page: Page): { after: () => Promise<void> } {
  let inFlight = 0;
  let lastChange = Date.now();
  page.on('request', () => {
    inFlight++;
    lastChange = Date.now();
  });
  const done = () => {
    inFlight = Math.max(0, inFlight - 1);
    lastChange = Date.now();
  };
  page.on('requestfinished', done);
  page.on('requestfailed', done);
  return {
    async after() {
      // The quiet counts from the load event: requests that ended before it say nothing of what follows.
      lastChange = Math.max(lastChange, Date.now());
      const deadline = Date.now() + 120_000;
      while (inFlight > 0 || Date.now() - lastChange < QUIET_MS) {
        if (Date.now() > deadline) throw new Error(`the network never went quiet (${inFlight} requests in flight)`);
        await new Promise((resolve) => setTimeout(resolve, 50));
      }
    },
  };
}

/**
 * One load, measured again (twice at most) when Chromium's trace lost the page's HTML parsing or its
 * load event: now and then a trace comes back without them, which says nothing about the page.
 */
async function load(browser: Browser, target: Target): Promise<MainThreadWork> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await loadOnce(browser, target);
    } catch (error) {
      if (attempt >= 3 || !(error instanceof TraceWithoutPage)) throw error;
      console.log(`${target.name}: the trace lost the page load, loading it again`);
    }
  }
}

/** One load in a fresh context: the trace's main-thread work from navigation to network idle. */
async function loadOnce(browser: Browser, target: Target): Promise<MainThreadWork> {
  const context = await browser.newContext({ viewport: { width: 412, height: 915 }, deviceScaleFactor: 2.625, isMobile: true, hasTouch: true });
  try {
    if (target.cookie) await context.addCookies([{ ...target.cookie, url: new URL(target.url).origin, httpOnly: true, sameSite: 'Lax' }]);
    const page = await context.newPage();
    const cdp = await context.newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });
    // BENCH_JS_PROF keeps a JavaScript CPU profile of each load beside the trace (which functions ran).
    if (process.env.BENCH_JS_PROF) {
      await cdp.send('Profiler.enable');
      await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
      await cdp.send('Profiler.start');
    }
    await browser.startTracing(page, { categories: ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'toplevel', 'blink.user_timing'] });
    const quiet = networkQuiet(page);
    const res = await page.goto(target.url, { waitUntil: 'load', timeout: 120_000 });
    if (res?.status() !== 200) throw new Error(`${target.url} answered ${res?.status()}`);
    await quiet.after();
    // A page that sent the reader elsewhere (a lost session to the sign-in page) is not the page measured.
    const landed = new URL(page.url()).pathname;
    if (landed !== new URL(target.url).pathname) throw new Error(`${target.name} ended on ${landed}, not the page asked for`);
    const raw = await browser.stopTracing();
    if (process.env.BENCH_JS_PROF) {
      const { profile } = await cdp.send('Profiler.stop');
      writeFileSync(path.join(process.env.BENCH_JS_PROF, `${target.name.replace(/\W+/g, '-')}-${Date.now()}.cpuprofile`), JSON.stringify(profile));
    }
    // BENCH_TRACE_DIR keeps each load's trace (open it in Chromium's performance panel).
    if (process.env.BENCH_TRACE_DIR) {
      mkdirSync(process.env.BENCH_TRACE_DIR, { recursive: true });
      writeFileSync(path.join(process.env.BENCH_TRACE_DIR, `${target.name.replace(/\W+/g, '-')}-${Date.now()}.json`), raw);
    }
    return mainThreadWork(JSON.parse(raw.toString('utf8')));
  } finally {
    await context.close();
  }
}

async function main() {
  const { app, floorUrl, advisor, visitId, farmer } = await pageBenchContext();
  const floor: Target = { name: 'floor', url: `${floorUrl}/` };
  let pages: Target[] = [
    { name: 'sign-in', url: `${app}/login` },
    { name: 'sheet', url: `${app}/sheets/${visitId}`, cookie: farmer },
    { name: 'field home', url: `${app}/field`, cookie: advisor },
    { name: 'capture', url: `${app}/field/visit/flow?id=${visitId}`, cookie: advisor },
  ];
  // BENCH_STARTUP_PAGES=sheet,capture measures only those pages (each still beside the floor).
  const only = process.env.BENCH_STARTUP_PAGES?.split(',').map((n) => n.trim());
  if (only) pages = pages.filter((p) => only.includes(p.name));
  const browser = await chromium.launch({ executablePath: process.env.CHROME_PATH || '/usr/bin/chromium', args: ['--no-sandbox', '--disable-dev-shm-usage'] });
  const samples = new Map<string, { app: MainThreadWork[]; floor: MainThreadWork[] }>(pages.map((p) => [p.name, { app: [], floor: [] }]));
  try {
    // One load of each first: the server's first answer of a route loads its code, and the
    // browser's first launch warms its own caches; neither says anything about the page.
    for (const target of [floor, ...pages]) await load(browser, target);
    for (let run = 0; run < LOADS; run++) {
      for (const target of pages) {
        // Alternating which of the pair goes first, so whatever one load leaves behind weighs on both alike.
        const order = run % 2 === 0 ? [floor, target] : [target, floor];
        for (const t of order) {
          await waitForQuietMachine({ maxMs: 3000 });
          const work = await load(browser, t);
          samples.get(target.name)![t === floor ? 'floor' : 'app'].push(work);
          console.log(`${t === floor ? `floor (beside ${target.name})` : target.name}: long tasks ${Math.round(work.longTaskMs)} ms, all tasks ${Math.round(work.taskMs)} ms`);
        }
      }
    }
  } finally {
    await browser.close();
  }
  const paired = (name: string, key: keyof MainThreadWork): Paired => {
    const s = samples.get(name)!;
    return { app: s.app.map((w) => w[key]), floor: s.floor.map((w) => w[key]) };
  };
  const figures = { pages: pages.map((p) => ({ name: p.name, longTaskMs: paired(p.name, 'longTaskMs') })) };
  const rows = pages.map((p) => {
    const long = paired(p.name, 'longTaskMs');
    const all = paired(p.name, 'taskMs');
    const longest = paired(p.name, 'longestMs');
    return {
      name: `${p.name} (floor beside it)`,
      longTaskMs: `${round(median(long.app))} (${round(median(long.floor))})`,
      overFloorMs: round(pairedExtra(long)),
      allTaskMs: `${round(median(all.app))} (${round(median(all.floor))})`,
      longestMs: `${round(median(longest.app))} (${round(median(longest.floor))})`,
      runs: long.app.map((a, i) => `${round(a, 0)}/${round(long.floor[i] ?? NaN, 0)}`).join(' '),
    };
  });
  // All main-thread work over the floor's is reported beside the budgets, not budgeted: it counts
  // the short tasks a phone fits between taps too.
  for (const p of pages) rows.push({ name: `${p.name}: all main-thread work over the floor`, longTaskMs: '', overFloorMs: round(pairedExtra(paired(p.name, 'taskMs'))), allTaskMs: '', longestMs: '', runs: '' });
  report('startup', rows, startupBudgets(figures), { figures, cpuSlowdown: CPU_SLOWDOWN });
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
