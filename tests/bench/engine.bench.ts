// Bench: screenSite with Monte Carlo at several sample counts (median of 11 runs after 3 warm-ups),
// in Node and the same runs in Chromium (Debian's, headless: the phone's JavaScript engine), there
// also with Lighthouse's mobile CPU slowdown (4×) as an estimate for a mid-range phone.
// Run: node node_modules/tsx/dist/cli.mjs tests/bench/engine.bench.ts  (or `npm run bench` for all benches)
import path from 'node:path';
import { chromium } from '@playwright/test';
import { build } from 'esbuild';
import type { SiteReadingsInput } from '@/lib/engine';
import { timeScreening } from './support/time-screening';
import { clearGo, conditionalSmallDeliveryPipe } from '@/tests/unit/engine/fixtures/demo-sites';

interface Row {
  name: string;
  engine: string;
  samples: number;
  medianMs: number;
  minMs: number;
  maxMs: number;
}

const WARMUPS = 3;
const RUNS = 11;

function time(name: string, site: SiteReadingsInput, samples: number): Row {
  return summary(name, 'node', samples, timeScreening(site, samples, WARMUPS, RUNS));
}

function summary(name: string, engine: string, samples: number, times: number[]): Row {
  const sorted = [...times].sort((a, b) => a - b);
  const round = (x: number) => Math.round(x * 100) / 100;
  return { name, engine, samples, medianMs: round(sorted[Math.floor(sorted.length / 2)] ?? NaN), minMs: round(sorted[0] ?? NaN), maxMs: round(sorted[sorted.length - 1] ?? NaN) };
}

const CASES: [string, SiteReadingsInput, number][] = [
  ['screenSite clear go', clearGo, 1000],
  ['screenSite clear go', clearGo, 10000],
  ['screenSite long delivery run', conditionalSmallDeliveryPipe, 10000],
];

/** The same cases in Chromium: the engine bundled for the browser, timed inside the page. */
async function inChromium(): Promise<Row[]> {
  const bundled = await build({
    entryPoints: [path.join(process.cwd(), 'tests/bench/support/engine-in-browser.ts')],
    bundle: true, format: 'iife', platform: 'browser', target: 'es2022', write: false, logLevel: 'silent',
  });
  const script = bundled.outputFiles[0]?.text;
  if (!script) throw new Error('the engine bundle is empty');
  const browser = await chromium.launch({ executablePath: process.env.CHROME_PATH || '/usr/bin/chromium' });
  try {
    const rows: Row[] = [];
    for (const [engine, slowdown] of [['chromium', 1], ['chromium, 4× CPU slowdown', 4]] as const) {
      const page = await browser.newPage();
      await page.goto('about:blank');
      if (slowdown > 1) await (await page.context().newCDPSession(page)).send('Emulation.setCPUThrottlingRate', { rate: slowdown });
      await page.addScriptTag({ content: script });
      for (const [name, , samples] of CASES) {
        const times = await page.evaluate(([n, s, w, r]) => (globalThis as unknown as { fallbookEngineBench(n: string, s: number, w: number, r: number): number[] }).fallbookEngineBench(n, s, w, r),
          [name, samples, WARMUPS, RUNS] as const);
        rows.push(summary(name, engine, samples, times));
      }
      await page.close();
    }
    return rows;
  } finally {
    await browser.close();
  }
}

async function main() {
  const rows: Row[] = [...CASES.map(([name, site, samples]) => time(name, site, samples)), ...await inChromium()];
  console.table(rows);
  const key = rows.find((r) => r.samples === 10000 && r.engine === 'node');
  console.log(`BENCH ${JSON.stringify({ bench: 'engine', runs: RUNS, warmups: WARMUPS, node: process.version, rows, headline: { label: 'screenSite, 10,000 samples, median', ms: key?.medianMs ?? null },
    budgets: rows.filter((r) => r.samples === 10000 && r.engine === 'node').map((r) => ({ name: `${r.name}, 10,000 samples, median in Node`, value: r.medianMs, op: '<=', limit: 50, unit: 'ms', met: r.medianMs <= 50 })) })}`);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
