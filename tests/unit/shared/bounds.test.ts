import { describe, expect, it } from 'vitest';
import { isoDateTime, isoDay, loneSurrogatePath } from '@/lib/shared/schemas/bounds';

describe('shared bounds', () => {
  it('date-times within 1900–2100 in UTC pass; past 9999 once the offset applies, or before 1000, do not', () => {
    expect(isoDateTime.safeParse('2026-08-01T09:30:00.000Z').success).toBe(true);
    expect(isoDateTime.safeParse('2026-08-01T09:30:00+02:00').success).toBe(true);
    for (const v of ['9999-12-31T23:59:59-23:59', '0000-01-01T00:00:00Z', '0999-12-31T00:00:00Z', '2101-01-01T00:00:00Z']) {
      expect(isoDateTime.safeParse(v).success, v).toBe(false);
    }
  });

  it('days must exist and fall within the years', () => {
    const day = isoDay('Pick a date.');
    expect(day.safeParse('2026-12-31').success).toBe(true);
    for (const v of ['0000-01-01', '0999-12-31', '2026-02-30', '2101-01-01', '2026-13-01']) expect(day.safeParse(v).success, v).toBe(false);
  });

  it('finds the first lone surrogate in values and keys; well-formed emoji pass; 200,000 levels deep does not overflow', () => {
    expect(loneSurrogatePath({ a: ['ok', 'fine 🐐'], b: { c: 'x\ud83d' } })).toEqual(['b', 'c']);
    expect(loneSurrogatePath({ ['k\udc00']: 1 })).toEqual(['k\udc00']);
    expect(loneSurrogatePath({ a: '🐐💧', b: [1, null, true] })).toBeNull();
    expect(loneSurrogatePath(JSON.parse('['.repeat(200_000) + ']'.repeat(200_000)))).toBeNull();
  });
});
