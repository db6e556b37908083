// Reduces raw readings to estimates with standard uncertainties (1σ), by method.
import type { FallRun, FlowMeasurement, LiftReadings } from '@/lib/shared/schemas/site-readings';
import { allowedMisclosureMm, altitudeFallM, barometricFallM, clinometerFallM, hoseLevelFallM, levelRun } from './fall';
import { floatFlowLps, rectangularWeirFlowLps, summarise, vNotchFlowLps, V_NOTCH_MIN_HEAD_M } from './flow';

// Per-method standard uncertainties (from memory / common practice).
export const LEVEL_SIGMA_PER_SETUP_M = 0.003;
export const HOSE_SIGMA_PER_STEP_M = 0.005;
export const CLINOMETER_SIGMA_FRACTION = 0.003;
/** Consumer GPS: vertical ≈ 2 × horizontal (middle of 1.5–3×, GPS SPS 2008 notes); phone accuracies are 95 %. */
export const GPS_VERTICAL_PER_HORIZONTAL = 2;
export const BARO_SIGMA_HPA = { corrected: 0.2, uncorrected: 1.0 } as const;

export interface RunEstimate {
  index: number;
  method: FallRun['method'];
  dropM: number;
  sigmaM: number;
  arithmeticCheckOk: boolean | null;
  misclosureMm: number | null;
  allowedMisclosureMm: number | null;
}

function z95(accuracyM: number): number {
  return accuracyM / 1.96;
}

/** Drop from first to last station of one run, with its 1σ uncertainty. */
export function estimateRun(run: FallRun, index: number): RunEstimate {
  const base = { index, method: run.method, arithmeticCheckOk: null, misclosureMm: null, allowedMisclosureMm: null };
  switch (run.method) {
    case 'level': {
      const out = levelRun(run.rows);
      const sigmaOut = LEVEL_SIGMA_PER_SETUP_M * Math.sqrt(out.setups);
      if (!run.returnRows) return { ...base, dropM: out.fallM, sigmaM: sigmaOut, arithmeticCheckOk: out.arithmeticCheckOk };
      const back = levelRun(run.returnRows);
      const misclosureM = out.fallM + back.fallM;
      const allowed = run.routeLengthM ? allowedMisclosureMm((2 * run.routeLengthM) / 1000, 'third') : null;
      // Mean of the two directions; the misclosure widens the uncertainty when it is larger than the set-ups suggest.
      const sigmaMean = Math.max((LEVEL_SIGMA_PER_SETUP_M * Math.sqrt(out.setups + back.setups)) / 2, Math.abs(misclosureM) / 2);
      return {
        ...base,
        dropM: (out.fallM - back.fallM) / 2,
        sigmaM: sigmaMean,
        arithmeticCheckOk: out.arithmeticCheckOk && back.arithmeticCheckOk,
        misclosureMm: misclosureM * 1000,
        allowedMisclosureMm: allowed,
      };
    }
    case 'hose':
      return { ...base, dropM: hoseLevelFallM(run.steps), sigmaM: HOSE_SIGMA_PER_STEP_M * Math.sqrt(run.steps.length) };
    case 'clinometer': {
      const sigma = Math.sqrt(run.legs.reduce((s, l) => s + (CLINOMETER_SIGMA_FRACTION * l.slopeDistanceM) ** 2, 0));
      return { ...base, dropM: clinometerFallM(run.legs), sigmaM: sigma };
    }
    case 'gps': {
      const vertical = run.verticalAccuracyM ?? GPS_VERTICAL_PER_HORIZONTAL * run.horizontalAccuracyM;
      return { ...base, dropM: altitudeFallM(run.startAltitudeM, run.endAltitudeM), sigmaM: Math.SQRT2 * z95(vertical) };
    }
    case 'barometric': {
      const drop = barometricFallM(run.startPressureHPa, run.endPressureHPa, run.airTemperatureC);
      const hPa = run.baseStationCorrected ? BARO_SIGMA_HPA.corrected : BARO_SIGMA_HPA.uncorrected;
      const metresPerHPa = (287.05 * (run.airTemperatureC + 273.15)) / 9.80665 / run.endPressureHPa;
      return { ...base, dropM: drop, sigmaM: hPa * metresPerHPa };
    }
  }
}

export interface CombinedEstimate {
  valueM: number;
  sigmaM: number;
  runs: RunEstimate[];
  /** Runs that disagree with the most precise one by more than 3σ of the difference. */
  disagreeing: number[];
  methods: string;
}

