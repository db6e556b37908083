// The ram's operating point: delivery with delivery-pipe friction solved together (allocation-free for Monte Carlo).
import type { EfficiencyCurve } from './ram';

export interface OperatingContext {
  curve: EfficiencyCurve;
  /** Hazen–Williams k for the delivery pipe (loss = k·Q^1.852, Q in m³/s), fittings allowance included. */
  deliveryFrictionK: number;
}

export interface OperatingPoint {
  deliveryLpm: number;
  frictionM: number;
  totalLiftM: number;
  liftRatio: number;
  efficiency: number;
}

const ITERATIONS = 6;

/** Efficiency at a lift ratio without extrapolating: edge value below the curve, 0 above it. */
export function efficiencyAt(curve: EfficiencyCurve, ratio: number): number {
  if (ratio > curve.maxRatio) return 0;
  const r = ratio < curve.minRatio ? curve.minRatio : ratio;
  const e = curve.at(r);
  return e < 0 ? 0 : e > 1 ? 1 : e;
}

/**
 * Delivery, L/min: q = η(h/H)·Q·H/h with h = static lift + friction(q) (D'Aubuisson; Hazen–Williams),
 * solved by fixed-point iteration from q at zero friction; q never exceeds Q (energy: q·h ≤ Q·H).
 */
export function deliveryLpm(ctx: OperatingContext, fallM: number, staticLiftM: number, driveLpm: number, out?: Float64Array): number {
  if (!(fallM > 0) || !(driveLpm > 0) || !(staticLiftM > 0)) {
    if (out) {
      out[0] = 0;
      out[1] = staticLiftM;
      out[2] = fallM > 0 ? staticLiftM / fallM : 0;
      out[3] = fallM > 0 && staticLiftM > 0 ? efficiencyAt(ctx.curve, staticLiftM / fallM) : 0;
    }
    return 0;
  }
  let q = 0;
  let friction = 0;
  let lift = staticLiftM;
  let eff = 0;
  for (let i = 0; i < ITERATIONS; i++) {
    lift = staticLiftM + friction;
    eff = efficiencyAt(ctx.curve, lift / fallM);
    q = Math.min(driveLpm, (eff * driveLpm * fallM) / lift);
    friction = ctx.deliveryFrictionK * (q / 60000) ** 1.852;
  }
  if (out) {
    out[0] = friction;
    out[1] = lift;
    out[2] = lift / fallM;
    out[3] = eff;
  }
  return q;
}

/** The same operating point as a plain object, for the deterministic screen. */
export function operatingPoint(ctx: OperatingContext, fallM: number, staticLiftM: number, driveLpm: number): OperatingPoint {
  const scratch = new Float64Array(4);
  const q = deliveryLpm(ctx, fallM, staticLiftM, driveLpm, scratch);
  return { deliveryLpm: q, frictionM: scratch[0] ?? 0, totalLiftM: scratch[1] ?? staticLiftM, liftRatio: scratch[2] ?? 0, efficiency: scratch[3] ?? 0 };
}
