// One (intake, pump site) pair of a surveyed creek profile: the pruning rules, the readings it would
// be screened with, and a fast estimate that runs the same sums as screenSite with fewer draws.
import { flowMeasurementSchema, settingsSchema, type ScreenSettings, type SiteReadingsInput } from '@/lib/shared/schemas/site-readings';
import { levelRowsDropping } from './fall';
import { DRIVE_LD_BAND, driveLengthBandM } from './drive-pipe';
import { demandBreakdown } from './demand';
import { runMonteCarlo } from './monte-carlo';
import type { OperatingContext } from './operating-point';
import { planWithFeed, type RamPlan } from './ram-plan';
import { EFFICIENCY_CURVES } from './ram';
import { combineRuns, estimateFlow, estimateLift } from './readings';
import { MAX_LIFT_RATIO, MIN_FALL_M } from './verdict';

export const STATION_FLAGS = ['no-intake', 'no-pump-site'] as const;
export type StationFlag = (typeof STATION_FLAGS)[number];

/** A surveyed station along the bank: chainage from the top of the reach, reduced level, optional own flow. */
export interface ProfileStation {
  id: string;
  label?: string;
  chainageM: number;
  levelM: number;
  /** Flow measured at this station, L/min; without it the reach's flow measurements apply. */
  flowLpm?: number | null;
  flags?: readonly string[];
}

/** Where the tank stands: chainage of the nearest bank point, distance off the creek, water level. */
export interface ProfileTank {
  chainageM: number;
  offsetM: number;
  levelM: number;
}

export interface BestPositionsInput {
  stations: readonly ProfileStation[];
  tank: ProfileTank;
  flowMeasurements?: SiteReadingsInput['flowMeasurements'];
  demand: SiteReadingsInput['demand'];
  drivePipeMaterial?: string;
  deliveryPipe?: { material?: string; diameterMm?: number };
  settings?: SiteReadingsInput['settings'];
  /** 1σ of the lift from the profile, m (default: the engine's figure for a levelled lift). */
  liftUncertaintyM?: number;
  /** How many pairs to return (default 3). */
  top?: number;
  /** Draws for the full screenings of the short list (default 10,000) and for ranking everything (default 200). */
  samples?: number;
  rankingSamples?: number;
  seed?: number;
}

export type RejectCode = 'flag-intake' | 'flag-pump' | 'little-fall' | 'drive-short' | 'drive-long' | 'gravity' | 'lift-ratio' | 'little-flow' | 'drive-ld';

export const REJECT_TEXT: Record<RejectCode, string> = {
  'flag-intake': 'The intake station is marked as no place for an intake.',
  'flag-pump': 'The pump station is marked as no place for a ram (e.g. it floods).',
  'little-fall': `Less than ${MIN_FALL_M} m of fall between intake and ram (Water for the World RWS.4.D.5).`,
  'drive-short': 'The drive pipe between them would be shorter than the drive length band for that fall.',
  'drive-long': 'The drive pipe between them would be longer than the drive length band for that fall.',
  gravity: 'The tank is not above the intake: water reaches it by gravity, no ram needed.',
  'lift-ratio': `Lift is more than ${MAX_LIFT_RATIO} × the fall (Ogden 1911).`,
  'little-flow': 'The flow at the intake is below what the smallest ram in the size table needs (Ogden 1911).',
  'drive-ld': `Drive length / bore outside ${DRIVE_LD_BAND.min}–${DRIVE_LD_BAND.max} (NITK notes).`,
};

/** Geometry of a pair: fall, lift, drive and delivery pipe lengths (slope distances), and a stand pipe when there is one. */
export interface PairGeometry {
  fallM: number;
  staticLiftM: number;
  driveLengthM: number;
  deliveryLengthM: number;
  /** Intake to the stand pipe, m (0 when the drive pipe starts at the intake). */
  feedLengthM: number;
  /** The station where an open stand pipe stands and the drive pipe starts, on a gentle creek. */
  standPipe: ProfileStation | null;
}

