// Faults on the phone's network, seeded: a route handler over the sync and photo URLs of a browser
// context (page and service worker alike) that aborts a share of the requests, half before the
// server sees them and half after it answered, and counts what it did.
import type { BrowserContext, Route } from '@playwright/test';
import { mulberry32 } from '../../../lib/engine/random';

export const SYNC_URLS = /\/api\/(sync\/(push|pull)|photos\/[0-9a-f-]{36})(\?|$)/;

export interface FaultCounts {
  requests: number;
  lostBefore: number;
  lostAfter: number;
  byPath: Record<string, number>;
}

export const newCounts = (): FaultCounts => ({ requests: 0, lostBefore: 0, lostAfter: 0, byPath: {} });

const kind = (url: string) => new URL(url).pathname.replace(/[0-9a-f-]{36}$/, ':id');

/** Counts a request that went through a route handler. */
export function countRequest(counts: FaultCounts, route: Route): void {
  counts.requests += 1;
  const k = `${route.request().method()} ${kind(route.request().url())}`;
  counts.byPath[k] = (counts.byPath[k] ?? 0) + 1;
}

/** The server did the work; the answer never reaches the phone. */
export async function loseAnswer(route: Route): Promise<void> {
  try {
    await route.fetch({ maxRedirects: 0 });
  } catch {
    // the server went away meanwhile: lost all the same
  }
  await route.abort('connectionreset');
}

/** Aborts `rate` of the sync requests at random with a seeded generator; returns the live counts. */
export async function randomFaults(context: BrowserContext, seed: number, rate: number): Promise<FaultCounts> {
  const random = mulberry32(seed);
  const counts = newCounts();
  await context.route(SYNC_URLS, async (route) => {
    countRequest(counts, route);
    const roll = random();
    if (roll < rate / 2) {
      counts.lostBefore += 1;
      await route.abort('failed');
    } else if (roll < rate) {
      counts.lostAfter += 1;
      await loseAnswer(route);
    } else {
      await route.continue();
    }
  });
  return counts;
}
