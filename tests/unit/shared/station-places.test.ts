import { describe, expect, it } from 'vitest';
import { placeStations, type StationOnBank } from '@/lib/shared/station-places';

const st = (id: string, chainageM: number, lat: number | null = null, lon: number | null = null): StationOnBank => ({ id, chainageM, lat, lon });

describe('placing profile stations on the map', () => {
  it('keeps a station\u2019s own fix', () => {
    const { placed, unplaced } = placeStations([st('a', 0, 52.1, -3.2), st('b', 10, 52.2, -3.3)]);
    expect(placed.map((p) => [p.id, p.lat, p.lon, p.placed])).toEqual([
      ['a', 52.1, -3.2, 'fix'],
      ['b', 52.2, -3.3, 'fix'],
    ]);
    expect(unplaced).toEqual([]);
  });

  it('places a station without a fix by chainage between the nearest fixed stations', () => {
    // 30 m of 40 m from a to d: three quarters of the way along the chord.
    const { placed } = placeStations([st('d', 40, 52.4, -3.0), st('b', 10), st('a', 0, 52.0, -3.4), st('c', 30)]);
    expect(placed.map((p) => p.id)).toEqual(['a', 'b', 'c', 'd']);
    const c = placed.find((p) => p.id === 'c');
    expect(c?.placed).toBe('chainage');
    expect(c?.lat).toBeCloseTo(52.3, 12);
    expect(c?.lon).toBeCloseTo(-3.1, 12);
    expect(placed.find((p) => p.id === 'b')?.lat).toBeCloseTo(52.1, 12);
  });

  it('uses the nearest fixed station on each side, not the ends of the reach', () => {
    const { placed } = placeStations([st('a', 0, 0, 0), st('b', 10, 1, 1), st('c', 15), st('d', 20, 3, 5), st('e', 100, 50, 50)]);
    const c = placed.find((p) => p.id === 'c');
    expect([c?.lat, c?.lon]).toEqual([2, 3]);
  });

  it('leaves off stations beyond the last fix, or all of them when no station has one', () => {
    expect(placeStations([st('a', 0), st('b', 10, 52, -3), st('c', 20)]).unplaced).toEqual(['a', 'c']);
    const none = placeStations([st('a', 0), st('b', 10)]);
    expect(none.placed).toEqual([]);
    expect(none.unplaced).toEqual(['a', 'b']);
  });

  it('a station at the same chainage as a fixed one takes its place', () => {
    const { placed } = placeStations([st('a', 10, 52, -3), st('b', 10)]);
    expect(placed.find((p) => p.id === 'b')).toMatchObject({ lat: 52, lon: -3, placed: 'chainage' });
  });
});
