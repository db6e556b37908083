import { describe, expect, it } from 'vitest';
import { niceStep, profileGeometry } from '@/lib/shared/sheet/profile';
import { siteMapGeometry } from '@/lib/shared/sheet/site-map';

describe('elevation profile geometry', () => {
  const p = { fallM: 4, staticLiftM: 30, driveLengthM: 24, deliveryLengthM: 420 };
  const g = profileGeometry(p, 'metric');
  const [intake, pump, tank] = g.nodes;

  it('draws lengths to scale: horizontal runs in proportion to the pipes on the slope', () => {
    const driveRun = Math.sqrt(24 ** 2 - 4 ** 2);
    const deliveryRun = Math.sqrt(420 ** 2 - 30 ** 2);
    const ratio = ((pump?.x ?? 0) - (intake?.x ?? 0)) / ((tank?.x ?? 0) - (pump?.x ?? 0));
    expect(ratio).toBeCloseTo(driveRun / deliveryRun, 6);
  });

  it('draws heights to scale: tank above intake above ram, in proportion', () => {
    const base = pump?.y ?? 0;
    expect((base - (tank?.y ?? 0)) / (base - (intake?.y ?? 0))).toBeCloseTo(30 / 4, 6);
    expect(g.exaggeration).toMatch(/Heights drawn \d+ × larger/);
  });

  it('labels heights and lengths in the reader\'s units', () => {
    const us = profileGeometry(p, 'us');
    expect(us.nodes[2]?.height).toBe('98.4 ft above the ram');
    expect(us.pipes[1]?.label).toBe('Delivery pipe 1,378 ft');
    expect(g.pipes[0]?.label).toBe('Drive pipe 24 m');
    expect(us.yGrid.every((l) => l.label.endsWith(' ft'))).toBe(true);
  });

  it('picks 1-2-5 grid steps', () => {
    expect(niceStep(30, 4)).toBe(10);
    expect(niceStep(420, 5)).toBe(100);
    expect(niceStep(7, 4)).toBe(2);
  });
});

describe('point map geometry', () => {
  const pts = [
    { role: 'intake', label: 'Intake', lat: 52.41931, lon: -3.61702 },
    { role: 'pump', label: 'Ram', lat: 52.41912, lon: -3.61668 },
    { role: 'tank', label: 'Tank', lat: 52.41835, lon: -3.61403 },
  ];

  it('keeps every point in the box, north up, and a scale bar of a round length', () => {
    const g = siteMapGeometry(pts, 'metric');
    expect(g).not.toBeNull();
    for (const point of g?.points ?? []) {
      expect(point.x).toBeGreaterThanOrEqual(0);
      expect(point.x).toBeLessThanOrEqual(g?.width ?? 0);
    }
    const intake = g?.points[0];
    const tank = g?.points[2];
    expect(intake?.y ?? 0).toBeLessThan(tank?.y ?? 0); // intake lies north of the tank
    expect(g?.scaleBar.label).toMatch(/^(1|2|5)0* m$/);
    expect(g?.route).toHaveLength(3);
  });

  it('scales the bar with the map: intake→tank distance over the bar matches metres', () => {
    const g = siteMapGeometry(pts, 'metric');
    const a = g?.points[0];
    const b = g?.points[2];
    const px = Math.hypot((b?.x ?? 0) - (a?.x ?? 0), (b?.y ?? 0) - (a?.y ?? 0));
    const metresPerPx = Number(g?.scaleBar.label.replace(' m', '')) / (g?.scaleBar.length ?? 1);
    const dn = (52.41835 - 52.41931) * 111_320;
    const de = (-3.61403 + 3.61702) * 111_320 * Math.cos((52.41893 * Math.PI) / 180);
    expect(px * metresPerPx).toBeCloseTo(Math.hypot(dn, de), -1);
  });

  it('needs two located points', () => {
    expect(siteMapGeometry(pts.slice(0, 1), 'metric')).toBeNull();
  });
});
