// Where profile stations sit on the map: their own GPS fix, or placed by chainage between the
// nearest stations before and after that have one. Outside the fixed stretch a station is left off.

export interface StationOnBank {
  id: string;
  chainageM: number;
  lat: number | null;
  lon: number | null;
}

export interface PlacedStation {
  id: string;
  chainageM: number;
  lat: number;
  lon: number;
  /** 'fix': the phone's own fix at the station; 'chainage': interpolated along the bank. */
  placed: 'fix' | 'chainage';
}

export interface StationPlaces {
  /** In chainage order. */
  placed: PlacedStation[];
  /** Stations with no fix and no fixed station on both sides: not drawn. */
  unplaced: string[];
}

const hasFix = (s: StationOnBank): s is StationOnBank & { lat: number; lon: number } =>
  s.lat !== null && s.lon !== null && Number.isFinite(s.lat) && Number.isFinite(s.lon);

/**
 * Places every station it can. Between two fixed stations, lat and lon are interpolated linearly in
 * chainage: a straight chord, which is close enough over the tens of metres between bookings
 * (the bank's bends between them are not known). Stations sharing a chainage with a fix take it.
 */
export function placeStations(stations: readonly StationOnBank[]): StationPlaces {
  const sorted = [...stations].sort((a, b) => a.chainageM - b.chainageM);
  const fixed = sorted.filter(hasFix);
  const placed: PlacedStation[] = [];
  const unplaced: string[] = [];
  for (const s of sorted) {
    if (hasFix(s)) {
      placed.push({ id: s.id, chainageM: s.chainageM, lat: s.lat, lon: s.lon, placed: 'fix' });
      continue;
    }
    const before = fixed.filter((f) => f.chainageM <= s.chainageM).at(-1);
    const after = fixed.find((f) => f.chainageM >= s.chainageM);
    if (!before || !after) {
      unplaced.push(s.id);
      continue;
    }
    const span = after.chainageM - before.chainageM;
    const t = span === 0 ? 0 : (s.chainageM - before.chainageM) / span;
    placed.push({
      id: s.id,
      chainageM: s.chainageM,
      placed: 'chainage',
      lat: before.lat + t * (after.lat - before.lat),
      lon: before.lon + t * (after.lon - before.lon),
    });
  }
  return { placed, unplaced };
}
