// Position fixes from the phone: watch until the accuracy is good enough or the person accepts.
export interface Fix {
  lat: number;
  lon: number;
  accuracyM: number;
  altitudeM: number | null;
  altitudeAccuracyM: number | null;
  at: string;
}

export const GOOD_FIX_M = 10;

/** Starts watching; calls back with each fix; returns a stop function. */
export function watchFix(onFix: (fix: Fix) => void, onError: (message: string) => void): () => void {
  if (!('geolocation' in navigator)) {
    onError('This phone gives no location: type the coordinates instead.');
    return () => undefined;
  }
  const id = navigator.geolocation.watchPosition(
    (p) =>
      onFix({
        lat: p.coords.latitude,
        lon: p.coords.longitude,
        accuracyM: p.coords.accuracy,
        altitudeM: p.coords.altitude,
        altitudeAccuracyM: p.coords.altitudeAccuracy,
        at: new Date(p.timestamp).toISOString(),
      }),
    (e) =>
      onError(
        e.code === e.PERMISSION_DENIED
          ? 'Location is blocked for this site: allow it in the browser, or type the coordinates.'
          : 'No location fix yet: keep the phone in the open sky, or type the coordinates.',
      ),
    { enableHighAccuracy: true, maximumAge: 0, timeout: 60_000 },
  );
  return () => navigator.geolocation.clearWatch(id);
}

/** A fix older than this is not taken for a new booking (the advisor has walked on). */
export const FRESH_FIX_MS = 2 * 60_000;

export interface FixFields {
  lat: number | null;
  lon: number | null;
  accuracyM: number | null;
  altitudeM: number | null;
  altitudeAccuracyM: number | null;
}

/** The position fields of a record booked now: the latest fix when fresh, otherwise none (never a stale place). */
export function fixFields(fix: Fix | null, now: number = Date.now()): FixFields {
  if (!fix || !(now - Date.parse(fix.at) <= FRESH_FIX_MS)) return { lat: null, lon: null, accuracyM: null, altitudeM: null, altitudeAccuracyM: null };
  return { lat: fix.lat, lon: fix.lon, accuracyM: fix.accuracyM, altitudeM: fix.altitudeM, altitudeAccuracyM: fix.altitudeAccuracyM };
}
