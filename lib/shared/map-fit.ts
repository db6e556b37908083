// Fitting a map to a district that one mistyped position must not blow up to a continent: marks far
// from the district's middle are left out of the fit and named instead.

export interface Located {
  lat: number;
  lon: number;
}

/** Mean Earth radius (IUGG), km. */
const EARTH_KM = 6371.0088;

/** Great-circle distance between two positions, km (haversine formula). */
export function distanceKm(a: Located, b: Located): number {
  const rad = Math.PI / 180;
  const dLat = (b.lat - a.lat) * rad;
  const dLon = (b.lon - a.lon) * rad;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * rad) * Math.cos(b.lat * rad) * Math.sin(dLon / 2) ** 2;
  return 2 * EARTH_KM * Math.asin(Math.min(1, Math.sqrt(h)));
}

function median(values: number[]): number {
  const sorted = [...values].sort((x, y) => x - y);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? (sorted[mid] ?? 0) : ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
}

/** No mark nearer the middle than this is an outlier, however tight the rest sit. */
export const OUTLIER_MIN_KM = 25;
/** A mark further from the middle than this many times the typical mark is an outlier. */
export const OUTLIER_FACTOR = 5;

/**
 * Splits marks into those the map fits and far outliers. The middle is the median position (one
 * stray mark cannot move it); a mark is an outlier beyond both OUTLIER_MIN_KM and OUTLIER_FACTOR
 * times the median distance of all marks from the middle.
 */
export function splitOutliers<T extends Located>(marks: T[]): { inside: T[]; outliers: (T & { km: number })[] } {
  if (marks.length < 3) return { inside: marks, outliers: [] };
  const middle = { lat: median(marks.map((m) => m.lat)), lon: median(marks.map((m) => m.lon)) };
  const distances = marks.map((m) => distanceKm(middle, m));
  const limit = Math.max(OUTLIER_MIN_KM, OUTLIER_FACTOR * median(distances));
  const inside: T[] = [];
  const outliers: (T & { km: number })[] = [];
  marks.forEach((m, i) => {
    const km = distances[i] ?? 0;
    if (km > limit) outliers.push({ ...m, km });
    else inside.push(m);
  });
  return { inside, outliers };
}

/** The south-west and north-east corners around the marks, or null for none. */
export function boundsOf(marks: Located[]): [[number, number], [number, number]] | null {
  if (!marks.length) return null;
  const lats = marks.map((m) => m.lat);
  const lons = marks.map((m) => m.lon);
  return [
    [Math.min(...lats), Math.min(...lons)],
    [Math.max(...lats), Math.max(...lons)],
  ];
}
