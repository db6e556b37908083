// Advice an experienced installer would sign: whole sites and edge cases, each checked against a named source.
import { describe, expect, it } from 'vitest';
import { combineRuns, estimateFlow, FLOAT_RELATIVE_SIGMA } from '@/lib/engine/readings';
import { attainableDriveVelocityMps, chooseDriveLength, designDeliveryPipe } from '@/lib/engine/pipe-design';
import { judge, type RamVerdictFacts } from '@/lib/engine/verdict';
import { G, minimumDriveVelocityMps, screenSite, type SiteReadingsInput } from '@/lib/engine';
import { demandOf, expectRelative, expectWithin, hoseRunOf } from './helpers';

interface Knobs {
  fallM: number;
  liftM: number;
  lowestLpm: number;
  demand?: SiteReadingsInput['demand'];
  deliveryPipe?: SiteReadingsInput['deliveryPipe'];
  drivePipe?: SiteReadingsInput['drivePipe'];
  settings?: SiteReadingsInput['settings'];
}

// An invented site: one hose-level step for the fall, one bucket trial, a household of 4 and 10 dry cows.
function site(k: Knobs): SiteReadingsInput {
  return {
    flowMeasurements: [{ method: 'volumetric', season: 'dry', trials: [{ volumeL: k.lowestLpm / 6, seconds: 10 }] }],
    fallRuns: [hoseRunOf(k.fallM)],
    lift: { kind: 'direct', staticLiftM: k.liftM, method: 'level' },
    drivePipe: k.drivePipe ?? { material: 'galvanized-steel' },
    deliveryPipe: k.deliveryPipe ?? { lengthM: 300, material: 'hdpe' },
    demand: k.demand ?? [
      { kind: 'person-tap-on-plot', count: 4 },
      { kind: 'beef-cow-dry', count: 10 },
    ],
    settings: k.settings,
    monteCarlo: { samples: 4000, seed: 11 },
  };
}

const value = (s: ReturnType<typeof screenSite>, key: keyof ReturnType<typeof screenSite>['figures']) => s.figures[key]?.value ?? NaN;
const codes = (s: ReturnType<typeof screenSite>) => s.reasons.map((r) => r.code);

describe('size from demand, not from the creek (Ogden 1911, Table XI)', () => {
  it('a 1,000 L/min dry-season creek for 4 people and 10 cows (730 L/day) gets the smallest ram, not a 4″ one delivering 26,000 L/day', () => {
    const s = screenSite(site({ fallM: 4, liftM: 30, lowestLpm: 1000 }));
    expect(s.verdict).toBe('go');
    expect(value(s, 'ramSizeIn')).toBe(1.25);
    expect(value(s, 'ramCount')).toBe(1);
    expect(value(s, 'deliveryLpd')).toBeGreaterThanOrEqual(1.2 * value(s, 'demandLpd'));
    expect(value(s, 'deliveryLpd')).toBeLessThan(5000);
  });

  it('a 5,100 L/min river for the same farm gets the same small ram, not a 12″', () => {
    expect(value(screenSite(site({ fallM: 4, liftM: 30, lowestLpm: 5100 })), 'ramSizeIn')).toBe(1.25);
  });

  it('where the farm\u2019s 1¼″ drive pipe sets the size and one such ram is too small, rams in parallel each on its own drive pipe; the bill counts them', () => {
    // 80 dry cows (4,240 L/day) on a 200 L/min stream: one 1¼″ ram at its 6 gpm delivers too little at ratio 5.
    const s = screenSite(
      site({
        fallM: 3,
        liftM: 15,
        lowestLpm: 200,
        drivePipe: { material: 'galvanized-steel', diameterMm: 35.1 },
        demand: [{ kind: 'beef-cow-dry', count: 80 }],
      }),
    );
    expect(value(s, 'ramCount')).toBeGreaterThan(1);
    expect(codes(s)).toContain('RAMS_IN_PARALLEL');
    const ram = s.billOfMaterials.find((b) => b.item === 'Hydraulic ram');
    expect(ram?.quantity).toBe(value(s, 'ramCount'));
    expect(value(s, 'deliveryLpd')).toBeCloseTo(value(s, 'ramCount') * value(s, 'deliveryLpm') * 1440, 0);
  });

  it('an advisor can still force a size and count', () => {
    const s = screenSite({ ...site({ fallM: 4, liftM: 30, lowestLpm: 1000 }), ram: { driveIn: 3, count: 1 } });
    expect(value(s, 'ramSizeIn')).toBe(3);
    expect(s.figures.ramSizeIn?.rule).toMatch(/advisor/);
  });

  it('the least working fall per size: 0.7 m is below the 3 ft the 1¼″ and 1½″ rams need, so a 2″ (2 ft) is chosen', () => {
    const s = screenSite(site({ fallM: 0.7, liftM: 8, lowestLpm: 300 }));
    expect(value(s, 'ramSizeIn')).toBeGreaterThanOrEqual(2);
  });

  it('0.55 m of fall: above the 0.5 m minimum (Water for the World) but below every size\u2019s least fall (2 ft): a no-go that says so', () => {
    const s = screenSite(site({ fallM: 0.55, liftM: 8, lowestLpm: 300 }));
    expect(s.verdict).toBe('no-go');
    expect(s.reasons.find((r) => r.code === 'FALL_BELOW_RAM_SIZES')?.text).toMatch(/0\.550 m.*0\.610 m/);
  });
});