/** Inverse-variance weighted mean of several runs over the same route (common practice, no source). */
export function combineRuns(runs: readonly FallRun[], sign = 1): CombinedEstimate {
  const estimates = runs.map((r, i) => {
    const e = estimateRun(r, i);
    return { ...e, dropM: sign * e.dropM };
  });
  let wSum = 0;
  let wx = 0;
  for (const e of estimates) {
    const w = 1 / (e.sigmaM * e.sigmaM);
    wSum += w;
    wx += w * e.dropM;
  }
  const best = estimates.reduce((a, b) => (b.sigmaM < a.sigmaM ? b : a));
  const disagreeing = estimates.filter((e) => e !== best && Math.abs(e.dropM - best.dropM) > 3 * Math.hypot(e.sigmaM, best.sigmaM)).map((e) => e.index);
  const mean = wx / wSum;
  return {
    valueM: mean,
    sigmaM: birgeRatio(estimates, mean) / Math.sqrt(wSum),
    runs: estimates,
    disagreeing,
    methods: [...new Set(estimates.map((e) => e.method))].join('+'),
  };
}

/**
 * Birge ratio √(χ²/(n − 1)) of runs about their weighted mean, never below 1 (Birge 1932): runs that disagree
 * by more than their own uncertainties widen the combined σ by their spread instead of narrowing it.
 */
export function birgeRatio(runs: readonly { dropM: number; sigmaM: number }[], mean: number): number {
  if (runs.length < 2) return 1;
  let chi2 = 0;
  for (const e of runs) chi2 += ((e.dropM - mean) / e.sigmaM) ** 2;
  return Math.max(1, Math.sqrt(chi2 / (runs.length - 1)));
}

// Default 1σ for a directly entered static lift, by method (common practice / from memory).
const DIRECT_LIFT_SIGMA: Record<string, (liftM: number) => number> = {
  level: () => 0.02,
  hose: () => 0.05,
  clinometer: (h) => 0.02 * h,
  gps: () => Math.SQRT2 * z95(10),
  barometric: () => 8.4,
  map: () => 5,
};

/** Static lift from the pump up to the tank water level, with its 1σ. */
export function estimateLift(lift: LiftReadings): CombinedEstimate {
  if (lift.kind === 'direct') {
    const sigma = lift.uncertaintyM ?? (DIRECT_LIFT_SIGMA[lift.method] ?? (() => 0.05))(lift.staticLiftM);
    return { valueM: lift.staticLiftM, sigmaM: sigma, runs: [], disagreeing: [], methods: `direct (${lift.method})` };
  }
  // Runs booked from the pump rise towards the tank: their "drop" is negative.
  return combineRuns(lift.runs, lift.bookedFrom === 'pump' ? -1 : 1);
}

// Method uncertainty of a single flow reading, relative 1σ (from memory: ISO 1438 Ce ±1–2 %).
const HEAD_READING_SIGMA_M = 0.002;
/** Float gaugings: ±10 % at best (Herschy; USBR WMM ch. 10; from memory), taken as 1σ. */
export const FLOAT_RELATIVE_SIGMA = 0.1;

export interface FlowEstimate {
  index: number;
  method: FlowMeasurement['method'];
  season: FlowMeasurement['season'];
  trialsLps: number[];
  meanLps: number;
  sdLps: number;
  minLps: number;
  maxLps: number;
  /** Relative 1σ of the mean: method coefficient and head reading, plus the standard error of the trials. */
  relativeSigma: number;
  lowHead: boolean;
}

/** Flow of one measurement from its trials, with spread and uncertainty. */
export function estimateFlow(m: FlowMeasurement, index: number): FlowEstimate {
  let trials: number[];
  let methodRel: number;
  let lowHead = false;
  switch (m.method) {
    case 'volumetric':
      trials = m.trials.map((t) => t.volumeL / t.seconds);
      methodRel = 0.03;
      break;
    case 'v-notch': {
      trials = m.trials.map((t) => vNotchFlowLps(t.headM, m.notchAngleDeg));
      const h = m.trials.reduce((lo, t) => (t.headM < lo ? t.headM : lo), Infinity);
      methodRel = Math.hypot(0.015, (2.5 * HEAD_READING_SIGMA_M) / h);
      lowHead = h < V_NOTCH_MIN_HEAD_M;
      break;
    }
    case 'rectangular-weir': {
      trials = m.trials.map((t) => rectangularWeirFlowLps(t));
      const h = m.trials.reduce((lo, t) => (t.headM < lo ? t.headM : lo), Infinity);
      methodRel = Math.hypot(0.03, (1.5 * HEAD_READING_SIGMA_M) / h);
      lowHead = h < V_NOTCH_MIN_HEAD_M;
      break;
    }
    case 'float':
      trials = m.trials.map((t) => floatFlowLps({ distanceM: t.distanceM, seconds: t.seconds, areaM2: m.areaM2, coefficient: m.coefficient }));
      methodRel = FLOAT_RELATIVE_SIGMA;
      break;
  }
  const s = summarise(trials, `flowMeasurements.${index}.trials`);
  const sem = s.sd / Math.sqrt(trials.length);
  return {
    index,
    method: m.method,
    season: m.season,
    trialsLps: trials,
    meanLps: s.mean,
    sdLps: s.sd,
    minLps: s.min,
    maxLps: s.max,
    relativeSigma: Math.hypot(methodRel, sem / s.mean),
    lowHead,
  };
}
