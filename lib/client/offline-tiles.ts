// The map for offline use: after each sync that reached the server, the tiles around every visit on
// this phone (its points, or the farm) are fetched into their own cache, and tiles of visits no
// longer here are dropped. The service worker answers the map's tile requests from that cache
// first (worker/sw.ts). Runs in whichever context synced (the page's worker, the service worker,
// or the page); a Web Lock keeps one run at a time.
import { planOfflineTiles, tileKey, tileUrl, visitTiles, type LatLon } from '@/lib/shared/map-tiles';
import { fieldDb, type FieldDatabase } from './db';

export const TILE_CACHE = 'fallbook-tiles';
/** The organisation's tile template, compiled in (empty: no tiles, nothing to keep). */
export const TILE_TEMPLATE = process.env.NEXT_PUBLIC_TILE_URL ?? '';
const LOCK = 'fallbook-tiles';
const CHANNEL = 'fallbook-tiles';
/** Fetches at once: enough to fill a few hundred tiles in seconds, few enough for a slow link. */
const PARALLEL = 4;

export interface OfflineVisitMap {
  /** Tiles that cover the visit (within the phone's cap). */
  planned: number;
  /** Of those, how many are on the phone, and their size. */
  kept: number;
  bytes: number;
  /** False when the phone's cap left some of the visit's tiles out. */
  complete: boolean;
}

export interface OfflineTiles {
  template: string;
  at: string;
  visits: Record<string, OfflineVisitMap>;
  total: { tiles: number; bytes: number };
  /** Size of each kept tile by z/x/y, so the totals need no re-reading of the cache. */
  sizes: Record<string, number>;
}

// The summary lives in the tile cache itself under an address of our own origin that no page uses.
const manifestKey = () => new URL('/~offline-tiles.json', self.location.origin).href;

const available = () => Boolean(TILE_TEMPLATE) && typeof caches !== 'undefined' && typeof fetch !== 'undefined';

/** Each visit on the phone with the places its map must show: its located points, or else its farm. */
async function visitPlaces(db: FieldDatabase): Promise<{ id: string; places: LatLon[] }[]> {
  const visits = (await db.visits.toArray()).sort((a, b) => (a.plannedOn ?? '9999').localeCompare(b.plannedOn ?? '9999'));
  const farms = new Map((await db.farms.toArray()).map((f) => [f.id, f]));
  const points = await db.points.toArray();
  return visits.map((visit) => {
    const own = points.filter((p) => p.visitId === visit.id && !p.deletedAt && p.lat !== null && p.lon !== null).map((p) => ({ lat: p.lat!, lon: p.lon! }));
    const farm = farms.get(visit.farmId);
    const places = own.length > 0 ? own : farm?.lat != null && farm.lon != null ? [{ lat: farm.lat, lon: farm.lon }] : [];
    return { id: visit.id, places };
  });
}

/** The last summary written on this phone, or null (never run, or no tiles configured). */
export async function readOfflineTiles(): Promise<OfflineTiles | null> {
  if (!available()) return null;
  const res = await (await caches.open(TILE_CACHE)).match(manifestKey());
  if (!res) return null;
  const manifest = (await res.json()) as OfflineTiles;
  return manifest.template === TILE_TEMPLATE ? manifest : null;
}

/** Calls back whenever a run here or in another context of the phone has written a new summary. */
export function onOfflineTilesChange(listener: () => void): () => void {
  if (typeof BroadcastChannel === 'undefined') return () => {};
  const channel = new BroadcastChannel(CHANNEL);
  channel.onmessage = () => listener();
  return () => channel.close();
}

async function fetchTile(url: string): Promise<Response | null> {
  try {
    // CORS, no cookies: the tile host is another origin, and the size must be readable.
    const res = await fetch(url, { mode: 'cors', credentials: 'omit' });
    return res.ok ? res : null;
  } catch {
    return null;
  }
}

async function keepOnce(db: FieldDatabase): Promise<OfflineTiles> {
  const cache = await caches.open(TILE_CACHE);
  const previous = await readOfflineTiles();
  const sizes: Record<string, number> = {};
  const visits = await visitPlaces(db);
  const plan = planOfflineTiles(visits);
  const wanted = new Map(plan.tiles.map((t) => [tileUrl(TILE_TEMPLATE, t), tileKey(t)]));

  // Drop what no visit on the phone needs any more (a visit reassigned or finished, a moved point).
  const manifestUrl = manifestKey();
  const cachedUrls = new Set<string>();
  for (const request of await cache.keys()) {
    if (request.url === manifestUrl) continue;
    if (wanted.has(request.url)) {
      cachedUrls.add(request.url);
      const key = wanted.get(request.url)!;
      const size = previous?.sizes[key];
      sizes[key] = size ?? (await (await cache.match(request))?.blob())?.size ?? 0;
    } else {
      await cache.delete(request);
    }
  }

  // Fetch the missing ones; the first failure with no signal ends the run (the next sync goes on).
  const missing = [...wanted].filter(([url]) => !cachedUrls.has(url));
  let offline = false;
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(PARALLEL, missing.length) }, async () => {
      while (!offline && next < missing.length) {
        const [url, key] = missing[next++]!;
        const res = await fetchTile(url);
        if (!res) {
          if (typeof navigator !== 'undefined' && navigator.onLine === false) offline = true;
          continue;
        }
        const bytes = (await res.clone().blob()).size;
        await cache.put(url, res);
        sizes[key] = bytes;
      }
    }),
  );

  const manifest: OfflineTiles = { template: TILE_TEMPLATE, at: new Date().toISOString(), visits: {}, total: { tiles: 0, bytes: 0 }, sizes };
  for (const key of Object.keys(sizes)) {
    manifest.total.tiles++;
    manifest.total.bytes += sizes[key]!;
  }
  const kept = new Set(plan.tiles.map(tileKey));
  for (const visit of visits) {
    const mine = visitTiles(visit.places)
      .map(tileKey)
      .filter((k) => kept.has(k));
    manifest.visits[visit.id] = {
      planned: mine.length,
      kept: mine.filter((k) => k in sizes).length,
      bytes: mine.reduce((sum, k) => sum + (sizes[k] ?? 0), 0),
      complete: plan.visits[visit.id]?.complete ?? true,
    };
  }
  await cache.put(manifestUrl, new Response(JSON.stringify(manifest), { headers: { 'content-type': 'application/json' } }));
  if (typeof BroadcastChannel !== 'undefined') {
    const channel = new BroadcastChannel(CHANNEL);
    channel.postMessage('changed');
    channel.close();
  }
  return manifest;
}

/**
 * Brings the phone's offline map in line with its visits: fetches missing tiles (at most
 * OFFLINE_TILE_CAP in all, see map-tiles.ts), drops unneeded ones, writes the summary. Skips when another context is
 * already at it; never throws (a tile that did not come is fetched on a later run).
 */
export async function keepTilesForVisits(db: FieldDatabase = fieldDb()): Promise<OfflineTiles | null> {
  if (!available()) return null;
  const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined;
  try {
    if (!locks) return await keepOnce(db);
    return await locks.request(LOCK, { ifAvailable: true }, async (lock) => (lock ? keepOnce(db) : null));
  } catch {
    return null;
  }
}