/** Prepared once per search: parsed settings and flows, so each pair costs only its own sums. */
export interface SearchContext {
  input: BestPositionsInput;
  settings: ScreenSettings;
  ctxCurve: OperatingContext['curve'];
  demandLpd: number;
  flowAt: (station: ProfileStation) => { lowestLpm: number; relativeSigma: number; measurements: SiteReadingsInput['flowMeasurements'] } | null;
  fallSigmaFor: (fallM: number) => number;
  liftSigmaFor: (liftM: number) => number;
}

/** Flow measurements that a station's own flow stands for: one bucket-style trial of a minute. */
function stationMeasurements(flowLpm: number): SiteReadingsInput['flowMeasurements'] {
  return [{ method: 'volumetric', season: 'unknown', trials: [{ volumeL: flowLpm, seconds: 60 }] }];
}

/** Parses what every pair shares. */
export function prepareSearch(input: BestPositionsInput): SearchContext {
  const settings = settingsSchema.parse(input.settings ?? {});
  const reach = (input.flowMeasurements ?? []).map((m) => flowMeasurementSchema.parse(m));
  const lowestOf = (ms: ReturnType<typeof flowMeasurementSchema.parse>[]) => {
    const lowest = ms.map(estimateFlow).reduce((a, b) => (b.meanLps < a.meanLps ? b : a));
    return { lowestLpm: lowest.meanLps * 60, relativeSigma: lowest.relativeSigma };
  };
  const reachFlow = reach.length > 0 ? { ...lowestOf(reach), measurements: input.flowMeasurements ?? [] } : null;
  const cache = new Map<number, ReturnType<SearchContext['flowAt']>>();
  const flowAt: SearchContext['flowAt'] = (station) => {
    if (station.flowLpm == null || !(station.flowLpm > 0)) return reachFlow;
    const hit = cache.get(station.flowLpm);
    if (hit !== undefined) return hit;
    const measurements = stationMeasurements(station.flowLpm);
    const flow = { ...lowestOf(measurements.map((m) => flowMeasurementSchema.parse(m))), measurements };
    cache.set(station.flowLpm, flow);
    return flow;
  };
  const demandLpd = demandBreakdown(
    input.demand.map((d) => ({ ...d })),
    settings.demandOverrides,
  ).reduce((s, l) => s + l.dailyL, 0);
  // As many levelled set-ups between intake and ram as the synthesized readings below carry.
  const fallSigmaFor = (fallM: number) => combineRuns([{ method: 'level', rows: levelRowsDropping(fallM) }]).sigmaM;
  const liftSigmaFor = (liftM: number) => estimateLift({ kind: 'direct', staticLiftM: liftM, method: 'level', uncertaintyM: input.liftUncertaintyM }).sigmaM;
  return { input, settings, ctxCurve: EFFICIENCY_CURVES[settings.efficiencyCurve], demandLpd, flowAt, fallSigmaFor, liftSigmaFor };
}

// Math.hypot is several times slower than the plain sum of squares, and these run for every pair of a reach.
const slope = (run: number, rise: number): number => Math.sqrt(run * run + rise * rise);

/** Fall, lift and pipe lengths of a pair with the drive pipe from the intake; the intake must lie upstream (smaller chainage). */
export function pairGeometry(intake: ProfileStation, pump: ProfileStation, tank: ProfileTank): PairGeometry {
  const fallM = intake.levelM - pump.levelM;
  const staticLiftM = tank.levelM - pump.levelM;
  const driveLengthM = slope(pump.chainageM - intake.chainageM, fallM);
  const along = tank.chainageM - pump.chainageM;
  const deliveryLengthM = Math.sqrt(along * along + tank.offsetM * tank.offsetM + staticLiftM * staticLiftM);
  return { fallM, staticLiftM, driveLengthM, deliveryLengthM, feedLengthM: 0, standPipe: null };
}

/** Highest a stand pipe may stand above its ground, m: taller needs staying against wind (common practice, no source). */
export const MAX_STAND_PIPE_M = 4;

/**
 * The pair's geometry as it would be built: the drive pipe from the intake when its length is inside the fall
 * band; on a gentler creek, a feed pipe from the intake to an open stand pipe at the station whose drive pipe
 * to the ram comes nearest the middle of the band (the stand pipe's ground below the intake's water, and
 * the pipe no taller than MAX_STAND_PIPE_M); the plain geometry when no station serves.
 */
