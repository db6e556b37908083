import { describe, expect, it } from 'vitest';
import {
  bboxAround,
  latToTileY,
  lonToTileX,
  OFFLINE_RINGS,
  planOfflineTiles,
  tileKey,
  tileMatcher,
  tilesInBbox,
  tileUrl,
  visitTiles,
} from '@/lib/shared/map-tiles';

// The north edge of tile row y at zoom z: the inverse of the Mercator row formula, written the
// other way round (atan ∘ sinh), so the tests do not check the formula against itself.
const northEdge = (y: number, z: number) => (Math.atan(Math.sinh(Math.PI * (1 - (2 * y) / 2 ** z))) * 180) / Math.PI;
const westEdge = (x: number, z: number) => (x / 2 ** z) * 360 - 180;

const BRANDT = { lat: 52.41872, lon: -3.61544 };

describe('tile coordinates', () => {
  it('puts central London in tile 10/511/340, the usual slippy-map example', () => {
    expect([lonToTileX(-0.1278, 10), latToTileY(51.5074, 10)]).toEqual([511, 340]);
  });

  it('splits the world at the equator and the meridian', () => {
    expect([lonToTileX(-0.0001, 1), lonToTileX(0.0001, 1)]).toEqual([0, 1]);
    expect([latToTileY(0.0001, 1), latToTileY(-0.0001, 1)]).toEqual([0, 1]);
    expect([lonToTileX(0, 0), latToTileY(0, 0)]).toEqual([0, 0]);
  });

  it('agrees with the inverse projection at tile edges', () => {
    for (const z of [12, 15, 17]) {
      const y = latToTileY(BRANDT.lat, z);
      const x = lonToTileX(BRANDT.lon, z);
      expect(northEdge(y, z)).toBeGreaterThanOrEqual(BRANDT.lat);
      expect(northEdge(y + 1, z)).toBeLessThan(BRANDT.lat);
      expect(westEdge(x, z)).toBeLessThanOrEqual(BRANDT.lon);
      expect(westEdge(x + 1, z)).toBeGreaterThan(BRANDT.lon);
      expect(latToTileY(northEdge(y, z) - 1e-9, z)).toBe(y);
      expect(latToTileY(northEdge(y, z) + 1e-9, z)).toBe(y - 1);
    }
  });

  it('stays inside the grid at the poles and the date line', () => {
    expect(latToTileY(90, 5)).toBe(0);
    expect(latToTileY(-90, 5)).toBe(31);
    expect(lonToTileX(180, 5)).toBe(31);
    expect(lonToTileX(-180, 5)).toBe(0);
  });
});

describe('the ground around a visit', () => {
  it('reaches the radius each way', () => {
    const box = bboxAround([BRANDT], 2000)!;
    // 2 km is 0.018° of latitude; a degree of longitude is shorter by cos(lat) at 52°.
    expect(box.north - BRANDT.lat).toBeCloseTo(0.017986, 5);
    expect(BRANDT.lat - box.south).toBeCloseTo(0.017986, 5);
    expect(box.east - BRANDT.lon).toBeCloseTo(0.017986 / Math.cos((BRANDT.lat * Math.PI) / 180), 5);
    expect(bboxAround([], 2000)).toBeNull();
  });

  it('covers a box with every tile it touches at that zoom, and only those', () => {
    const box = { south: 52.4, west: -3.64, north: 52.44, east: -3.59 };
    const tiles = tilesInBbox(box, 14);
    const xs = [lonToTileX(box.west, 14), lonToTileX(box.east, 14)] as const;
    const ys = [latToTileY(box.north, 14), latToTileY(box.south, 14)] as const;
    expect(tiles).toHaveLength((xs[1] - xs[0] + 1) * (ys[1] - ys[0] + 1));
    for (const t of tiles) {
      expect(westEdge(t.x, 14)).toBeLessThanOrEqual(box.east);
      expect(westEdge(t.x + 1, 14)).toBeGreaterThanOrEqual(box.west);
      expect(northEdge(t.y, 14)).toBeGreaterThanOrEqual(box.south);
      expect(northEdge(t.y + 1, 14)).toBeLessThanOrEqual(box.north);
    }
    expect(new Set(tiles.map(tileKey)).size).toBe(tiles.length);
  });

  it('keeps zooms 12 to 17 around a site, overview first, a couple of hundred tiles', () => {
    const tiles = visitTiles([BRANDT]);
    expect(new Set(tiles.map((t) => t.z))).toEqual(new Set([12, 13, 14, 15, 16, 17]));
    expect(tiles.map((t) => t.z)).toEqual([...tiles.map((t) => t.z)].sort((a, b) => a - b));
    expect(tiles.length).toBeGreaterThan(100);
    expect(tiles.length).toBeLessThan(400);
    // The site's own tile is there at the closest zoom.
    expect(tiles.map(tileKey)).toContain(`17/${lonToTileX(BRANDT.lon, 17)}/${latToTileY(BRANDT.lat, 17)}`);
    // Nothing further than the ring's radius (plus one tile) at z17.
    const z17 = tiles.filter((t) => t.z === 17);
    const across = Math.max(...z17.map((t) => t.x)) - Math.min(...z17.map((t) => t.x)) + 1;
    expect(across).toBeLessThanOrEqual(Math.ceil((2 * OFFLINE_RINGS[2]!.radiusM) / 185) + 1);
    expect(visitTiles([])).toEqual([]);
  });

  it('gives a far-off stray point its own ring, never the land between', () => {
    const one = visitTiles([BRANDT]).length;
    const both = visitTiles([BRANDT, { lat: 0.5, lon: 30 }]);
    expect(both.length).toBeGreaterThan(one);
    expect(both.length).toBeLessThanOrEqual(2 * one + 10);
    // Points a few metres apart (stations along a bank) add nothing.
    expect(visitTiles([BRANDT, { lat: BRANDT.lat + 0.00002, lon: BRANDT.lon }])).toHaveLength(one);
  });
});

