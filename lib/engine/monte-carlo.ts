// Propagates reading uncertainties and the spread of ram efficiency to delivery by Monte Carlo, seeded (reproducible).
import { deliveryLpm, type OperatingContext } from './operating-point';
import { mulberry32, normalSampler, quantileSorted } from './random';

/** Relative 1σ of ram efficiency between makes and set-ups: η 0.5–0.8 about 0.6–0.65 read as ±2σ (efficiency-spread source). */
export const EFFICIENCY_RELATIVE_SIGMA = 0.12;

export interface MonteCarloInput {
  ctx: OperatingContext;
  fallM: number;
  fallSigmaM: number;
  staticLiftM: number;
  staticLiftSigmaM: number;
  lowestFlowLpm: number;
  lowestFlowRelativeSigma: number;
  designFraction: number;
  /** Most one ram takes, L/min (its size, or what the fall pushes); least it needs to beat. */
  ramMaxLpm: number;
  ramMinLpm: number;
  /** Rams in parallel, sharing the water and the delivery pipe (1 when absent). */
  ramCount?: number;
  /** Relative 1σ of the efficiency; EFFICIENCY_RELATIVE_SIGMA when absent. */
  efficiencyRelativeSigma?: number;
  demandLpd: number;
  samples: number;
  seed: number;
}

export interface MonteCarloResult {
  probabilityMeetsDemand: number;
  p10Lpd: number;
  p50Lpd: number;
  p90Lpd: number;
  meanLpd: number;
}

/** Samples fall, static lift, lowest flow and efficiency as independent normals; delivery per day of all rams for each draw. */
export function runMonteCarlo(input: MonteCarloInput): MonteCarloResult {
  const normal = normalSampler(mulberry32(input.seed));
  const n = input.samples;
  const count = input.ramCount ?? 1;
  const effSigma = input.efficiencyRelativeSigma ?? EFFICIENCY_RELATIVE_SIGMA;
  const ctx: OperatingContext = { ...input.ctx, ramCount: count, efficiencyFactor: 1 };
  const deliveries = new Float64Array(n);
  let meets = 0;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const fall = input.fallM + input.fallSigmaM * normal();
    const lift = input.staticLiftM + input.staticLiftSigmaM * normal();
    const lowest = input.lowestFlowLpm * (1 + input.lowestFlowRelativeSigma * normal());
    const factor = 1 + effSigma * normal();
    ctx.efficiencyFactor = factor > 0 ? factor : 0;
    let drive = (input.designFraction * lowest) / count;
    if (drive > input.ramMaxLpm) drive = input.ramMaxLpm;
    // A ram that gets less than its table minimum stalls; count no delivery.
    const perDay = drive < input.ramMinLpm ? 0 : 1440 * count * deliveryLpm(ctx, fall, lift, drive);
    deliveries[i] = perDay;
    sum += perDay;
    if (perDay >= input.demandLpd) meets++;
  }
  deliveries.sort();
  return {
    probabilityMeetsDemand: meets / n,
    p10Lpd: quantileSorted(deliveries, 0.1),
    p50Lpd: quantileSorted(deliveries, 0.5),
    p90Lpd: quantileSorted(deliveries, 0.9),
    meanLpd: sum / n,
  };
}