export function arrangementGeometry(s: SearchContext, stations: readonly ProfileStation[], i: number, j: number): PairGeometry {
  const intake = stations[i] as ProfileStation;
  const pump = stations[j] as ProfileStation;
  const plain = pairGeometry(intake, pump, s.input.tank);
  if (!(plain.fallM > 0)) return plain;
  const band = driveLengthBandM(plain.fallM, s.settings.driveLengthRule);
  if (plain.driveLengthM <= band.maxM) return plain;
  const mid = (band.minM + band.maxM) / 2;
  let best: PairGeometry | null = null;
  let bestGap = Infinity;
  // Walking up from the ram, the drive pipe only grows: stop once it is longer than the band.
  for (let k = j - 1; k > i; k--) {
    const st = stations[k] as ProfileStation;
    const drive = slope(pump.chainageM - st.chainageM, st.levelM - pump.levelM);
    if (pump.chainageM - st.chainageM > band.maxM) break;
    if (drive < band.minM || drive > band.maxM || st.flags?.includes('no-pump-site')) continue;
    const height = intake.levelM - st.levelM;
    if (height <= 0 || height > MAX_STAND_PIPE_M) continue;
    const gap = Math.abs(drive - mid);
    if (gap < bestGap) {
      bestGap = gap;
      best = { ...plain, driveLengthM: drive, feedLengthM: slope(st.chainageM - intake.chainageM, height), standPipe: st };
    }
  }
  return best ?? plain;
}

/** The rams screenSite would size for a pair (the same sizing from demand, feed pipe friction off the fall, without the fixes a conditional names). */
export function pairPlan(s: SearchContext, intake: ProfileStation, g: PairGeometry): { plan: RamPlan; fallM: number } {
  const flow = s.flowAt(intake);
  const { plan, fallM } = planWithFeed(
    {
      fallM: g.fallM,
      staticLiftM: g.staticLiftM,
      availableLpm: s.settings.designFractionOfLowest * (flow?.lowestLpm ?? 0),
      needLpd: s.demandLpd * (1 + s.settings.demandMarginFraction),
      curve: s.ctxCurve,
      driveLengthRule: s.settings.driveLengthRule,
      fittingsAllowance: s.settings.fittingsAllowanceFraction,
      drivePipe: { lengthM: g.driveLengthM, material: s.input.drivePipeMaterial ?? 'galvanized-steel' },
      deliveryPipe: { lengthM: g.deliveryLengthM, material: s.input.deliveryPipe?.material ?? 'hdpe', diameterMm: s.input.deliveryPipe?.diameterMm },
    },
    g.standPipe ? { lengthM: g.feedLengthM, material: 'hdpe' } : undefined,
  );
  return { plan, fallM };
}

/** The cheap rules, cheapest first; the reject code, or null with the pair's ram plan when it passes them all. */
export function checkPair(
  s: SearchContext,
  intake: ProfileStation,
  pump: ProfileStation,
  g: PairGeometry = pairGeometry(intake, pump, s.input.tank),
): { code: RejectCode; plan?: undefined } | { code: null; plan: RamPlan & { status: 'meets' | 'short' }; drivingFallM: number } {
  if (intake.flags?.includes('no-intake')) return { code: 'flag-intake' };
  if (pump.flags?.includes('no-pump-site')) return { code: 'flag-pump' };
  if (g.fallM < MIN_FALL_M) return { code: 'little-fall' };
  const band = driveLengthBandM(g.fallM, s.settings.driveLengthRule);
  if (g.driveLengthM < band.minM) return { code: 'drive-short' };
  if (g.driveLengthM > band.maxM) return { code: 'drive-long' };
  if (g.staticLiftM <= g.fallM) return { code: 'gravity' };
  if (g.staticLiftM / g.fallM > MAX_LIFT_RATIO) return { code: 'lift-ratio' };
  const { plan, fallM } = pairPlan(s, intake, g);
  if (plan.status === 'no-ram') return { code: plan.cause === 'fall' ? 'little-fall' : 'little-flow' };
  const ld = plan.option.drive.lengthToDiameter;
  if (ld < DRIVE_LD_BAND.min || ld > DRIVE_LD_BAND.max) return { code: 'drive-ld' };
  return { code: null, plan, drivingFallM: fallM };
}

