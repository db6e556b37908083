import { demandOf } from './helpers';
import { describe, expect, it } from 'vitest';
import { mulberry32, normalSampler, screenSite } from '@/lib/engine';
import { clearGo } from './fixtures/demo-sites';

describe('seeded generator', () => {
  it('same seed, same sequence; different seed, different sequence', () => {
    const a = mulberry32(123);
    const b = mulberry32(123);
    const c = mulberry32(124);
    const sa = Array.from({ length: 5 }, a);
    expect(Array.from({ length: 5 }, b)).toEqual(sa);
    expect(Array.from({ length: 5 }, c)).not.toEqual(sa);
  });
  it('uniforms lie in [0, 1) with mean ≈ 1/2 and variance ≈ 1/12 (properties of U(0,1))', () => {
    const u = mulberry32(9);
    let sum = 0;
    let sq = 0;
    let outside = 0;
    const n = 100000;
    // One assertion for the range, not 100,000 expect() calls (those took seconds on a busy machine).
    for (let i = 0; i < n; i++) {
      const x = u();
      if (!(x >= 0 && x < 1)) outside++;
      sum += x;
      sq += x * x;
    }
    expect(outside).toBe(0);
    expect(Math.abs(sum / n - 0.5)).toBeLessThan(0.005);
    expect(Math.abs(sq / n - (sum / n) ** 2 - 1 / 12)).toBeLessThan(0.002);
  });
  it('Box–Muller normals have mean ≈ 0, sd ≈ 1 and about 68.3 % within ±1σ (standard normal table)', () => {
    const z = normalSampler(mulberry32(5));
    const n = 100000;
    let sum = 0;
    let sq = 0;
    let within = 0;
    for (let i = 0; i < n; i++) {
      const x = z();
      sum += x;
      sq += x * x;
      if (Math.abs(x) <= 1) within++;
    }
    expect(Math.abs(sum / n)).toBeLessThan(0.01);
    expect(Math.abs(Math.sqrt(sq / n) - 1)).toBeLessThan(0.01);
    expect(Math.abs(within / n - 0.6827)).toBeLessThan(0.006);
  });
});

describe('Monte Carlo in screenSite', () => {
  it('is reproducible for a seed and moves (slightly) with another seed', () => {
    const a = screenSite(clearGo).figures;
    const b = screenSite(clearGo).figures;
    const c = screenSite({ ...clearGo, monteCarlo: { samples: 10000, seed: 43 } }).figures;
    expect(b.deliveryP10Lpd?.value).toBe(a.deliveryP10Lpd?.value);
    expect(c.deliveryP10Lpd?.value).not.toBe(a.deliveryP10Lpd?.value);
    expect(Math.abs((c.deliveryP10Lpd?.value ?? 0) / (a.deliveryP10Lpd?.value ?? 1) - 1)).toBeLessThan(0.01);
  });

  it('a GPS-only fall widens the p10–p90 band far beyond a level run (GPS vertical ≈ 2 × horizontal, SPS 2008 notes)', () => {
    const level = screenSite(clearGo).figures;
    const gps = screenSite({ ...clearGo, fallRuns: [{ method: 'gps', startAltitudeM: 412, endAltitudeM: 409, horizontalAccuracyM: 4 }] }).figures;
    const width = (f: typeof level) => (f.deliveryP90Lpd?.value ?? 0) - (f.deliveryP10Lpd?.value ?? 0);
    expect(width(gps)).toBeGreaterThan(5 * width(level));
  });

  it('when the mean delivery just meets demand the probability of meeting it is near one half', () => {
    // The ram held to one size, so the demand changes only the chance, not the sizing.
    const held = { ...clearGo, ram: { driveIn: 1.25, count: 1 }, settings: { demandMarginFraction: 0 } };
    const base = screenSite(held);
    const delivered = base.figures.deliveryLpd?.value ?? 0;
    const s = screenSite({ ...held, demand: [demandOf(delivered)] });
    const p = s.figures.probabilityMeetsDemand?.value ?? NaN;
    expect(p).toBeGreaterThan(0.35);
    expect(p).toBeLessThan(0.65);
  });

  it('a mean that meets demand with a probability under one half is conditional', () => {
    const base = screenSite({ ...clearGo, ram: { driveIn: 1.25, count: 1 }, settings: { demandMarginFraction: 0 } });
    const delivered = base.figures.deliveryLpd?.value ?? 0;
    const s = screenSite({
      ...clearGo,
      ram: { driveIn: 1.25, count: 1 },
      fallRuns: [{ method: 'clinometer', legs: [{ slopeDistanceM: 300, angleBelowHorizontalDeg: 0.575 }] }],
      demand: [demandOf(delivered * 0.999)],
      settings: { demandMarginFraction: 0 },
    });
    const p = s.figures.probabilityMeetsDemand?.value ?? NaN;
    expect(s.figures.deliveryLpd?.value ?? 0).toBeGreaterThanOrEqual(delivered * 0.999 - 1);
    if (p < 0.5) {
      expect(s.verdict).toBe('conditional');
      expect(s.reasons.map((r) => r.code)).toContain('DEMAND_UNCERTAIN');
    } else {
      expect(s.reasons.map((r) => r.code)).not.toContain('DEMAND_UNCERTAIN');
    }
  });
});