describe('what the fall can push (Iversen 1975: closure flow stays below the open-valve steady flow)', () => {
  it('with no losses the open-valve velocity is Torricelli\u2019s √(2gH): 8.86 m/s for 4 m', () => {
    expectWithin(attainableDriveVelocityMps(4, 0, 35, 0.15, 0), Math.sqrt(2 * G * 4), 1e-6);
  });

  it('4 m of fall through 20 m of 1¼″ steel pushes about 2 m/s, not the 3.4 m/s a forced flow would claim', () => {
    const v = attainableDriveVelocityMps(4, 20, 35.1, 0.15);
    expect(v).toBeGreaterThan(1.6);
    expect(v).toBeLessThan(2.3);
  });

  it('a 60 L/min creek forced through the farmer\u2019s 1¼″ pipe: the drive flow and closure velocity never exceed what the fall pushes', () => {
    const s = screenSite(site({ fallM: 1, liftM: 8, lowestLpm: 600, drivePipe: { material: 'galvanized-steel', diameterMm: 35.1, lengthM: 6 } }));
    expect(value(s, 'driveClosureVelocityMps')).toBeLessThanOrEqual(value(s, 'attainableDriveVelocityMps') * (1 + 1e-4));
  });
});

describe('pressures as they occur (Joukowsky; the delivery valve opens at about the lift)', () => {
  it('fall 30 m, lift 150 m: the running peak is about the lift, the blocked-delivery head is fall + surge, neither is lift + surge', () => {
    const s = screenSite(site({ fallM: 30, liftM: 150, lowestLpm: 300 }));
    expectRelative(value(s, 'workingPeakHeadM'), 1.2 * value(s, 'totalLiftM'), 1e-4);
    expectRelative(value(s, 'blockedDeliveryHeadM'), value(s, 'fallM') + value(s, 'surgeHeadM'), 1e-4);
    expect(value(s, 'blockedDeliveryHeadM')).toBeLessThan(value(s, 'totalLiftM') + value(s, 'surgeHeadM'));
    expect(codes(s)).not.toContain('WORKING_PRESSURE_ABOVE_RATING');
    expect(codes(s)).not.toContain('BLOCKED_PRESSURE_ABOVE_RATING');
  });

  it('least closure velocity v = g·(h − H)/a: h 50 m, H 10 m, a 1,300 m/s gives 0.302 m/s (0.38 m/s without the fall, Thomas 1994)', () => {
    expectWithin(minimumDriveVelocityMps(50, 1300, 10), (G * 40) / 1300, 1e-12);
    expectWithin(minimumDriveVelocityMps(50, 1300), 0.38, 0.005);
  });

  it('a plastic drive pipe is rated at half its class for cycling, and the screen recommends rigid steel', () => {
    const s = screenSite(site({ fallM: 3, liftM: 20, lowestLpm: 200, drivePipe: { material: 'pvc' } }));
    expectRelative(value(s, 'drivePipeAllowedHeadM'), 0.5 * value(s, 'drivePipeRatingM'), 1e-4);
    expect(codes(s)).toContain('PLASTIC_DRIVE_PIPE');
  });

  it('a blocked-delivery head above the rating with no higher class is a condition naming the fix (relief valve, no float valve), not a no-go', () => {
    const j = judge(facts({ drive: { ...driveFacts, blockedDeliveryHeadM: 260, workingPeakHeadM: 40, allowedHeadM: 211, higherClassLabel: null } }));
    expect(j.verdict).toBe('conditional');
    expect(j.conditions.find((c) => c.code === 'BLOCKED_PRESSURE_ABOVE_RATING')?.text).toMatch(/relief valve.*float valve/);
  });

  it('no condition asks for what is there: a soft steel drive pipe is not told to become steel', () => {
    const j = judge(facts({ drive: { ...driveFacts, closureVelocityMps: 0.3, minimumClosureVelocityMps: 0.8, rigid: true } }));
    expect(j.conditions.map((c) => c.text).join(' ')).not.toMatch(/galvanized steel/);
    expect(j.verdict).toBe('no-go');
  });
});

