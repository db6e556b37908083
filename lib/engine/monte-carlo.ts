// Propagates reading uncertainties to delivery by Monte Carlo with a seeded generator (reproducible).
import { deliveryLpm, type OperatingContext } from './operating-point';
import { mulberry32, normalSampler, quantileSorted } from './random';

export interface MonteCarloInput {
  ctx: OperatingContext;
  fallM: number;
  fallSigmaM: number;
  staticLiftM: number;
  staticLiftSigmaM: number;
  lowestFlowLpm: number;
  lowestFlowRelativeSigma: number;
  designFraction: number;
  /** Most the chosen ram can use, L/min; least it needs to beat. */
  ramMaxLpm: number;
  ramMinLpm: number;
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

/** Samples fall, static lift and lowest flow as independent normals; delivery per day for each draw. */
export function runMonteCarlo(input: MonteCarloInput): MonteCarloResult {
  const normal = normalSampler(mulberry32(input.seed));
  const n = input.samples;
  const deliveries = new Float64Array(n);
  let meets = 0;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const fall = input.fallM + input.fallSigmaM * normal();
    const lift = input.staticLiftM + input.staticLiftSigmaM * normal();
    const lowest = input.lowestFlowLpm * (1 + input.lowestFlowRelativeSigma * normal());
    let drive = input.designFraction * lowest;
    if (drive > input.ramMaxLpm) drive = input.ramMaxLpm;
    // A ram that gets less than its table minimum stalls; count no delivery.
    const perDay = drive < input.ramMinLpm ? 0 : 1440 * deliveryLpm(input.ctx, fall, lift, drive);
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
