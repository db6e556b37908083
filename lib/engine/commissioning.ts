// commissioningCheck: the installed ram measured against its screening, with likely causes when it falls short.
import { EngineInputError } from './errors';
import { daubuissonEfficiency, rankineEfficiency } from './ram';
import { finite, positive } from './validate';
import { ASSUMED_STROKE_MM, wasteValveAdvice, type DesignPoint, type WasteValveAdvice } from './waste-valve-advice';

import { BEATS_PER_MINUTE_BAND } from './ram-cycle';

export { BEATS_PER_MINUTE_BAND };
/** Measured drive flow below this share of the screened drive flow points at the intake (common practice, no source). */
export const LOW_DRIVE_SHARE = 0.85;
/** Efficiency below this share of the predicted one points at the ram or its pipes (common practice, no source). */
export const LOW_EFFICIENCY_SHARE = 0.85;
/** Measured lift above the screened one by more than this share (common practice, no source). */
export const HIGH_LIFT_SHARE = 0.1;

export interface CommissioningReadings {
  /** Total drive flow Q, L/min: waste plus delivered, caught at the waste valve and the tank. */
  driveLpm: number;
  /** Delivered flow q at the tank (bucket), L/min. */
  deliveredLpm: number;
  beatsPerMinute: number;
  /** Measured lift h from the ram up to the delivery outlet, m. */
  liftM: number;
  /** Measured fall H from the intake water level to the ram, m. */
  fallM: number;
  /** Drive pipe material as installed (plastic pipes lower the surge). */
  drivePipeMaterial?: string;
  /** The waste valve's stroke as set, mm; without it the advice assumes the middle of the usual range. */
  wasteValveStrokeMm?: number;
}

/** What the screening predicted (from its traced figures). */
export interface CommissioningPrediction {
  deliveryLpd: number;
  p10Lpd: number;
  p90Lpd: number;
  efficiency: number;
  driveLpm: number;
  totalLiftM: number;
}

export type CommissioningOutcome = 'as-predicted' | 'above-band' | 'short' | 'well-short';

export interface LikelyCause {
  code: string;
  text: string;
}

export interface CommissioningResult {
  measuredLpd: number;
  daubuissonEfficiency: number;
  rankineEfficiency: number;
  /** Delivered / drive flow (r in η_R = (η_D − r)/(1 − r)). */
  flowRatio: number;
  prediction: CommissioningPrediction | null;
  /** Measured delivery / predicted delivery. */
  deliveryRatio: number | null;
  outcome: CommissioningOutcome | null;
  beatsInBand: boolean;
  causes: LikelyCause[];
  /** Which way to move the waste valve, from the cycle model at the measured fall and lift; null without the drive pipe's figures. */
  valve: WasteValveAdvice | null;
}

const PLASTIC = ['hdpe', 'pvc', 'pe', 'polyethylene'];

function causesFor(r: CommissioningReadings, p: CommissioningPrediction | null, etaD: number, short: boolean): LikelyCause[] {
  const out: LikelyCause[] = [];
  // η_D above 1 would mean the ram made energy: a reading is wrong, so no other cause is worth offering.
  if (etaD > 1)
    return [
      { code: 'readings-impossible', text: 'These readings give more energy out than in (efficiency above 100 %): measure the flows, fall and lift again.' },
    ];
  if (r.beatsPerMinute > BEATS_PER_MINUTE_BAND.max) {
    out.push({
      code: 'beats-fast',
      text: `The ram beats ${r.beatsPerMinute}/min, above ${BEATS_PER_MINUTE_BAND.max}/min: the waste valve stroke is likely too short (lengthen it or add weight) so the drive water never gets up to speed.`,
    });
  } else if (r.beatsPerMinute < BEATS_PER_MINUTE_BAND.min) {
    out.push({
      code: 'beats-slow',
      text: `The ram beats ${r.beatsPerMinute}/min, below ${BEATS_PER_MINUTE_BAND.min}/min: the waste valve stroke is likely too long or too heavy, wasting drive water.`,
    });
  }
  if (!p || !short) return out;
  if (r.driveLpm < LOW_DRIVE_SHARE * p.driveLpm) {
    out.push({
      code: 'drive-low',
      text: 'Less drive flow than screened: check the intake screen for trash or sand, the water depth over the drive pipe inlet, and whether the creek is lower than when it was measured.',
    });
  }
  if (r.liftM > (1 + HIGH_LIFT_SHARE) * p.totalLiftM) {
    out.push({
      code: 'lift-high',
      text: 'The measured lift is higher than screened: check the tank height and for a partly closed valve or kinked delivery pipe.',
    });
  }
  if (etaD < LOW_EFFICIENCY_SHARE * p.efficiency) {
    out.push({
      code: 'air-in-drive',
      text: 'Air in the drive pipe (a gurgling intake, a high point, or a leaking joint drawing air) cushions the surge: bleed it and keep the inlet well under water.',
    });
    out.push({ code: 'waste-valve', text: 'The waste valve stroke and weight may need tuning for this fall.' });
    out.push({
      code: 'leaks',
      text: 'Leaks at the delivery valve, the air vessel or along the delivery pipe lose pumped water: walk the line, check the tank inlet.',
    });
    out.push({ code: 'air-vessel', text: 'A waterlogged air vessel (snifter blocked) makes the ram knock and deliver less: clear the snifter hole.' });
    if (r.drivePipeMaterial && PLASTIC.some((m) => r.drivePipeMaterial?.toLowerCase().includes(m))) {
      out.push({
        code: 'flexible-drive',
        text: 'A plastic drive pipe stretches with each beat and lowers the surge (a lower wave speed): a rigid steel drive pipe delivers more.',
      });
    }
  }
  return out;
}