describe('every size, every check', () => {
  it('a 12″ ram row (5″ delivery, above every listed delivery size but 6″) gets a 6″ or larger delivery pipe, not ½″', () => {
    const d = designDeliveryPipe({
      pipe: { lengthM: 300, material: 'hdpe' },
      fittingsAllowance: 0.25,
      ramDeliveryIn: 5,
      staticLiftM: 24,
      frictionFor: () => 0,
    });
    expect(d.size.nominalIn).toBeGreaterThanOrEqual(6);
  });

  it('the drive length sits inside both the fall band and L/D 150–1000 when they overlap (NITK notes; Perkin 3–7 × fall)', () => {
    const { lengthM, conflict } = chooseDriveLength(3 * 2, 7 * 2, 52.5);
    expect(conflict).toBeNull();
    expect(lengthM).toBeGreaterThanOrEqual(Math.max(6, 0.15 * 52.5));
    expect(lengthM).toBeLessThanOrEqual(Math.min(14, 52.5));
  });

  it('fall 20 m on a 2″ pipe: the bands cannot meet, so the length keeps L/D ≤ 1000 and the conflict is stated with a stand pipe as the remedy', () => {
    const { lengthM, conflict } = chooseDriveLength(60, 140, 52.5);
    expect(conflict).toBe('fall-band-above-ld');
    expect(lengthM / 0.0525).toBeLessThanOrEqual(1000);
    const s = screenSite(site({ fallM: 20, liftM: 60, lowestLpm: 120, demand: [{ kind: 'beef-cow-dry', count: 60 }] }));
    expect(codes(s)).not.toContain('DRIVE_LD_OUT_OF_BAND');
    expect(s.reasons.find((r) => r.code === 'DRIVE_BANDS_CONFLICT')?.text).toMatch(/stand pipe/);
  });

  it('delivery friction over 10 % of the lift is reported whatever was entered', () => {
    const s = screenSite(
      site({
        fallM: 3,
        liftM: 24,
        lowestLpm: 100,
        deliveryPipe: { lengthM: 2000, diameterMm: 12, material: 'hdpe' },
        demand: [{ kind: 'beef-cow-dry', count: 2 }],
      }),
    );
    expect(codes(s)).toContain('DELIVERY_FRICTION_HIGH');
  });

  it('a delivery pipe rated under 1.25 × the lift is a condition, not a note (common practice, no source)', () => {
    const j = judge(
      facts({ totalLiftM: 100, delivery: { frictionM: 1, frictionOverLimit: false, ratingM: 100, classLabel: 'PE SDR 17', diameterGiven: false } }),
    );
    expect(j.reasons.find((r) => r.code === 'DELIVERY_PIPE_RATING_LOW')?.severity).toBe('conditional');
  });
});

