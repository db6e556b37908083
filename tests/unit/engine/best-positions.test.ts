import { describe, expect, it } from 'vitest';
import { bestPositions, bestPositionsBruteForce, mulberry32, type BestPositionsInput, type ProfileStation } from '@/lib/engine';
import { compareKeys } from '@/lib/engine/profile-search';

const flow: BestPositionsInput['flowMeasurements'] = [
  {
    method: 'volumetric',
    season: 'dry',
    trials: [
      { volumeL: 20, seconds: 12 },
      { volumeL: 20, seconds: 12.4 },
    ],
  },
];
const household: BestPositionsInput['demand'] = [{ kind: 'person-tap-on-plot', count: 2 }];

// Invented reach, checkable by hand with the 3–7 × fall drive band (Perkin):
// A→B: fall 4 m over 20 m (band 12–28 m) – fits; A→C: fall 4.1 m over 24 m – fits and has the most fall;
// A→E: 4.5 m over 26 m would beat both, but E floods; everything to D is far longer than 7 × its fall;
// B→C and C→E have under 0.5 m of fall.
const handReach: ProfileStation[] = [
  { id: 'A', chainageM: 0, levelM: 100 },
  { id: 'B', chainageM: 20, levelM: 96 },
  { id: 'C', chainageM: 24, levelM: 95.9 },
  { id: 'E', chainageM: 26, levelM: 95.5, flags: ['no-pump-site'] },
  { id: 'D', chainageM: 200, levelM: 90 },
];
const handInput: BestPositionsInput = {
  stations: handReach,
  tank: { chainageM: 30, offsetM: 60, levelM: 130 },
  flowMeasurements: flow,
  demand: household,
  samples: 2000,
};

describe('bestPositions on a hand-checkable reach', () => {
  const result = bestPositions(handInput);
  it('ranks A→C first: the most fall among the pairs the rules allow', () => {
    expect(result.ranked.map((p) => `${p.intake.id}→${p.pump.id}`)).toEqual(['A→C', 'A→B']);
    expect(result.ranked[0]?.fallM).toBeCloseTo(4.1, 9);
    expect(result.ranked[0]?.deliveryLpd).toBeGreaterThan(result.ranked[1]?.deliveryLpd ?? Infinity);
  });
  it('says why the other eight pairs were set aside', () => {
    expect(result.pairsConsidered).toBe(10);
    const byCode = Object.fromEntries(result.rejected.map((r) => [r.code, r.count]));
    expect(byCode['flag-pump']).toBe(3); // A→E, B→E, C→E
    expect(byCode['little-fall']).toBe(1); // B→C
    expect(byCode['drive-long']).toBe(4); // A→D, B→D, C→D, E→D
    expect(result.rejected.every((r) => r.text.length > 10)).toBe(true);
  });
  it('returns each pair with a full screening at the stated sample count', () => {
    const top = result.ranked[0];
    expect(top?.screening.monteCarlo.samples).toBe(2000);
    expect(top?.screening.figures.fallM?.value).toBeCloseTo(4.1, 6);
    expect(top?.screening.figures.staticLiftM?.value).toBeCloseTo(130 - 95.9, 6);
  });
  it('moving the flood flag to C makes A→B the best', () => {
    const moved = handReach.map((s) => ({ ...s, flags: s.id === 'C' ? ['no-pump-site'] : [] }));
    const r = bestPositions({ ...handInput, stations: moved });
    expect(r.ranked[0]?.pump.id).toBe('E');
    const withE = handReach.map((s) => ({ ...s, flags: s.id === 'C' || s.id === 'E' ? ['no-pump-site'] : [] }));
    expect(bestPositions({ ...handInput, stations: withE }).ranked[0]?.pump.id).toBe('B');
  });
  it('refuses a station without a level, naming it', () => {
    expect(() => bestPositions({ ...handInput, stations: [{ id: 'x', chainageM: 0, levelM: Number.NaN }] })).toThrow(/stations\.0\.levelM/);
  });
});