/**
 * Measured D'Aubuisson and Rankine efficiencies (NITK notes), delivery against the screening's prediction
 * and its 10–90 % band, and likely causes when it falls short.
 */
export function commissioningCheck(
  r: CommissioningReadings,
  prediction: CommissioningPrediction | null = null,
  design: DesignPoint | null = null,
): CommissioningResult {
  positive(r.driveLpm, 'driveLpm');
  positive(r.deliveredLpm, 'deliveredLpm');
  positive(r.beatsPerMinute, 'beatsPerMinute');
  positive(r.liftM, 'liftM');
  positive(r.fallM, 'fallM');
  if (prediction) {
    for (const k of ['deliveryLpd', 'p10Lpd', 'p90Lpd', 'efficiency', 'driveLpm', 'totalLiftM'] as const) finite(prediction[k], `prediction.${k}`);
    if (prediction.p10Lpd > prediction.p90Lpd) throw new EngineInputError('prediction.p10Lpd', 'must not be above p90Lpd');
  }
  const reading = { supplyLpm: r.driveLpm, deliveryLpm: r.deliveredLpm, fallM: r.fallM, liftM: r.liftM };
  const etaD = daubuissonEfficiency(reading);
  const etaR = rankineEfficiency(reading);
  const measuredLpd = r.deliveredLpm * 1440;
  let outcome: CommissioningOutcome | null = null;
  let ratio: number | null = null;
  if (prediction) {
    ratio = prediction.deliveryLpd > 0 ? measuredLpd / prediction.deliveryLpd : null;
    if (measuredLpd > prediction.p90Lpd) outcome = 'above-band';
    else if (measuredLpd >= prediction.p10Lpd) outcome = 'as-predicted';
    // Below the band: "well short" under half the prediction (common practice, no source).
    else outcome = ratio !== null && ratio < 0.5 ? 'well-short' : 'short';
  }
  const short = outcome === 'short' || outcome === 'well-short';
  return {
    measuredLpd,
    daubuissonEfficiency: etaD,
    rankineEfficiency: etaR,
    flowRatio: r.deliveredLpm / r.driveLpm,
    prediction,
    deliveryRatio: ratio,
    outcome,
    beatsInBand: r.beatsPerMinute >= BEATS_PER_MINUTE_BAND.min && r.beatsPerMinute <= BEATS_PER_MINUTE_BAND.max,
    causes: causesFor(r, prediction, etaD, short),
    // Readings that make energy have no valve setting worth suggesting.
    valve: design && etaD <= 1 ? wasteValveAdvice(r, design, r.wasteValveStrokeMm ?? ASSUMED_STROKE_MM) : null,
  };
}

/** One ram's prediction from a stored screening (daily figures shared between rams in parallel), or null when a figure is missing. */
export function predictionFromFigures(figures: Partial<Record<string, { value: number | null }>>): CommissioningPrediction | null {
  const v = (k: string) => figures[k]?.value ?? null;
  const n = v('ramCount') ?? 1;
  const perRam = (x: number | null) => (x === null ? null : x / n);
  const p = {
    deliveryLpd: perRam(v('deliveryLpd')),
    p10Lpd: perRam(v('deliveryP10Lpd')),
    p90Lpd: perRam(v('deliveryP90Lpd')),
    efficiency: v('efficiency'),
    driveLpm: v('driveFlowLpm'),
    totalLiftM: v('totalLiftM'),
  };
  return Object.values(p).every((x) => typeof x === 'number') ? (p as CommissioningPrediction) : null;
}