describe('gravity is its own outcome, judged on static levels', () => {
  it('tank water level 2.9 m above a ram site 3.01 m under the intake, on 800 m of ½″ pipe: no pump is needed, and the pipe is sized up', () => {
    const s = screenSite(site({ fallM: 3.01, liftM: 2.9, lowestLpm: 60, deliveryPipe: { lengthM: 800, diameterMm: 15, material: 'hdpe' } }));
    expect(s.verdict).toBe('gravity');
    expect(codes(s)).toContain('GRAVITY_PIPE_TOO_SMALL');
    expect(value(s, 'gravityPipeBoreMm')).toBeGreaterThan(15);
    expect(value(s, 'gravityCapacityLpd')).toBeGreaterThanOrEqual(1.2 * value(s, 'demandLpd'));
    expect(s.figures.ramCount).toBeUndefined();
  });

  it('a tank 1 m below the intake: "no pump needed", a supply pipe and tank on the bill, no ram, no surge caution', () => {
    const s = screenSite(site({ fallM: 3, liftM: 2, lowestLpm: 60 }));
    expect(s.verdict).toBe('gravity');
    expect(s.billOfMaterials.map((b) => b.item).join(' ')).toMatch(/Supply pipe/);
    expect(s.billOfMaterials.map((b) => b.item).join(' ')).not.toMatch(/ram/i);
    expect(s.cautions.map((c) => c.code)).not.toContain('SURGE_PRESSURE');
  });

  it('the pipe\u2019s capacity follows Hazen–Williams with the head: 0.5 L/s through 300 m of 25 mm, C 150, needs 14.6 m (EPANET 2, Table 3.1)', () => {
    // 14.6 m of head over 300 m of 25 mm bore carries 0.5 L/s = 43,200 L/day; check the gravity figure at that head.
    const s = screenSite({
      ...site({
        fallM: 14.6 + 1,
        liftM: 1,
        lowestLpm: 600,
        deliveryPipe: { lengthM: 300, diameterMm: 25, material: 'pvc' },
        drivePipe: { material: 'galvanized-steel', lengthM: 0.001 },
      }),
      settings: { fittingsAllowanceFraction: 0 },
      demand: [demandOf(100)],
    });
    expectRelative(value(s, 'gravityCapacityLpd'), 43200, 0.01);
  });
});