describe('the plan for a phone', () => {
  const visits = [
    { id: 'brandt', places: [BRANDT] },
    { id: 'pryce', places: [{ lat: 52.4331, lon: -3.64021 }] },
    { id: 'nowhere', places: [] },
  ];

  it('counts each tile once across visits that share ground', () => {
    const plan = planOfflineTiles(visits);
    const keys = plan.tiles.map(tileKey);
    expect(new Set(keys).size).toBe(keys.length);
    const each = visitTiles([BRANDT]).length + visitTiles([{ lat: 52.4331, lon: -3.64021 }]).length;
    // The two farms are 2 km apart: their overview tiles overlap.
    expect(keys.length).toBeLessThan(each);
    expect(plan.visits.brandt).toEqual({ tiles: visitTiles([BRANDT]).length, complete: true });
    expect(plan.visits.nowhere).toEqual({ tiles: 0, complete: true });
  });

  it('never keeps more than the cap, filling the first visit first', () => {
    const first = visitTiles([BRANDT]).length;
    const plan = planOfflineTiles(visits, first + 10);
    expect(plan.tiles).toHaveLength(first + 10);
    expect(plan.visits.brandt!.complete).toBe(true);
    expect(plan.visits.pryce!.complete).toBe(false);
    const small = planOfflineTiles(visits, 20);
    expect(small.tiles).toHaveLength(20);
    expect(small.visits.brandt).toEqual({ tiles: 20, complete: false });
    // Overview zooms are kept before close ones.
    expect(Math.max(...small.tiles.map((t) => t.z))).toBeLessThan(17);
  });
});

describe('tile addresses', () => {
  it('fills a template and reads the tile back from any sub-domain or retina address', () => {
    const template = 'https://{s}.tiles.example.org/base/{z}/{x}/{y}{r}.png';
    const t = { z: 15, x: 16055, y: 10812 };
    expect(tileUrl(template, t)).toBe('https://a.tiles.example.org/base/15/16055/10812.png');
    const match = tileMatcher(template);
    expect(match('https://c.tiles.example.org/base/15/16055/10812@2x.png')).toEqual(t);
    expect(match('https://b.tiles.example.org/base/15/16055/10812.png?v=2')).toEqual(t);
    expect(match('https://b.tiles.example.org/other/15/16055/10812.png')).toBeNull();
    expect(match('http://127.0.0.1:3000/api/visits')).toBeNull();
  });

  it('reads templates whose numbers come in another order', () => {
    const match = tileMatcher('http://127.0.0.1:4710/tiles?x={x}&y={y}&z={z}');
    expect(match('http://127.0.0.1:4710/tiles?x=3&y=4&z=5')).toEqual({ z: 5, x: 3, y: 4 });
    expect(tileMatcher('')('http://127.0.0.1:4710/5/3/4.png')).toBeNull();
  });
});
