/// <reference lib="webworker" />
// The service worker: precached app shell and field routes, runtime caching, the offline fallback
// page, and the sync loop (the same module the page's sync worker runs) on Background Sync.
import { defaultCache } from '@serwist/next/worker';
import type { PrecacheEntry, SerwistGlobalConfig } from 'serwist';
import { tileRoute } from './tile-route';
import { NetworkOnly, Serwist } from 'serwist';
import { runSync } from '../lib/client/sync/runner';
import { SYNC_NAME } from '../lib/client/sync/sync-name';

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}

declare const self: ServiceWorkerGlobalScope;

// The field pages' payloads for in-app navigation (RSC), kept by path: a field page is the same static
// page whatever its query string, so one payload serves every visit, online or not.
const FIELD_PAGES = [
  '/field',
  '/field/sync',
  '/field/visit',
  ...['commission', 'demand', 'fall', 'flow', 'photos', 'pipes', 'points', 'positions'].map((p) => `/field/visit/${p}`),
];
const FIELD_RSC_CACHE = 'fallbook-field-rsc';
const isFieldRsc = (request: Request, url: URL) =>
  request.method === 'GET' &&
  url.origin === self.location.origin &&
  request.headers.get('RSC') === '1' &&
  request.headers.get('Next-Router-Prefetch') !== '1' &&
  FIELD_PAGES.includes(url.pathname);

/** A field page's payload from the network (kept for later), else the one kept: a phone with no signal still navigates in the app. */
async function fieldRsc(request: Request, url: URL): Promise<Response> {
  const cache = await caches.open(FIELD_RSC_CACHE);
  try {
    const fresh = await fetch(request);
    if (fresh.ok) await cache.put(url.pathname, fresh.clone());
    return fresh;
  } catch (error) {
    const kept = await cache.match(url.pathname);
    // A copy, not the kept response itself: that one was redirected to another URL (the payload's own
    // path), and the app would take that URL, dropping this page's query string (the visit's id).
    if (kept) return new Response(kept.body, { status: kept.status, statusText: kept.statusText, headers: kept.headers });
    throw error;
  }
}

/** Fetches every field page's payload once, so navigation works offline even to a page not yet opened. */
async function keepFieldPayloads(): Promise<void> {
  const cache = await caches.open(FIELD_RSC_CACHE);
  await Promise.all(
    FIELD_PAGES.map(async (path) => {
      const res = await fetch(path, { headers: { RSC: '1' } }).catch(() => null);
      if (res?.ok && (res.headers.get('content-type') ?? '').includes('text/x-component')) await cache.put(path, res);
    }),
  );
}

// Registered before Serwist's listeners, so a navigation payload is never answered with the precached HTML page.
self.addEventListener('fetch', (event) => {
  const url = new URL(event.request.url);
  if (isFieldRsc(event.request, url)) event.respondWith(fieldRsc(event.request, url));
});

self.addEventListener('activate', (event) => {
  // A new build's payloads replace the old build's.
  event.waitUntil(caches.delete(FIELD_RSC_CACHE).then(keepFieldPayloads));
});

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

interface SyncEvent extends ExtendableEvent {
  tag: string;
}

self.addEventListener('sync', (event) => {
  const e = event as SyncEvent;
  if (e.tag !== SYNC_NAME) return;
  // Reject when the run failed, so the browser schedules another attempt.
  e.waitUntil(
    runSync().then((outcome) => {
      if ('ok' in outcome && !outcome.ok) throw new Error(outcome.message ?? 'sync failed');
    }),
  );
});

// The sync worker's script is precached without its query string, but Turbopack's worker bootstrap
// reads its configuration from that query string: a response copied from the cache has no URL of its
// own, so the worker takes the URL it was asked for, query string and all.
serwist.precacheStrategy.plugins.push({
  cachedResponseWillBeUsed: async ({ cachedResponse, event }) =>
    cachedResponse && (event as FetchEvent | undefined)?.request.destination === 'worker'
      ? new Response(cachedResponse.body, { status: cachedResponse.status, statusText: cachedResponse.statusText, headers: cachedResponse.headers })
      : cachedResponse,
});

serwist.addEventListeners();
