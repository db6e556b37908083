/// <reference lib="webworker" />
// The service worker's route for map tiles. The tiles kept for the phone's visits
// (lib/client/offline-tiles.ts) come from their cache whatever the signal, under any sub-domain or
// retina address; others from the network, not kept, so browsing never grows the offline set past
// its cap. Beyond the kept area with no signal the map shows its plain background (an empty
// picture, not a failed load).
import type { RuntimeCaching } from 'serwist';
import { TILE_CACHE, TILE_TEMPLATE } from '../lib/client/offline-tiles';
import { tileMatcher, tileUrl } from '../lib/shared/map-tiles';

const tileOf = tileMatcher(TILE_TEMPLATE);
const BLANK_TILE = '<svg xmlns="http://www.w3.org/2000/svg" width="1" height="1"/>';

export const tileRoute: RuntimeCaching = {
  matcher: ({ url }) => tileOf(url.href) !== null,
  handler: async ({ request, url }) => {
    const kept = await caches.match(tileUrl(TILE_TEMPLATE, tileOf(url.href)!), { cacheName: TILE_CACHE });
    if (kept) return kept;
    try {
      return await fetch(request);
    } catch {
      return new Response(BLANK_TILE, { headers: { 'content-type': 'image/svg+xml', 'cache-control': 'no-store' } });
    }
  },
};