/** A random small reach of n stations: steps and pools, levels falling downstream on the whole. */
function randomReach(seed: number, n: number): BestPositionsInput {
  const u = mulberry32(seed);
  let c = 0;
  let level = 100;
  const stations: ProfileStation[] = [];
  for (let i = 0; i < n; i++) {
    stations.push({ id: `s${seed}-${i}`, chainageM: c, levelM: level, flags: u() < 0.15 ? ['no-pump-site'] : [], flowLpm: u() < 0.3 ? 40 + 120 * u() : null });
    c += 2 + 12 * u();
    level -= u() < 0.4 ? 0.5 + 3 * u() : 0.1 * u();
  }
  return {
    stations,
    tank: { chainageM: c * u(), offsetM: 20 + 100 * u(), levelM: 100 + 5 + 25 * u() },
    flowMeasurements: flow,
    demand: [{ kind: 'beef-cow-nursing', count: 2 + Math.floor(30 * u()) }],
    samples: 1000,
    seed: 7,
  };
}

describe('bestPositions against brute force (random small reaches)', () => {
  it('the pruned, short-listed search finds the pair brute force ranks first', () => {
    let compared = 0;
    for (let seed = 1; seed <= 25; seed++) {
      const input = randomReach(seed, 9);
      const brute = bestPositionsBruteForce(input);
      const fast = bestPositions(input);
      expect(fast.pairsFeasible).toBe(brute.length);
      if (brute.length === 0) continue;
      compared++;
      expect(fast.ranked[0] && compareKeys(fast.ranked[0], brute[0]!.key)).toBe(0);
    }
    expect(compared).toBeGreaterThan(5);
  });
  it('adding a station never worsens the best pair', () => {
    for (let seed = 30; seed <= 45; seed++) {
      const input = randomReach(seed, 8);
      const before = bestPositions(input).ranked[0];
      const u = mulberry32(seed * 31);
      const last = input.stations[input.stations.length - 1]!;
      const extra: ProfileStation = { id: `extra-${seed}`, chainageM: last.chainageM * u(), levelM: 100 - 6 * u() };
      const after = bestPositions({ ...input, stations: [...input.stations, extra] }).ranked[0];
      if (!before) continue;
      expect(after, `seed ${seed}`).toBeDefined();
      expect(compareKeys(after!, before), `seed ${seed}`).toBeLessThanOrEqual(0);
    }
  });
});

describe('gentle creeks: a feed pipe to an open stand pipe, then the drive pipe to the ram', () => {
  // 41 stations 5 m apart falling 1 m in 20 m (5 %), the tank 15 m above the foot of the reach: with the
  // drive pipe starting at the intake every pair is longer than 7 × its fall (Perkin), so none fits.
  const gentle = (slope: number): BestPositionsInput => ({
    stations: Array.from({ length: 41 }, (_, n) => ({ id: `S${n}`, chainageM: 5 * n, levelM: 100 - slope * 5 * n })),
    tank: { chainageM: 200, offsetM: 40, levelM: 100 - slope * 200 + 15 },
    flowMeasurements: flow,
    demand: household,
    samples: 1000,
  });

  for (const slope of [0.02, 0.05, 0.1]) {
    it(`a ${slope * 100} % creek finds go arrangements, each with its stand pipe inside the reach and the drive pipe inside the fall band`, () => {
      const result = bestPositions(gentle(slope));
      expect(result.pairsFeasible).toBeGreaterThan(0);
      const best = result.ranked[0];
      expect(best?.screening.verdict).toBe('go');
      expect(best?.standPipe).not.toBeNull();
      const fall = best?.fallM ?? NaN;
      expect(best?.driveLengthM).toBeGreaterThanOrEqual(3 * fall - 1e-9);
      expect(best?.driveLengthM).toBeLessThanOrEqual(7 * fall + 1e-9);
      // The feed pipe's friction comes off the fall the ram works on.
      expect(best?.screening.figures.drivingFallM?.value).toBeLessThan(fall);
      expect(best?.screening.billOfMaterials.map((b) => b.item).join(' ')).toMatch(/Feed pipe.*stand pipe/);
    });
  }

  it('ranks a go above any conditional (verdict first), whatever their chance or delivery', () => {
    const ranked = bestPositions(gentle(0.05)).ranked;
    const ranks = ranked.map((p) => p.verdictRank);
    expect([...ranks].sort((a, b) => b - a)).toEqual(ranks);
  });
});