describe('honest uncertainty', () => {
  it('efficiency varies in the Monte Carlo: the p10–p90 band of a well-surveyed site is far wider than ±4 % (η 0.5–0.8 between makes)', () => {
    const s = screenSite(site({ fallM: 3, liftM: 24, lowestLpm: 100 }));
    expect((value(s, 'deliveryP90Lpd') - value(s, 'deliveryP10Lpd')) / value(s, 'deliveryP50Lpd')).toBeGreaterThan(0.2);
  });

  it('two level runs 0.5 m apart widen the fall\u2019s σ by their spread (Birge 1932), not 3 mm', () => {
    const fall = combineRuns([
      { method: 'level', rows: [{ backsightM: 0.5 }, { foresightM: 3.5 }] },
      { method: 'level', rows: [{ backsightM: 0.5 }, { foresightM: 3.0 }] },
    ]);
    // Two equal-weight runs at 3.0 and 2.5: χ² = 2·(0.25/0.003)², Birge ratio 117.9, σ = 0.003/√2 × 117.9 = 0.25 m.
    expectWithin(fall.sigmaM, 0.25, 0.001);
  });

  it('float gaugings carry ±10 % (Herschy, from memory), not 6 %', () => {
    const f = estimateFlow({ method: 'float', season: 'dry', areaM2: 0.2, coefficient: 0.85, trials: [{ distanceM: 10, seconds: 20 }] }, 0);
    expect(FLOAT_RELATIVE_SIGMA).toBe(0.1);
    expectWithin(f.relativeSigma, 0.1, 1e-9);
  });

  it('a plain go needs the chance of meeting demand to reach the organisation\u2019s threshold (default 0.8)', () => {
    const j = judge(facts({ probabilityMeets: 0.7 }));
    expect(j.verdict).toBe('conditional');
    expect(j.reasons.map((r) => r.code)).toContain('DEMAND_UNCERTAIN');
    expect(judge(facts({ probabilityMeets: 0.7, minProbabilityForGo: 0.6 })).verdict).toBe('go');
  });
});

describe('edges', () => {
  it('the fall is compared to the millimetre the text shows: 0.4994 m is a no-go saying 0.499 m; 0.49999 m is not too small', () => {
    const low = screenSite(site({ fallM: 0.4994, liftM: 6, lowestLpm: 300 }));
    expect(low.reasons.find((r) => r.code === 'FALL_TOO_SMALL')?.text).toMatch(/0\.499 m.*0\.500 m/);
    expect(codes(screenSite(site({ fallM: 0.49999, liftM: 6, lowestLpm: 300 })))).not.toContain('FALL_TOO_SMALL');
  });

  it('lift ratio 1.07: the delivered share is held at the table\u2019s first row (0.72 at r 4 → q/Q 0.18), not two-thirds of the drive water', () => {
    const s = screenSite(site({ fallM: 5, liftM: 5.35, lowestLpm: 100 }));
    expect(value(s, 'deliveryLpm') / value(s, 'driveFlowLpm')).toBeLessThanOrEqual(0.18 + 1e-6);
    expect(codes(s)).toContain('LIFT_RATIO_LOW');
  });

  it('a constant-efficiency curve warns above the ratio its source states (12: efficiency falls "particularly" beyond 1:12)', () => {
    const s = screenSite(site({ fallM: 2, liftM: 50, lowestLpm: 300, settings: { efficiencyCurve: 'wftw-commercial' } }));
    expect(codes(s)).toContain('LIFT_RATIO_BEYOND_STATED');
  });

  it('zero demand is not a go: it asks for the need to be recorded', () => {
    const s = screenSite(site({ fallM: 3, liftM: 30, lowestLpm: 100, demand: [{ kind: 'beef-cow-dry', count: 0 }] }));
    expect(s.verdict).toBe('conditional');
    expect(codes(s)).toContain('DEMAND_MISSING');
  });

  it('a conditional on more water names what is taken and what is left, and its figures meet the demand', () => {
    // 200 L/min at ratio 3: half the flow delivers ~26,000 L/day, short of 25,000 L + 20 %; 80 % of it is enough.
    const s = screenSite(site({ fallM: 3, liftM: 9, lowestLpm: 200, demand: [demandOf(25000)] }));
    expect(s.verdict).toBe('conditional');
    expect(s.conditions.find((c) => c.code === 'DEMAND_NEEDS_MORE_WATER')?.text).toMatch(/leaving .* L\/min in the stream/);
    expect(value(s, 'deliveryLpd')).toBeGreaterThanOrEqual(value(s, 'demandLpd'));
  });
});

