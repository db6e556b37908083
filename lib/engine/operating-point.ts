// The ram's operating point: delivery with delivery-pipe friction solved together (allocation-free for Monte Carlo).
import type { EfficiencyCurve } from './ram';

export interface OperatingContext {
  curve: EfficiencyCurve;
  /** Hazen–Williams k for the delivery pipe (loss = k·Q^1.852, Q in m³/s), fittings allowance included. */
  deliveryFrictionK: number;
  /** Rams in parallel sharing the delivery pipe: friction is taken at their summed flow (1 when absent). */
  ramCount?: number;
  /** Multiplies the curve's efficiency (Monte Carlo draws of the spread between makes); 1 when absent. */
  efficiencyFactor?: number;
}

export interface OperatingPoint {
  deliveryLpm: number;
  frictionM: number;
  totalLiftM: number;
  liftRatio: number;
  efficiency: number;
}

/**
 * Efficiency at a lift ratio without extrapolating: above the curve 0; below it the delivered share q/Q is held
 * at the curve's first value (η·H/h at the edge), so the efficiency falls with the ratio instead of staying high.
 */
export function efficiencyAt(curve: EfficiencyCurve, ratio: number, factor = 1): number {
  if (ratio > curve.maxRatio) return 0;
  const edge = curve.at(curve.minRatio);
  const e = (ratio < curve.minRatio ? (edge * ratio) / curve.minRatio : curve.at(ratio)) * factor;
  return e < 0 ? 0 : e > 1 ? 1 : e;
}

function liftAt(ctx: OperatingContext, staticLiftM: number, q: number): number {
  const n = ctx.ramCount ?? 1;
  return staticLiftM + ctx.deliveryFrictionK * ((n * q) / 60000) ** 1.852;
}

/** q the ram would deliver if the delivery pipe carried q0: η(h/H)·Q·H/h, never above Q; falls as q0 rises. */
function deliveryIfFlowing(ctx: OperatingContext, fallM: number, staticLiftM: number, driveLpm: number, q0: number): number {
  const lift = liftAt(ctx, staticLiftM, q0);
  const q = (efficiencyAt(ctx.curve, lift / fallM, ctx.efficiencyFactor) * driveLpm * fallM) / lift;
  return q < driveLpm ? q : driveLpm;
}

/**
 * Delivery, L/min: q = η(h/H)·Q·H/h with h = static lift + friction(q) (D'Aubuisson; Hazen–Williams).
 * q − g(q) rises with q, so the root is bracketed in [0, g(0)] and found by the Illinois false-position method;
 * plain fixed-point iteration oscillates when friction is large. Writes friction, lift, ratio, η to `out`.
 */
export function deliveryLpm(ctx: OperatingContext, fallM: number, staticLiftM: number, driveLpm: number, out?: Float64Array): number {
  if (!(fallM > 0) || !(driveLpm > 0) || !(staticLiftM > 0)) {
    if (out) {
      out[0] = 0;
      out[1] = staticLiftM;
      out[2] = fallM > 0 ? staticLiftM / fallM : 0;
      out[3] = fallM > 0 && staticLiftM > 0 ? efficiencyAt(ctx.curve, staticLiftM / fallM, ctx.efficiencyFactor) : 0;
    }
    return 0;
  }
  let lo = 0;
  let hi = deliveryIfFlowing(ctx, fallM, staticLiftM, driveLpm, 0);
  let fLo = -hi;
  let fHi = hi - deliveryIfFlowing(ctx, fallM, staticLiftM, driveLpm, hi);
  let q = hi;
  let side = 0;
  for (let i = 0; i < 60 && fHi > 0 && hi - lo > 1e-10 * hi; i++) {
    q = hi - (fHi * (hi - lo)) / (fHi - fLo);
    const fq = q - deliveryIfFlowing(ctx, fallM, staticLiftM, driveLpm, q);
    if (fq > 0) {
      hi = q;
      fHi = fq;
      if (side === 1) fLo /= 2;
      side = 1;
    } else {
      lo = q;
      fLo = fq;
      if (side === -1) fHi /= 2;
      side = -1;
      if (fq === 0) break;
    }
  }
  // Report g(q) at the solved q, so delivery × lift = η·Q·H exactly (energy never grows).
  const lift = liftAt(ctx, staticLiftM, q);
  const delivered = deliveryIfFlowing(ctx, fallM, staticLiftM, driveLpm, q);
  if (out) {
    out[0] = lift - staticLiftM;
    out[1] = lift;
    out[2] = lift / fallM;
    out[3] = efficiencyAt(ctx.curve, lift / fallM, ctx.efficiencyFactor);
  }
  return delivered;
}

/** The same operating point as a plain object, for the deterministic screen (per ram; friction at the rams' summed flow). */
export function operatingPoint(ctx: OperatingContext, fallM: number, staticLiftM: number, driveLpm: number): OperatingPoint {
  const scratch = new Float64Array(4);
  const q = deliveryLpm(ctx, fallM, staticLiftM, driveLpm, scratch);
  return { deliveryLpm: q, frictionM: scratch[0] ?? 0, totalLiftM: scratch[1] ?? staticLiftM, liftRatio: scratch[2] ?? 0, efficiency: scratch[3] ?? 0 };
}
