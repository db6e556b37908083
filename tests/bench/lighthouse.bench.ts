// Bench: Lighthouse 12 (mobile emulation, simulated throttling: its defaults) in Debian's Chromium on the
// sign-in page, the field home and a sheet, and the empty App Router page (the floor) in the same run:
// performance, accessibility and best practices, median of 3 runs, interleaved so every page sees the
// same machine load. Run with npm run bench (it serves the app and the floor).
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { demoCookie, screenedVisitOf } from './support/demo';
import { appUrl, budget, median, report } from './support/report';

const RUNS = 3;
const CHROME_PATH = process.env.CHROME_PATH || '/usr/bin/chromium';
const FLAGS = ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'];

interface Target { name: string; url: string; cookie?: string }
type Scores = { performance: number; accessibility: number; bestPractices: number };

async function audit(port: number, target: Target): Promise<Scores> {
  const result = await lighthouse(target.url, {
    port, output: 'json', logLevel: 'error', onlyCategories: ['performance', 'accessibility', 'best-practices'],
    extraHeaders: target.cookie ? { Cookie: target.cookie } : undefined,
  });
  const lhr = result?.lhr;
  if (!lhr) throw new Error(`Lighthouse gave no result for ${target.url}`);
  if (lhr.runtimeError) throw new Error(`Lighthouse: ${lhr.runtimeError.message}`);
  const score = (id: string) => Math.round((lhr.categories[id]?.score ?? NaN) * 100);
  const failing = Object.values(lhr.audits).filter((a) => a.score !== null && a.score < 1 && a.scoreDisplayMode === 'binary').map((a) => a.id);
  if (failing.length) console.log(`${target.name}: failing audits: ${failing.join(', ')}`);
  return { performance: score('performance'), accessibility: score('accessibility'), bestPractices: score('best-practices') };
}

async function main() {
  const app = appUrl();
  const floorUrl = process.env.BENCH_FLOOR_URL;
  if (!floorUrl) throw new Error('BENCH_FLOOR_URL is not set: run with npm run bench');
  const advisor = await demoCookie('tobias@wenlow-water.test');
  const coordinator = await demoCookie('maren@wenlow-water.test');
  const visitId = await screenedVisitOf('tobias@wenlow-water.test');
  const targets: Target[] = [
    { name: 'empty App Router page (floor)', url: `${floorUrl}/` },
    { name: 'sign-in /login', url: `${app}/login` },
    { name: 'field home /field', url: `${app}/field`, cookie: advisor.header },
    { name: 'sheet /sheets/[visitId]', url: `${app}/sheets/${visitId}`, cookie: coordinator.header },
  ];
  const samples = new Map<string, Scores[]>();
  for (let run = 0; run < RUNS; run++) {
    for (const target of targets) {
      // A fresh browser per audit: no cache or worker carried from one page to the next.
      const chrome = await chromeLauncher.launch({ chromePath: CHROME_PATH, chromeFlags: FLAGS });
      try {
        samples.set(target.name, [...(samples.get(target.name) ?? []), await audit(chrome.port, target)]);
      } finally {
        await chrome.kill();
      }
    }
  }
  const med = (name: string, key: keyof Scores) => median((samples.get(name) ?? []).map((s) => s[key]));
  const floor = targets[0]!.name;
  const rows = targets.map((t) => ({
    name: t.name, performance: med(t.name, 'performance'), accessibility: med(t.name, 'accessibility'), bestPractices: med(t.name, 'bestPractices'),
    perfVsFloor: med(t.name, 'performance') - med(floor, 'performance'),
    runs: (samples.get(t.name) ?? []).map((s) => `${s.performance}/${s.accessibility}/${s.bestPractices}`).join(' '),
  }));
  const budgets = targets.slice(1).flatMap((t) => [
    budget(`${t.name}: performance`, med(t.name, 'performance'), '>=', 90),
    budget(`${t.name}: performance below the floor`, med(floor, 'performance') - med(t.name, 'performance'), '<=', 3, 'points'),
    budget(`${t.name}: accessibility`, med(t.name, 'accessibility'), '==', 100),
    budget(`${t.name}: best practices`, med(t.name, 'bestPractices'), '>=', 95),
  ]);
  report('lighthouse', rows, budgets, { lighthouse: '12.2.3' });
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
