// bestPositions: every (intake, pump site) pair of a surveyed reach under the drive-pipe rules, ranked by
// probability of meeting demand, then delivery, then total pipe; the short list screened in full by screenSite.
import { EngineInputError } from './errors';
import {
  arrangementGeometry,
  checkPair,
  compareKeys,
  pairReadings,
  prepareSearch,
  quickKey,
  REJECT_TEXT,
  verdictRank,
  type BestPositionsInput,
  type PairGeometry,
  type ProfileStation,
  type RankKey,
  type RejectCode,
} from './profile-pairs';
import { screenSite } from './screen';
import type { Screening } from './screening-types';
import { finite, nonNegative, positiveInteger } from './validate';

export type { BestPositionsInput, ProfileStation, ProfileTank, RejectCode, StationFlag } from './profile-pairs';
export { STATION_FLAGS, REJECT_TEXT, compareKeys } from './profile-pairs';

/** A ranked pair with its full screening. */
export interface PositionPair extends PairGeometry, RankKey {
  rank: number;
  intake: ProfileStation;
  pump: ProfileStation;
  screening: Screening;
}

export interface BestPositionsResult {
  ranked: PositionPair[];
  /** Pairs with the intake upstream of the pump site. */
  pairsConsidered: number;
  /** Pairs that passed every rule and were ranked. */
  pairsFeasible: number;
  /** Pairs screened in full (the short list). */
  screenedInFull: number;
  /** Why the other pairs were set aside, most common first. */
  rejected: { code: RejectCode; text: string; count: number }[];
  demandLpd: number;
}

/** Pairs screened in full at least; plus any within this probability of the best quick estimate. */
const SHORT_LIST_MIN = 8;
const SHORT_LIST_MAX = 24;
const SHORT_LIST_MARGIN = 0.1;

function checkInput(input: BestPositionsInput): ProfileStation[] {
  if (!Array.isArray(input.stations)) throw new EngineInputError('stations', 'must be a list');
  input.stations.forEach((st, i) => {
    nonNegative(st.chainageM, `stations.${i}.chainageM`);
    finite(st.levelM, `stations.${i}.levelM`);
  });
  finite(input.tank?.levelM, 'tank.levelM');
  finite(input.tank?.chainageM, 'tank.chainageM');
  nonNegative(input.tank?.offsetM, 'tank.offsetM');
  if (input.top !== undefined) positiveInteger(input.top, 'top');
  // Upstream first; equal chainages keep their order.
  return [...input.stations].sort((a, b) => a.chainageM - b.chainageM);
}

/** Ranks every feasible (intake, pump site) pair of a reach; returns the top ones screened in full and why others were set aside. */
export function bestPositions(input: BestPositionsInput): BestPositionsResult {
  const stations = checkInput(input);
  const s = prepareSearch(input);
  const samples = input.samples ?? 10_000;
  const quickSamples = Math.min(input.rankingSamples ?? 200, samples);
  const counts = new Map<RejectCode, number>();
  const quick: { i: number; j: number; key: RankKey }[] = [];
  let considered = 0;

  for (let i = 0; i < stations.length; i++) {
    const intake = stations[i] as ProfileStation;
    for (let j = i + 1; j < stations.length; j++) {
      const pump = stations[j] as ProfileStation;
      if (pump.chainageM <= intake.chainageM) continue;
      considered++;
      const g = arrangementGeometry(s, stations, i, j);
      const check = checkPair(s, intake, pump, g);
      if (check.code) counts.set(check.code, (counts.get(check.code) ?? 0) + 1);
      else quick.push({ i, j, key: quickKey(s, intake, g, quickSamples, check.plan, check.drivingFallM) });
    }
  }

  quick.sort((a, b) => compareKeys(a.key, b.key));
  const top = input.top ?? 3;
  const screen = ({ i, j }: { i: number; j: number }) => {
    const intake = stations[i] as ProfileStation;
    const pump = stations[j] as ProfileStation;
    const g = arrangementGeometry(s, stations, i, j);
    const screening = screenSite(pairReadings(s, intake, g, samples));
    const key: RankKey = {
      verdictRank: verdictRank(screening.verdict),
      probabilityMeetsDemand: screening.figures.probabilityMeetsDemand?.value ?? 0,
      deliveryLpd: screening.figures.deliveryLpd?.value ?? 0,
      totalPipeM: g.feedLengthM + g.driveLengthM + g.deliveryLengthM,
    };
    return { intake, pump, ...g, ...key, screening };
  };
  const full: ReturnType<typeof screen>[] = [];
  const done = new Set<number>();
  // The quick draws are a prefix of the full ones, so a pair certain in full is certain quickly too: when
  // pairs are certain, the first `top` that stay certain and a go in full, taken in delivery order, are the best.
  let certain = 0;
  for (let n = 0; n < quick.length && n < SHORT_LIST_MAX && certain < top; n++) {
    const q = quick[n] as (typeof quick)[number];
    if (q.key.probabilityMeetsDemand < 1) break;
    const f = screen(q);
    full.push(f);
    done.add(n);
    if (f.probabilityMeetsDemand === 1 && f.verdictRank === 2) certain++;
  }
  if (certain < top) {
    const bestQuick = quick[0]?.key.probabilityMeetsDemand ?? 0;
    quick.forEach((q, n) => {
      const listed = n < Math.max(SHORT_LIST_MIN, 3 * top) || (n < SHORT_LIST_MAX && q.key.probabilityMeetsDemand >= bestQuick - SHORT_LIST_MARGIN);
      if (listed && !done.has(n)) full.push(screen(q));
    });
  }
  full.sort((a, b) => compareKeys(a, b));

  return {
    ranked: full.slice(0, top).map((p, n) => ({ rank: n + 1, ...p })),
    pairsConsidered: considered,
    pairsFeasible: quick.length,
    screenedInFull: full.length,
    rejected: [...counts.entries()].sort((a, b) => b[1] - a[1]).map(([code, count]) => ({ code, text: REJECT_TEXT[code], count })),
    demandLpd: s.demandLpd,
  };
}

/** Brute force for tests and audits: every feasible pair screened in full, ranked the same way. */
export function bestPositionsBruteForce(input: BestPositionsInput): { intakeId: string; pumpId: string; key: RankKey }[] {
  const stations = checkInput(input);
  const s = prepareSearch(input);
  const out: { intakeId: string; pumpId: string; key: RankKey }[] = [];
  for (let i = 0; i < stations.length; i++) {
    for (let j = i + 1; j < stations.length; j++) {
      const intake = stations[i] as ProfileStation;
      const pump = stations[j] as ProfileStation;
      const g = arrangementGeometry(s, stations, i, j);
      if (pump.chainageM <= intake.chainageM || checkPair(s, intake, pump, g).code) continue;
      const sc = screenSite(pairReadings(s, intake, g, input.samples ?? 10_000));
      out.push({
        intakeId: intake.id,
        pumpId: pump.id,
        key: {
          verdictRank: verdictRank(sc.verdict),
          probabilityMeetsDemand: sc.figures.probabilityMeetsDemand?.value ?? 0,
          deliveryLpd: sc.figures.deliveryLpd?.value ?? 0,
          totalPipeM: g.feedLengthM + g.driveLengthM + g.deliveryLengthM,
        },
      });
    }
  }
  return out.sort((a, b) => compareKeys(a.key, b.key));
}
