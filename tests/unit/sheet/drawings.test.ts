import { describe, expect, it } from 'vitest';
import { NOTE_SIZE, niceStep, nodeLabelAt, profileGeometry, profileLabelAt, textWidth } from '@/lib/shared/sheet/profile';
import { profileSvg, siteMapSvg } from '@/lib/shared/sheet/drawing-svg';
import { MAP_LABEL_SIZE, siteMapGeometry } from '@/lib/shared/sheet/site-map';

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

  it("labels heights and lengths in the reader's units", () => {
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

describe('labels stay inside the frame', () => {
  const sites = [
    { fallM: 4.18, staticLiftM: 29.5, driveLengthM: 24, deliveryLengthM: 420 },
    { fallM: 12, staticLiftM: 3, driveLengthM: 160, deliveryLengthM: 40 },
    { fallM: 1.2, staticLiftM: 95, driveLengthM: 8, deliveryLengthM: 2400 },
  ];
  for (const [w, h] of [
    [640, 320],
    [360, 300],
  ] as const) {
    for (const site of sites) {
      it(`profile ${w}×${h}, fall ${site.fallM} m, lift ${site.staticLiftM} m: every label box and the tank are in view`, () => {
        for (const units of ['metric', 'us'] as const) {
          const g = profileGeometry(site, units, w, h);
          const boxes = [...g.nodes.map((n) => nodeLabelAt(g, n)), ...g.pipes.map((p) => profileLabelAt(g, p))];
          for (const b of boxes) {
            expect(b.x).toBeGreaterThanOrEqual(0);
            expect(b.x + b.width).toBeLessThanOrEqual(g.width);
            expect(b.y).toBeGreaterThanOrEqual(0);
            expect(b.y + 28).toBeLessThanOrEqual(g.height);
          }
          const tank = g.nodes.find((n) => n.key === 'tank');
          expect(tank && tank.x - 14 >= 0 && tank.x + 2 <= g.width && tank.y - 20 >= 0).toBe(true);
          const tankLabel = tank && nodeLabelAt(g, tank);
          expect(tankLabel && textWidth(tank?.height ?? '', NOTE_SIZE) <= tankLabel.width).toBe(true);
        }
      });
    }
  }

  it('a map label near the right edge turns to the left of its point', () => {
    const g = siteMapGeometry(
      [
        { role: 'intake', label: 'Ridge by the old sheepfold', lat: 52.4193, lon: -3.617 },
        { role: 'tank', label: 'Tank on the meadow bench', lat: 52.4183, lon: -3.614 },
      ],
      'metric',
    );
    if (!g) throw new Error('two points make a map');
    for (const p of g.points) {
      const w = textWidth(p.label, MAP_LABEL_SIZE);
      const left = p.anchor === 'start' ? p.labelX : p.labelX - w;
      expect(left).toBeGreaterThanOrEqual(0);
      expect(left + w).toBeLessThanOrEqual(g.width);
    }
    expect(g.points.find((p) => p.role === 'tank')?.anchor).toBe('end');
  });
});

describe('the drawings as SVG markup (the page and the PDF draw the same)', () => {
  it('escapes every label: hostile text stays text', () => {
    const g = siteMapGeometry(
      [
        { role: 'intake', label: '<script>alert("x")</script>', lat: 52.4193, lon: -3.617 },
        { role: 'tank', label: 'Tom & Jo\'s "tank"', lat: 52.4183, lon: -3.614 },
      ],
      'metric',
    );
    if (!g) throw new Error('two points make a map');
    const svg = siteMapSvg(g);
    expect(svg).not.toContain('<script>');
    expect(svg).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;');
    expect(svg).toContain('Tom &amp; Jo&#39;s &quot;tank&quot;');
  });

  it("draws the tank and every label of the profile, with the PDF's fonts per run when asked", () => {
    const g = profileGeometry({ fallM: 4, staticLiftM: 30, driveLengthM: 24, deliveryLengthM: 420 }, 'metric', 360, 300);
    const svg = profileSvg(g, {
      runsFor: (text) =>
        text === 'Tank'
          ? [
              { font: 'a', text: 'Ta' },
              { font: 'b', text: 'nk' },
            ]
          : [{ font: 'a', text }],
    });
    expect(svg).toContain('data-node="tank"');
    for (const node of g.nodes) expect(svg).toContain(node.height);
    expect(svg).toContain('<tspan font-family="a">Ta</tspan><tspan font-family="b">nk</tspan>');
    expect(svg).toMatch(/^<svg [^>]*viewBox="0 0 360 300"/);
  });
});
