// Web-map tile arithmetic for the offline map: which XYZ tiles (the usual spherical-Mercator scheme,
// 2^z × 2^z tiles of 256 px, y counted from the north) cover the ground around a visit, and the
// address of each under the organisation's tile template. Pure: the phone, the worker and the tests
// share it.

export interface Tile {
  z: number;
  x: number;
  y: number;
}
export interface Bbox {
  south: number;
  west: number;
  north: number;
  east: number;
}
export interface LatLon {
  lat: number;
  lon: number;
}

/** The spherical-Mercator projection is undefined at the poles; web maps stop here. */
const MAX_LAT = 85.0511287798;
const EARTH_RADIUS_M = 6_371_000;

/**
 * What is kept around each visit: the whole neighbourhood at the overview zooms, a tighter ring at
 * the close ones (a 2 km square at z17 alone would be ~500 tiles). About 180 tiles for one site.
 */
export const OFFLINE_RINGS: readonly { zooms: readonly number[]; radiusM: number }[] = [
  { zooms: [12, 13, 14, 15], radiusM: 2000 },
  { zooms: [16], radiusM: 1000 },
  { zooms: [17], radiusM: 500 },
];

/** The closest zoom kept on the phone: the map enlarges these tiles beyond it. */
export const OFFLINE_MAX_ZOOM = Math.max(...OFFLINE_RINGS.flatMap((r) => r.zooms));

/** At most this many tiles are kept on a phone for all its visits together. */
export const OFFLINE_TILE_CAP = 2500;

const clampLat = (lat: number) => Math.max(-MAX_LAT, Math.min(MAX_LAT, lat));

/** The tile column holding a longitude at zoom z (standard slippy-map formula). */
export function lonToTileX(lon: number, z: number): number {
  const n = 2 ** z;
  return Math.min(n - 1, Math.max(0, Math.floor(((lon + 180) / 360) * n)));
}

/** The tile row holding a latitude at zoom z (standard slippy-map formula, y grows southwards). */
export function latToTileY(lat: number, z: number): number {
  const n = 2 ** z;
  const rad = (clampLat(lat) * Math.PI) / 180;
  return Math.min(n - 1, Math.max(0, Math.floor(((1 - Math.log(Math.tan(rad) + 1 / Math.cos(rad)) / Math.PI) / 2) * n)));
}

/** The box reaching radiusM north, south, east and west of every point. */
export function bboxAround(points: readonly LatLon[], radiusM: number): Bbox | null {
  if (points.length === 0) return null;
  const dLat = (radiusM / EARTH_RADIUS_M) * (180 / Math.PI);
  let box: Bbox = { south: 90, west: 180, north: -90, east: -180 };
  for (const p of points) {
    const dLon = dLat / Math.max(0.01, Math.cos((p.lat * Math.PI) / 180));
    box = {
      south: Math.min(box.south, clampLat(p.lat - dLat)),
      north: Math.max(box.north, clampLat(p.lat + dLat)),
      west: Math.min(box.west, Math.max(-180, p.lon - dLon)),
      east: Math.max(box.east, Math.min(180, p.lon + dLon)),
    };
  }
  return box;
}

/** Every tile at zoom z that the box touches, row by row from the north-west. */
export function tilesInBbox(box: Bbox, z: number): Tile[] {
  const [x0, x1] = [lonToTileX(box.west, z), lonToTileX(box.east, z)];
  const [y0, y1] = [latToTileY(box.north, z), latToTileY(box.south, z)];
  const tiles: Tile[] = [];
  for (let y = y0; y <= y1; y++) for (let x = x0; x <= x1; x++) tiles.push({ z, x, y });
  return tiles;
}

export const tileKey = (t: Tile) => `${t.z}/${t.x}/${t.y}`;

/**
 * The tiles kept for one visit's places (its points, or the farm), overview zooms first, no repeats.
 * Each place gets its own ring (a stray point far away adds its own few tiles, never the land
 * between); places within ~100 m of each other count once.
 */
export function visitTiles(places: readonly LatLon[], rings = OFFLINE_RINGS): Tile[] {
  const distinct = [...new Map(places.map((p) => [`${p.lat.toFixed(3)},${p.lon.toFixed(3)}`, p])).values()];
  const seen = new Set<string>();
  const out: Tile[] = [];
  for (const ring of rings) {
    for (const z of ring.zooms) {
      for (const place of distinct) {
        for (const t of tilesInBbox(bboxAround([place], ring.radiusM)!, z)) {
          if (seen.has(tileKey(t))) continue;
          seen.add(tileKey(t));
          out.push(t);
        }
      }
    }
  }
  return out;
}

export interface OfflinePlan {
  /** Every tile to keep, once each. */
  tiles: Tile[];
  /** Per visit: how many tiles cover it and whether all of them fit under the cap. */
  visits: Record<string, { tiles: number; complete: boolean }>;
}

/**
 * The tiles for all of a phone's visits, soonest visit first, never more than `cap` in all: a visit
 * that does not fit whole keeps its overview zooms first and is marked incomplete.
 */
export function planOfflineTiles(visits: readonly { id: string; places: readonly LatLon[] }[], cap = OFFLINE_TILE_CAP, rings = OFFLINE_RINGS): OfflinePlan {
  const kept = new Map<string, Tile>();
  const plan: OfflinePlan = { tiles: [], visits: {} };
  for (const visit of visits) {
    const wanted = visitTiles(visit.places, rings);
    let have = 0;
    for (const t of wanted) {
      const key = tileKey(t);
      if (!kept.has(key)) {
        if (kept.size >= cap) continue;
        kept.set(key, t);
      }
      have++;
    }
    plan.visits[visit.id] = { tiles: have, complete: have === wanted.length };
  }
  plan.tiles = [...kept.values()];
  return plan;
}

/** One tile's address under a template with {z}/{x}/{y}, the first {s} sub-domain and no {r} (retina) suffix. */
export function tileUrl(template: string, t: Tile): string {
  return template.replace('{s}', 'a').replace('{r}', '').replace('{z}', String(t.z)).replace('{x}', String(t.x)).replace('{y}', String(t.y));
}

/**
 * Reads a tile out of an address the map asked for under the template (any sub-domain, with or
 * without a retina suffix), or null for any other address.
 */
export function tileMatcher(template: string): (url: string) => Tile | null {
  if (!template) return () => null;
  const order: ('z' | 'x' | 'y')[] = [];
  const source = template
    .split(/(\{[a-z]+\})/)
    .map((part) => {
      if (part === '{z}' || part === '{x}' || part === '{y}') {
        order.push(part[1] as 'z' | 'x' | 'y');
        return '(\\d+)';
      }
      if (part === '{s}') return '[a-z0-9-]+';
      if (part === '{r}') return '(?:@2x)?';
      return part.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    })
    .join('');
  const pattern = new RegExp(`^${source}(?:\\?.*)?$`);
  return (url) => {
    const m = pattern.exec(url);
    if (!m || order.length !== 3) return null;
    const t = { z: 0, x: 0, y: 0 };
    order.forEach((k, i) => {
      t[k] = Number(m[i + 1]);
    });
    return t;
  };
}
