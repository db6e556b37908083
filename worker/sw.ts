/// <reference lib="webworker" />
// The service worker: precached app shell and field routes, runtime caching, the offline fallback
// page, and the sync loop (the same module the page runs) on Background Sync and on request.
import { defaultCache } from '@serwist/next/worker';
import type { PrecacheEntry, SerwistGlobalConfig } from 'serwist';
import { tileRoute } from './tile-route';
import { NetworkOnly, Serwist } from 'serwist';
import { runSync } from '../lib/client/sync/runner';

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}

declare const self: ServiceWorkerGlobalScope;

const SYNC_TAG = 'fallbook-sync';

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  // Field pages carry ids in the query string (/field/visit?id=…): any query string still finds
  // the precached page, so a page never opened before opens offline.
  precacheOptions: { ignoreURLParametersMatching: [/.*/] },
  // Updates wait until the page says so (it asks only when no form holds unsaved input).
  skipWaiting: false,
  clientsClaim: true,
  navigationPreload: true,
  // API answers are never cached: a stale pull replayed offline would move the cursor backwards,
  // and session checks must reach the server. Pages and assets follow the defaults.
  runtimeCaching: [
    { matcher: ({ sameOrigin, url }) => sameOrigin && url.pathname.startsWith('/api/'), handler: new NetworkOnly() },
    // Map tiles: the phone's kept ones first (tile-route.ts).
    tileRoute,
    ...defaultCache,
  ],
  fallbacks: {
    entries: [{ url: '/~offline', matcher: ({ request }) => request.destination === 'document' }],
  },
});

interface SyncEvent extends ExtendableEvent { tag: string }

self.addEventListener('sync', (event) => {
  const e = event as SyncEvent;
  if (e.tag !== SYNC_TAG) return;
  // Reject when the run failed, so the browser schedules another attempt.
  e.waitUntil(runSync().then((outcome) => {
    if ('ok' in outcome && !outcome.ok) throw new Error(outcome.message ?? 'sync failed');
  }));
});

self.addEventListener('message', (event) => {
  if ((event.data as { type?: string } | null)?.type === 'FALLBOOK_SYNC') event.waitUntil(runSync());
});

serwist.addEventListeners();
