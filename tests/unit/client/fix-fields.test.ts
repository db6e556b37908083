import { describe, expect, it } from 'vitest';
import { FRESH_FIX_MS, fixFields, type Fix } from '@/lib/client/geolocation';

const at = Date.parse('2026-08-01T09:30:00.000Z');
const fix: Fix = { lat: 52.4193, lon: -3.617, accuracyM: 6, altitudeM: 236, altitudeAccuracyM: 9, at: new Date(at).toISOString() };

describe('the position a station is booked with', () => {
  it('takes the latest fix, with its accuracy', () => {
    expect(fixFields(fix, at + 5_000)).toEqual({ lat: 52.4193, lon: -3.617, accuracyM: 6, altitudeM: 236, altitudeAccuracyM: 9 });
  });
  it('books no position without a fix, or with a stale one', () => {
    const none = { lat: null, lon: null, accuracyM: null, altitudeM: null, altitudeAccuracyM: null };
    expect(fixFields(null, at)).toEqual(none);
    expect(fixFields(fix, at + FRESH_FIX_MS + 1)).toEqual(none);
    expect(fixFields({ ...fix, at: 'not a time' }, at)).toEqual(none);
  });
});
