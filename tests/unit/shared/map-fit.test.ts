import { describe, expect, it } from 'vitest';
import { boundsOf, distanceKm, splitOutliers } from '@/lib/shared/map-fit';

// A valley of marks within a few km, and one position typed about 290 km away.
const valley = Array.from({ length: 12 }, (_, i) => ({ name: `farm ${i}`, lat: 52.39 + (i % 4) * 0.02, lon: -3.68 + Math.floor(i / 4) * 0.05 }));
const stray = { name: 'Stray', lat: 51.0412, lon: -0.5127 };

describe('fitting the district map', () => {
  it('measures great-circle distances (one degree of latitude is about 111 km)', () => {
    expect(distanceKm({ lat: 52, lon: -3 }, { lat: 53, lon: -3 })).toBeCloseTo(111.2, 1);
    expect(distanceKm({ lat: 52.42, lon: -3.62 }, stray)).toBeGreaterThan(250);
  });

  it('leaves a far mark out of the fit and names it with its distance', () => {
    const { inside, outliers } = splitOutliers([...valley, stray]);
    expect(inside).toHaveLength(12);
    expect(outliers.map((o) => o.name)).toEqual(['Stray']);
    expect(outliers[0]?.km).toBeGreaterThan(250);
    const box = boundsOf(inside);
    expect(box?.[0][0]).toBeCloseTo(52.39);
    expect(box?.[1][1]).toBeCloseTo(-3.58);
  });

  it('keeps a spread-out district whole: nothing within 25 km is an outlier', () => {
    const wide = [...valley, { name: 'Hill farm', lat: 52.55, lon: -3.5 }];
    expect(splitOutliers(wide).outliers).toEqual([]);
    expect(splitOutliers([valley[0]!, stray]).outliers).toEqual([]);
    expect(boundsOf([])).toBeNull();
  });
});
