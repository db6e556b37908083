// The engine bench's page script: bundled for the browser by engine.bench.ts (esbuild) and run in
// Chromium, so screenSite is timed in the phone's JavaScript engine with the same inputs as in Node.
import { screenSite, type SiteReadingsInput } from '@/lib/engine';
import { clearGo, conditionalSmallDeliveryPipe } from '@/tests/unit/engine/fixtures/demo-sites';

const SITES: Record<string, SiteReadingsInput> = { 'screenSite clear go': clearGo, 'screenSite long delivery run': conditionalSmallDeliveryPipe };

/** Times screenSite on one named site: `runs` timings (ms) after `warmups` untimed calls. */
function timeSite(name: string, samples: number, warmups: number, runs: number): number[] {
  const site = SITES[name];
  if (!site) throw new Error(`no site ${name}`);
  const input: SiteReadingsInput = { ...site, monteCarlo: { samples, seed: 1 } };
  for (let i = 0; i < warmups; i++) screenSite(input);
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    screenSite(input);
    times.push(performance.now() - t0);
  }
  return times;
}

(globalThis as unknown as { fallbookEngineBench: typeof timeSite }).fallbookEngineBench = timeSite;
