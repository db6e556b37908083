import { describe, expect, it } from 'vitest';
import { commissioningCheck, mulberry32, predictionFromFigures, type CommissioningPrediction } from '@/lib/engine';
import { expectWithin } from './helpers';

// REFERENCES §1: definitions from the NITK Surathkal lab notes; the worked example (Q 30 L/s, q 3 L/s, H 4 m,
// h 18 m) from a transcribed fluid-mechanics textbook example; the results 0.450 and 0.389 computed there.
const example = { driveLpm: 30 * 60, deliveredLpm: 3 * 60, fallM: 4, liftM: 18, beatsPerMinute: 60 };

describe('commissioningCheck efficiencies (NITK lab notes definitions)', () => {
  it('textbook example: η_D = q·h/(Q·H) = 0.450 and η_R = q·(h − H)/((Q − q)·H) = 0.389', () => {
    const r = commissioningCheck(example);
    expectWithin(r.daubuissonEfficiency, 0.45, 5e-4);
    expectWithin(r.rankineEfficiency, 0.389, 5e-4);
    expectWithin(r.measuredLpd, 180 * 1440, 1e-9);
    expect(r.outcome).toBeNull();
    expect(r.beatsInBand).toBe(true);
  });
  it('property: η_R = (η_D − r)/(1 − r) with r = q/Q, and η_R ≤ η_D, for random valid readings', () => {
    const u = mulberry32(11);
    for (let i = 0; i < 500; i++) {
      const fallM = 0.5 + 10 * u();
      const liftM = fallM * (1.2 + 25 * u());
      const driveLpm = 5 + 500 * u();
      // Physically possible readings only: η_D ≤ 1 (no energy made).
      const deliveredLpm = (driveLpm * fallM * (0.01 + 0.98 * u())) / liftM;
      const r = commissioningCheck({ driveLpm, deliveredLpm, fallM, liftM, beatsPerMinute: 60 });
      const ratio = deliveredLpm / driveLpm;
      expectWithin(r.rankineEfficiency, (r.daubuissonEfficiency - ratio) / (1 - ratio), 1e-9);
      expect(r.rankineEfficiency).toBeLessThanOrEqual(r.daubuissonEfficiency + 1e-12);
    }
  });
  it('flags readings that would make energy (η_D > 1) for a re-check', () => {
    const r = commissioningCheck({ ...example, deliveredLpm: 500 });
    expect(r.daubuissonEfficiency).toBeGreaterThan(1);
    expect(r.causes.map((c) => c.code)).toEqual(['readings-impossible']);
  });
  it('refuses a delivered flow at or above the drive flow, and a lift at or below the fall', () => {
    expect(() => commissioningCheck({ ...example, deliveredLpm: 1800 })).toThrow(/deliveryLpm/);
    expect(() => commissioningCheck({ ...example, liftM: 4 })).toThrow(/liftM/);
    expect(() => commissioningCheck({ ...example, beatsPerMinute: 0 })).toThrow(/beatsPerMinute/);
  });
});

const prediction: CommissioningPrediction = { deliveryLpd: 260_000, p10Lpd: 240_000, p90Lpd: 280_000, efficiency: 0.45, driveLpm: 1800, totalLiftM: 18 };

describe('commissioningCheck against the screening', () => {
  it('within the 10–90 % band is as predicted, with no causes offered', () => {
    const r = commissioningCheck(example, prediction);
    expect(r.outcome).toBe('as-predicted');
    expectWithin(r.deliveryRatio ?? NaN, (180 * 1440) / 260_000, 1e-12);
    expect(r.causes).toEqual([]);
  });
  it('above the band', () => {
    expect(commissioningCheck({ ...example, deliveredLpm: 200 }, prediction).outcome).toBe('above-band');
  });
  it('short with a low efficiency suggests air, waste valve, leaks; a plastic drive pipe adds the surge cause', () => {
    const r = commissioningCheck({ ...example, deliveredLpm: 140, drivePipeMaterial: 'hdpe' }, prediction);
    expect(r.outcome).toBe('short');
    const codes = r.causes.map((c) => c.code);
    expect(codes).toEqual(expect.arrayContaining(['air-in-drive', 'waste-valve', 'leaks', 'flexible-drive']));
    expect(codes).not.toContain('drive-low');
    const steel = commissioningCheck({ ...example, deliveredLpm: 140, drivePipeMaterial: 'galvanized-steel' }, prediction);
    expect(steel.causes.map((c) => c.code)).not.toContain('flexible-drive');
  });
  it('well short on a low drive flow points at the intake first', () => {
    const r = commissioningCheck({ ...example, driveLpm: 1000, deliveredLpm: 80 }, prediction);
    expect(r.outcome).toBe('well-short');
    expect(r.causes.map((c) => c.code)).toContain('drive-low');
  });
  it('beats outside 40–120 per minute (NITK notes) are reported even when delivery is fine', () => {
    expect(commissioningCheck({ ...example, beatsPerMinute: 150 }, prediction).causes.map((c) => c.code)).toEqual(['beats-fast']);
    const slow = commissioningCheck({ ...example, beatsPerMinute: 30 }, prediction);
    expect(slow.beatsInBand).toBe(false);
    expect(slow.causes.map((c) => c.code)).toEqual(['beats-slow']);
    expect(commissioningCheck({ ...example, beatsPerMinute: 40 }, prediction).beatsInBand).toBe(true);
    expect(commissioningCheck({ ...example, beatsPerMinute: 120 }, prediction).beatsInBand).toBe(true);
  });
  it('reads the prediction off a screening\u2019s figures, or gives null when one is missing', () => {
    const f = (value: number) => ({ value });
    const figures = { deliveryLpd: f(1), deliveryP10Lpd: f(0.5), deliveryP90Lpd: f(2), efficiency: f(0.4), driveFlowLpm: f(30), totalLiftM: f(20) };
    expect(predictionFromFigures(figures)).toEqual({ deliveryLpd: 1, p10Lpd: 0.5, p90Lpd: 2, efficiency: 0.4, driveLpm: 30, totalLiftM: 20 });
    expect(predictionFromFigures({ ...figures, efficiency: { value: null } })).toBeNull();
  });
  it('with rams in parallel, one ram is checked against its share of the daily figures', () => {
    const f = (value: number) => ({ value });
    const figures = {
      deliveryLpd: f(3000),
      deliveryP10Lpd: f(2400),
      deliveryP90Lpd: f(3600),
      efficiency: f(0.4),
      driveFlowLpm: f(30),
      totalLiftM: f(20),
      ramCount: f(3),
    };
    expect(predictionFromFigures(figures)).toEqual({ deliveryLpd: 1000, p10Lpd: 800, p90Lpd: 1200, efficiency: 0.4, driveLpm: 30, totalLiftM: 20 });
  });
});
