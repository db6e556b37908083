// The engine bench's page script: bundled for the browser by engine.bench.ts (esbuild) and run in
// Chromium, so screenSite is timed in the phone's JavaScript engine with the same inputs as in Node.
import type { SiteReadingsInput } from '@/lib/engine';
import { clearGo, conditionalSmallDeliveryPipe } from '@/tests/unit/engine/fixtures/demo-sites';
import { timeScreening } from './time-screening';

const SITES: Record<string, SiteReadingsInput> = { 'screenSite clear go': clearGo, 'screenSite long delivery run': conditionalSmallDeliveryPipe };

/** Times screenSite on one named site: `runs` timings (ms) after `warmups` untimed calls. */
function timeSite(name: string, samples: number, warmups: number, runs: number): number[] {
  const site = SITES[name];
  if (!site) throw new Error(`no site ${name}`);
  return timeScreening(site, samples, warmups, runs);
}

(globalThis as unknown as { fallbookEngineBench: typeof timeSite }).fallbookEngineBench = timeSite;