/** The raw readings screenSite gets for a pair: the profile's fall as levelled set-ups, the lift as levelled. */
export function pairReadings(s: SearchContext, intake: ProfileStation, g: PairGeometry, samples: number): SiteReadingsInput {
  const flow = s.flowAt(intake);
  return {
    flowMeasurements: flow?.measurements ?? [],
    fallRuns: [{ method: 'level', rows: levelRowsDropping(g.fallM) }],
    lift: { kind: 'direct', staticLiftM: g.staticLiftM, method: 'level', ...(s.input.liftUncertaintyM ? { uncertaintyM: s.input.liftUncertaintyM } : {}) },
    drivePipe: { lengthM: g.driveLengthM, material: (s.input.drivePipeMaterial ?? 'galvanized-steel') as 'galvanized-steel' },
    ...(g.standPipe ? { feedPipe: { lengthM: g.feedLengthM, material: 'hdpe' as const } } : {}),
    deliveryPipe: {
      lengthM: g.deliveryLengthM,
      material: (s.input.deliveryPipe?.material ?? 'hdpe') as 'hdpe',
      ...(s.input.deliveryPipe?.diameterMm ? { diameterMm: s.input.deliveryPipe.diameterMm } : {}),
    },
    demand: s.input.demand,
    settings: s.input.settings ?? {},
    monteCarlo: { samples, seed: s.input.seed ?? 1 },
  };
}

/** What ranks a pair: verdict (or, before the full screen, whether the rams meet the need), chance, delivery, total pipe. */
export interface RankKey {
  /** 2 go, 1 conditional, 0 no-go; in the quick stage 2 when the plan meets the need, 1 when it falls short. */
  verdictRank: number;
  probabilityMeetsDemand: number;
  deliveryLpd: number;
  totalPipeM: number;
}

/** Rank of a verdict for ordering pairs: a go before a conditional before a no-go. */
export function verdictRank(verdict: string): number {
  return verdict === 'go' ? 2 : verdict === 'conditional' ? 1 : 0;
}

/**
 * Orders best first: the better verdict (a go needs the organisation's chance of meeting the demand), then
 * the larger margin over demand (more delivery), then less pipe.
 */
export function compareKeys(a: RankKey, b: RankKey): number {
  return b.verdictRank - a.verdictRank || b.deliveryLpd - a.deliveryLpd || a.totalPipeM - b.totalPipeM;
}

/**
 * The same sizing, delivery and Monte Carlo as screenSite, with fewer draws: the draws are a prefix of the full
 * run's, so a pair certain in full is certain here.
 */
export function quickKey(
  s: SearchContext,
  intake: ProfileStation,
  g: PairGeometry,
  samples: number,
  plan: RamPlan & { status: 'meets' | 'short' },
  drivingFallM: number,
): RankKey {
  const flow = s.flowAt(intake);
  const o = plan.option;
  const mc = runMonteCarlo({
    ctx: { curve: s.ctxCurve, deliveryFrictionK: o.delivery.frictionK },
    fallM: drivingFallM,
    fallSigmaM: s.fallSigmaFor(drivingFallM),
    staticLiftM: g.staticLiftM,
    staticLiftSigmaM: s.liftSigmaFor(g.staticLiftM),
    lowestFlowLpm: flow?.lowestLpm ?? 0,
    lowestFlowRelativeSigma: flow?.relativeSigma ?? 0,
    designFraction: s.settings.designFractionOfLowest,
    ramMaxLpm: o.drive.driveLpm,
    ramMinLpm: o.row.minLpm,
    ramCount: o.count,
    demandLpd: s.demandLpd,
    samples,
    seed: s.input.seed ?? 1,
  });
  return {
    verdictRank: plan.status === 'meets' ? 2 : 1,
    probabilityMeetsDemand: mc.probabilityMeetsDemand,
    deliveryLpd: o.deliveryLpd,
    totalPipeM: g.feedLengthM + g.driveLengthM + g.deliveryLengthM,
  };
}
