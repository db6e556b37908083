import { describe, expect, it } from 'vitest';
import { screenSite, SOURCES, type Screening } from '@/lib/engine';
import * as demo from './fixtures/demo-sites';
import { expectRelative } from './helpers';

const codes = (s: Screening) => s.reasons.map((r) => r.code);
const value = (s: Screening, key: keyof Screening['figures']) => s.figures[key]?.value ?? NaN;

describe('whole-screen scenarios (invented demo readings)', () => {
  describe('clear go: spring, 3 m levelled fall, 24 m lift, 20 cows and a household', () => {
    const s = screenSite(demo.clearGo);
    it('is a go with no blocking or conditional reasons', () => {
      expect(s.verdict).toBe('go');
      expect(s.reasons.filter((r) => r.severity !== 'note')).toEqual([]);
      expect(s.conditions).toEqual([]);
    });
    it('fall equals ΣFS − ΣBS of the booking (2.1 + 0.4 + 0.55 − 1.35 − 2.15 − 2.56 = −3.01), the GPS run barely weighing', () => {
      expectRelative(value(s, 'fallM'), 3.01, 0.001);
    });
    it("delivery matches q = η·Q·H/h by hand with the Building Trades table at r ≈ 8 (η 0.52) and the bucket trials' mean", () => {
      const lowestLpm = ((20 / 12 + 20 / 12.5 + 20 / 11.8) / 3) * 60;
      const handLpd = ((0.52 * 0.5 * lowestLpm * 3.01) / 24.13) * 1440;
      expectRelative(value(s, 'deliveryLpd'), handLpd, 0.01);
    });
    it('demand is 20 × 62.46 L (NDSU 16.5 gal) + 4 × 50 L (WHO tap on plot) and the tank holds a day of it (1,500 L size)', () => {
      expectRelative(value(s, 'demandLpd'), 20 * 16.5 * 3.785411784 + 200, 0.001);
      expect(value(s, 'tankL')).toBe(1500);
    });
    it('drive pipe is 2″ for ~50 L/min (Ogden Table XI: 30–68 L/min), within the 3–7 × fall band and L/D 150–1000', () => {
      expect(s.figures.driveBoreMm?.inputs.nominalIn).toBe(2);
      const len = value(s, 'driveLengthM');
      expect(len).toBeGreaterThanOrEqual(3 * 3.01);
      expect(len).toBeLessThanOrEqual(7 * 3.01);
      const ld = value(s, 'driveLengthToDiameter');
      expect(ld).toBeGreaterThanOrEqual(150);
      expect(ld).toBeLessThanOrEqual(1000);
    });
    it('is almost certain to meet demand, with p10 ≤ delivery ≤ p90', () => {
      expect(value(s, 'probabilityMeetsDemand')).toBeGreaterThan(0.99);
      expect(value(s, 'deliveryP10Lpd')).toBeLessThanOrEqual(value(s, 'deliveryLpd'));
      expect(value(s, 'deliveryP90Lpd')).toBeGreaterThanOrEqual(value(s, 'deliveryLpd'));
    });
    it('lists a ram, both pipes, valves, intake and tank; the cautions cover surge, water, permits, drinking water and not-a-design', () => {
      const items = s.billOfMaterials.map((b) => b.item).join(' | ');
      for (const word of ['ram', 'Drive pipe', 'Delivery pipe', 'valve', 'Intake', 'tank']) expect(items).toContain(word);
      expect(s.cautions.map((c) => c.code).sort()).toEqual(['NOT_A_DESIGN', 'PERMITS', 'SURGE_PRESSURE', 'UNTREATED_WATER', 'WORKING_IN_WATER']);
    });
    it('traces every figure to a rule, a registered source and its inputs, and lists those sources', () => {
      for (const [key, f] of Object.entries(s.figures)) {
        expect(f.rule.length, key).toBeGreaterThan(3);
        expect(SOURCES[f.sourceId], key).toBeDefined();
        expect(s.sources.map((x) => x.id), key).toContain(f.sourceId);
      }
      expect(Object.keys(s.figures).length).toBeGreaterThanOrEqual(30);
    });
    it('is plain JSON and reproducible from the same seed', () => {
      expect(JSON.parse(JSON.stringify(s))).toEqual(s);
      expect(screenSite(demo.clearGo)).toEqual(s);
    });
  });

  it('conditional: enough water only with a larger delivery pipe than the farmer\u2019s ½″ on a 900 m run', () => {
    const s = screenSite(demo.conditionalSmallDeliveryPipe);
    expect(s.verdict).toBe('conditional');
    expect(codes(s)).toContain('DEMAND_NOT_MET');
    expect(s.conditions.find((c) => c.code === 'DEMAND_NOT_MET')?.text).toMatch(/delivery pipe/);
    expect(value(s, 'deliveryLpd')).toBeLessThan(value(s, 'demandLpd'));
  });

  it('no-go, too little fall: 0.4 m is under the 0.5 m minimum (Water for the World)', () => {
    const s = screenSite(demo.noGoLittleFall);
    expect(s.verdict).toBe('no-go');
    expect(codes(s)).toContain('FALL_TOO_SMALL');
    expect(s.reasons.find((r) => r.code === 'FALL_TOO_SMALL')?.text).toMatch(/0\.40 m/);
    expect(s.billOfMaterials).toEqual([]);
    expect(s.conditions).toEqual([]);
  });

  it('no-go, too little flow: ~6 L/min gives a 3 L/min design flow, under the smallest ram (2.5 gpm, Ogden Table XI)', () => {
    const s = screenSite(demo.noGoLittleFlow);
    expect(s.verdict).toBe('no-go');
    expect(codes(s)).toContain('FLOW_TOO_SMALL');
  });

  it('no-go, lift ratio too high: 100 m over 3 m is above 30:1 (Ogden 1911)', () => {
    const s = screenSite(demo.noGoLiftRatio);
    expect(s.verdict).toBe('no-go');
    expect(codes(s)).toContain('LIFT_RATIO_TOO_HIGH');
    expect(value(s, 'deliveryLpd')).toBe(0);
  });

  it('no-go, demand too high: 100 milking cows need 11,360 L/day, beyond reach even at 80 % of the flow', () => {
    const s = screenSite(demo.noGoDemand);
    expect(s.verdict).toBe('no-go');
    expect(s.reasons.find((r) => r.code === 'DEMAND_NOT_MET')?.severity).toBe('no-go');
  });

  it('no-go, surge above the rating: 1¼″ steel at ~1.7 m/s surges ~490 m, above every steel class', () => {
    const s = screenSite(demo.noGoSurge);
    expect(s.verdict).toBe('no-go');
    expect(s.reasons.find((r) => r.code === 'SURGE_ABOVE_RATING')?.severity).toBe('no-go');
    expect(value(s, 'peakPressureHeadM')).toBeGreaterThan(value(s, 'drivePipeRatingM'));
  });

  it('conditional, surge: a higher steel class holds the peak (Joukowsky with a ~1,390 m/s steel wave speed)', () => {
    const s = screenSite({ ...demo.clearGo, lift: { kind: 'direct', staticLiftM: 110, method: 'level' }, fallRuns: [{ method: 'hose', steps: [{ upperReadingM: 0.1, lowerReadingM: 1.6 }, { upperReadingM: 0.2, lowerReadingM: 1.7 }, { upperReadingM: 0.1, lowerReadingM: 1.6 }, { upperReadingM: 0.2, lowerReadingM: 1.7 }] }], demand: [{ kind: 'beef-cow-dry', count: 5 }] });
    const surge = s.reasons.find((r) => r.code === 'SURGE_ABOVE_RATING');
    expect(surge?.severity).toBe('conditional');
    expect(s.conditions.find((c) => c.code === 'SURGE_ABOVE_RATING')?.text).toMatch(/class 300/);
  });

  it('GPS-only fall is too uncertain to build on: conditional with a re-survey condition', () => {
    const s = screenSite({ ...demo.clearGo, fallRuns: [{ method: 'gps', startAltitudeM: 412, endAltitudeM: 407, horizontalAccuracyM: 4 }] });
    expect(codes(s)).toContain('FALL_UNCERTAIN');
    expect(s.verdict).not.toBe('go');
  });

  it('no dry-season flow measured: conditional until measured at the end of the dry season', () => {
    const s = screenSite({ ...demo.clearGo, flowMeasurements: [{ method: 'volumetric', season: 'wet', trials: [{ volumeL: 20, seconds: 12 }] }] });
    expect(s.verdict).toBe('conditional');
    expect(codes(s)).toContain('FLOW_NOT_DRY_SEASON');
  });
  it('a level run out and back that closes badly is conditional (third-order 12 mm√K, or 1 % of the fall for a screen)', () => {
    const s = screenSite({
      ...demo.clearGo,
      fallRuns: [{
        method: 'level',
        routeLengthM: 60,
        rows: [{ backsightM: 2.1 }, { foresightM: 1.35, backsightM: 0.4 }, { foresightM: 2.15, backsightM: 0.55 }, { foresightM: 2.56 }],
        // Back up the slope: rises 3.21 m instead of 3.01 m, a 200 mm misclosure.
        returnRows: [{ backsightM: 2.9 }, { foresightM: 0.6, backsightM: 2.3 }, { foresightM: 1.39 }],
      }],
    });
    expect(s.figures.fallM?.inputs.run1MisclosureMm).toBeCloseTo(-200, 6);
    expect(s.reasons.find((r) => r.code === 'FALL_MISCLOSURE')?.severity).toBe('conditional');
    expect(s.verdict).toBe('conditional');
  });

  it('a clinometer run that disagrees with the level run by far more than either uncertainty is flagged', () => {
    const s = screenSite({
      ...demo.clearGo,
      fallRuns: [
        { method: 'level', rows: [{ backsightM: 2.1 }, { foresightM: 1.35, backsightM: 0.4 }, { foresightM: 2.15, backsightM: 0.55 }, { foresightM: 2.56 }] },
        { method: 'clinometer', legs: [{ slopeDistanceM: 20, angleBelowHorizontalDeg: 20 }] },
      ],
    });
    expect(codes(s)).toContain('FALL_RUNS_DISAGREE');
  });
});
