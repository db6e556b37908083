// Bench: phone weight. First-load JavaScript (gzip) of the sign-in page, the field home and capture route
// and the farmer's sheet, against an empty App Router page built with the same Next.js (the floor, served
// by npm run bench). Chromium loads each page as a phone with the service worker blocked (its precache is
// not the page's load) and every script response is gzipped. Median of 3 loads.
import { gzipSync } from 'node:zlib';
import { chromium, devices, type Browser } from '@playwright/test';
import { pageBenchContext } from './support/demo';
import { budget, median, round } from './support/budgets';
import { report } from './support/report';

const RUNS = 3;
const FIELD_BUDGET_KB = 120;
const SHEET_BUDGET_KB = 60;

interface Page { name: string; url: string; cookie?: { name: string; value: string } }

/** Scripts loaded until the network is idle: count, raw bytes and gzip bytes. */
async function scriptWeight(browser: Browser, page: Page) {
  const context = await browser.newContext({ ...devices['Pixel 7'], serviceWorkers: 'block' });
  if (page.cookie) await context.addCookies([{ ...page.cookie, url: page.url }]);
  const tab = await context.newPage();
  const bodies: Promise<Buffer | null>[] = [];
  tab.on('response', (res) => {
    if (res.request().resourceType() === 'script') bodies.push(res.body().catch(() => null));
  });
  const res = await tab.goto(page.url, { waitUntil: 'networkidle' });
  if (!res || res.status() !== 200) throw new Error(`${page.url} answered ${res?.status()}`);
  const all = (await Promise.all(bodies)).filter((b): b is Buffer => b !== null);
  await context.close();
  return { scripts: all.length, rawKb: all.reduce((a, b) => a + b.length, 0) / 1024, gzKb: all.reduce((a, b) => a + gzipSync(b).length, 0) / 1024 };
}

async function main() {
  const { app, floorUrl, advisor, visitId, farmer } = await pageBenchContext();
  const pages: Page[] = [
    { name: 'empty App Router page (floor)', url: `${floorUrl}/` },
    { name: 'sign-in /login', url: `${app}/login` },
    { name: 'field home /field', url: `${app}/field`, cookie: advisor },
    { name: 'field capture /field/visit/flow', url: `${app}/field/visit/flow?id=${visitId}`, cookie: advisor },
    { name: 'field visit /field/visit', url: `${app}/field/visit?id=${visitId}`, cookie: advisor },
    { name: 'sheet /sheets/[visitId]', url: `${app}/sheets/${visitId}`, cookie: farmer },
  ];
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'] });
  try {
    const samples = new Map<string, { scripts: number; rawKb: number; gzKb: number }[]>();
    for (let run = 0; run < RUNS; run++) {
      for (const page of pages) samples.set(page.name, [...(samples.get(page.name) ?? []), await scriptWeight(browser, page)]);
    }
    const med = (name: string, key: 'scripts' | 'rawKb' | 'gzKb') => median((samples.get(name) ?? []).map((s) => s[key]));
    const floor = med(pages[0]!.name, 'gzKb');
    const rows = pages.map((p) => ({ name: p.name, scripts: med(p.name, 'scripts'), rawKb: round(med(p.name, 'rawKb')),
      gzipKb: round(med(p.name, 'gzKb')), overFloorKb: round(med(p.name, 'gzKb') - floor) }));
    const over = (name: string) => round(med(name, 'gzKb') - floor);
    report('weight', rows, [
      budget('field capture first-load JS over the floor', over('field capture /field/visit/flow'), '<=', FIELD_BUDGET_KB, 'kB gz'),
      budget('field visit first-load JS over the floor', over('field visit /field/visit'), '<=', FIELD_BUDGET_KB, 'kB gz'),
      budget('field home first-load JS over the floor', over('field home /field'), '<=', FIELD_BUDGET_KB, 'kB gz'),
      budget('sheet first-load JS over the floor', over('sheet /sheets/[visitId]'), '<=', SHEET_BUDGET_KB, 'kB gz'),
    ], { floorGzipKb: round(floor) });
  } finally {
    await browser.close();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
