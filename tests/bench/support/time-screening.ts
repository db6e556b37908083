// The engine bench's timing loop, the same in Node and in the page (engine-in-browser.ts).
import { screenSite, type SiteReadingsInput } from '@/lib/engine';

/** `runs` timings (ms) of screenSite on the site with `samples` Monte Carlo draws, after `warmups` untimed calls. */
export function timeScreening(site: SiteReadingsInput, samples: number, warmups: number, runs: number): number[] {
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