const driveFacts: NonNullable<RamVerdictFacts['drive']> = {
  lengthM: 20,
  lengthGiven: false,
  bandMinM: 9,
  bandMaxM: 21,
  bandRule: '3–7 × fall',
  lengthConflict: null,
  ldMinM: 5,
  ldMaxM: 35,
  lengthToDiameter: 570,
  closureVelocityMps: 0.8,
  minimumClosureVelocityMps: 0.2,
  limitedByFall: false,
  attainableVelocityMps: 1.9,
  driveLpm: 22.7,
  workingPeakHeadM: 36,
  blockedDeliveryHeadM: 116,
  allowedHeadM: 211,
  ratingM: 211,
  cyclicDerated: false,
  classLabel: 'Schedule 40, class 150 fittings (300 psi)',
  higherClassLabel: null,
  materialLabel: 'Galvanized steel',
  rigid: true,
  sizeLabel: '1¼″ (32 mm)',
  fittingsMade: true,
  smallerThanRam: false,
};

// A plain-go site's facts, for checking single verdict rules.
function facts(patch: Partial<RamVerdictFacts>): RamVerdictFacts {
  return {
    fallM: 3,
    fallSigmaM: 0.005,
    fallRunsDisagree: [],
    misclosures: [],
    bookingFailed: [],
    anyDrySeason: true,
    lowHeadMeasurements: [],
    lowestLpm: 100,
    availableLpm: 50,
    designFraction: 0.5,
    plan: { status: 'meets', count: 1, sizeLabel: '1¼″ (32 mm)', forced: false },
    smallestRamMinLpm: 9.5,
    leastRamFallM: 0.61,
    staticLiftM: 24,
    totalLiftM: 25,
    liftRatio: 8.3,
    efficiencyStatus: 'in-range',
    curveLabel: 'table',
    curveRange: [4, 26],
    curveStatedUpTo: 26,
    deliveryLpd: 2000,
    demandLpd: 1000,
    marginFraction: 0.2,
    probabilityMeets: 0.99,
    minProbabilityForGo: 0.8,
    fix: null,
    drive: driveFacts,
    delivery: { frictionM: 1, frictionOverLimit: false, ratingM: 88, classLabel: 'PE SDR 17', diameterGiven: false },
    ...patch,
  };
}

describe('the ram\u2019s own parts on the bill', () => {
  it('sizes the air vessel from the Clemson home-made sizes: 5.0 L for a 1¼″ ram, 11.1 L for a 3″, between them in line', async () => {
    const { airVesselL } = await import('@/lib/engine/ram-parts');
    expectWithin(airVesselL(1.25, 0.5), 5.0, 1e-9);
    expectWithin(airVesselL(3, 0.5), 11.1, 1e-9);
    expectWithin(airVesselL(2, 0.5), 5.0 + ((2 - 1.25) / 1.75) * 6.1, 1e-9);
    // Never under 20 beats' delivery at 60 beats a minute: 60 L/min delivered → 20 L.
    expectWithin(airVesselL(1.25, 60), 20, 1e-9);
  });

  it('states the anchoring force as ρ·g·H·A: 100 m of head on a 52.5 mm bore is 2.12 kN', async () => {
    const { surgeThrustN } = await import('@/lib/engine/ram-parts');
    expectWithin(surgeThrustN(100, 52.5), (1000 * G * 100 * Math.PI * 0.0525 ** 2) / 4, 1e-9);
    expectRelative(surgeThrustN(100, 52.5), 2123, 0.001);
  });

  it('lists waste valve, delivery valve, air vessel, snifter, unions and base for every ram', () => {
    const s = screenSite(site({ fallM: 3, liftM: 24, lowestLpm: 100 }));
    const items = s.billOfMaterials.map((b) => b.item).join(' | ');
    for (const part of ['Waste valve', 'Delivery (check) valve', 'Air vessel', 'Snifter', 'Unions', 'Concrete base']) expect(items).toContain(part);
    expect(s.billOfMaterials.find((b) => b.item === 'Air vessel')?.quantity).toBe(value(s, 'ramCount'));
  });
});
