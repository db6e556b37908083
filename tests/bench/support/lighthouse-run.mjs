// One Lighthouse audit in a fresh headless Chromium, run by plain Node (tsx's transform would inject
// helpers into the functions Lighthouse sends to the page). Prints the category scores as one JSON line.
// Usage: node tests/bench/support/lighthouse-run.mjs URL [COOKIE]
// With LIGHTHOUSE_REPORT=file.json set, the whole report is written there too (LCP element and phases,
// long tasks, main-thread breakdown: what a score is made of).
import { writeFileSync } from 'node:fs';
import { chromium } from '@playwright/test';
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';

/**
 * How many of the page's own scripts ran before its first paint, in the recorded (unthrottled) load:
 * Lighthouse's simulation counts a script that ran before the paint, its download and its run, in
 * the simulated LCP. The single largest cause of a page's scores differing from run to run here.
 */
function scriptsBeforePaint(trace) {
  const events = trace?.traceEvents ?? [];
  const nav = events.find((e) => e.name === 'navigationStart' && e.args?.data?.isLoadingMainFrame && e.args?.data?.documentLoaderURL?.startsWith('http'));
  if (!nav) return null;
  const paint = events.find((e) => e.name === 'firstContentfulPaint' && e.pid === nav.pid && e.ts >= nav.ts);
  if (!paint) return null;
  const runs = events.filter((e) => e.name === 'EvaluateScript' && e.pid === nav.pid && e.ts >= nav.ts && /\/_next\/static\//.test(e.args?.data?.url ?? ''));
  return { beforePaint: runs.filter((e) => e.ts < paint.ts).length, total: runs.length, paintMs: Math.round((paint.ts - nav.ts) / 1000) };
}

const [url, cookie] = process.argv.slice(2);
const chrome = await chromeLauncher.launch({
  chromePath: process.env.CHROME_PATH || '/usr/bin/chromium',
  chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage'],
});
try {
  if (cookie) {
    // Signed in the way a browser is: the cookie sits in the profile's jar, so the page's workers send
    // it too (a header added to the page's requests would not reach them).
    const [name = '', value = ''] = cookie.split(/=(.*)/s);
    const browser = await chromium.connectOverCDP(`http://127.0.0.1:${chrome.port}`);
    await browser.contexts()[0]?.addCookies([{ name, value, url: new URL(url).origin, httpOnly: true, sameSite: 'Lax' }]);
    await browser.close();
  }
  // Lighthouse's defaults: mobile form factor and screen, simulated slow 4G and 4x CPU slowdown.
  const result = await lighthouse(url, {
    port: chrome.port, output: 'json', logLevel: 'error', onlyCategories: ['performance', 'accessibility', 'best-practices'],
  });
  const lhr = result?.lhr;
  if (!lhr) throw new Error(`no result for ${url}`);
  if (lhr.runtimeError) throw new Error(lhr.runtimeError.message);
  if (process.env.LIGHTHOUSE_REPORT) writeFileSync(process.env.LIGHTHOUSE_REPORT, JSON.stringify(lhr, null, 1));
  const score = (id) => Math.round((lhr.categories[id]?.score ?? NaN) * 100);
  const failing = Object.values(lhr.audits).filter((a) => a.score !== null && a.score < 1 && a.scoreDisplayMode !== 'informative'
    && a.scoreDisplayMode !== 'notApplicable' && a.scoreDisplayMode !== 'manual').map((a) => a.id);
  // The metrics behind the performance score (ms, CLS unitless), to see what a low score is made of.
  const metric = (id) => Math.round((lhr.audits[id]?.numericValue ?? NaN) * (id === 'cumulative-layout-shift' ? 1000 : 1)) / (id === 'cumulative-layout-shift' ? 1000 : 1);
  const metrics = Object.fromEntries(['first-contentful-paint', 'largest-contentful-paint', 'total-blocking-time', 'speed-index', 'cumulative-layout-shift']
    .map((id) => [id, metric(id)]));
  process.stdout.write(`${JSON.stringify({ performance: score('performance'), accessibility: score('accessibility'),
    bestPractices: score('best-practices'), failing, metrics, scripts: scriptsBeforePaint(result.artifacts?.Trace) })}\n`);
} finally {
  await chrome.kill();
}
