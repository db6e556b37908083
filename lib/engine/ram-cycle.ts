// One beat of a ram, closed form (no time stepping, no allocation beyond the answer), so the phone can run it in the creek search.
import { G, WATER_DENSITY } from './physics';
import { positive } from './validate';

/**
 * Losses in the ram body besides the waste valve's gap, in drive-pipe velocity heads: pipe entrance 0.5 and the body's
 * turn 1.0 (from memory; with a 15 mm stroke on a 1¼″ valve the sum comes to the 2.65 the drive-pipe check uses).
 */
export const BODY_LOSS_K = 1.5;
/** Contraction of the jet through the waste valve's gap (sharp-edged orifice, 0.61; from memory). */
export const GAP_CONTRACTION = 0.61;
/** Weight in water of a steel or brass valve over its weight in air: 1 − 1000/7850 (buoyancy). */
const SUBMERGED_SHARE = 1 - WATER_DENSITY / 7850;
/** Darcy friction factor used when none is given: a small galvanised pipe near 1 m/s (Colebrook, from memory). */
export const DEFAULT_DARCY_F = 0.025;
/**
 * Time the waste valve takes to shut, s. Fitted: the one value that brings the model to the Building Trades Pocketbook's
 * efficiency table (lift ratios 4–24) at a setting beating about 60 a minute; 0.03–0.04 s all fit within 0.1.
 */
export const WASTE_VALVE_CLOSING_S = 0.035;
/** Wave speed, m/s, used when none is given: a steel drive pipe (Korteweg with the engine's steel figures gives 1,250–1,350). */
export const DEFAULT_WAVE_SPEED_MPS = 1300;

/** Beat rate band, beats per minute (NITK lab notes 40–120; the CAT tipsheet gives 40–90). */
export const BEATS_PER_MINUTE_BAND = { min: 40, max: 120 } as const;

export interface RamCycleInput {
  /** Fall H from the intake (or stand pipe) water level to the ram, m. */
  fallM: number;
  /** Lift h from the ram to the delivery outlet, m (above the fall for a ram to work). */
  liftM: number;
  driveLengthM: number;
  driveBoreMm: number;
  /** Darcy friction factor of the drive pipe. */
  darcyF?: number;
  waveSpeedMps?: number;
  /** Waste valve stroke (how far the valve drops open), mm. */
  strokeMm: number;
  /** Weight of the waste valve with its added weights, N (in air; buoyancy is taken off). */
  valveWeightN: number;
}

export interface RamCycle {
  /** False when the flow through the open valve never gets fast enough to lift it shut: the ram stalls open. */
  closes: boolean;
  beatsPerMinute: number;
  /** Drive velocity when the waste valve shuts, m/s. */
  closureVelocityMps: number;
  /** Steady velocity through the open valve, the ceiling the drive flow approaches, m/s. */
  steadyVelocityMps: number;
  /** Water out of the waste valve per beat, L. */
  wastePerBeatL: number;
  /** Water pushed into the air vessel per beat, L. */
  deliveryPerBeatL: number;
  /** Waste plus delivery per beat, L. */
  drivePerBeatL: number;
  driveLpm: number;
  deliveryLpm: number;
  /** D'Aubuisson efficiency q·h/(Q·H). */
  efficiency: number;
  /** Head rise at the ram when the valve shuts, m: Joukowsky a·v/g, or Michaud's 2L·v/(g·t) when the valve shuts slower than 2L/a. */
  surgeHeadM: number;
  /** Seconds spent in each phase of one beat: accelerating, shutting, delivering, recoil, waste valve dropping open. */
  phasesS: { accelerate: number; close: number; deliver: number; recoil: number; reopen: number };
}

/** Loss coefficient of the waste valve's gap in drive-pipe velocity heads: (A / (Cc·π·D·s))² for a port the size of the bore. */
export function wasteValveLossK(driveBoreMm: number, strokeMm: number): number {
  const ratio = driveBoreMm / (4 * GAP_CONTRACTION * strokeMm);
  return ratio * ratio;
}

/**
 * Drive velocity, m/s, at which the flow lifts the waste valve shut: the gap's pressure drop K·ρv²/2 on the port's
 * area equals the valve's weight in water (Iversen 1975 and Young 1996 close the valve at a set velocity; the drag
 * law is this model's). A longer stroke (smaller K) or a heavier valve shuts at a higher velocity.
 */
export function closureVelocityMps(driveBoreMm: number, strokeMm: number, valveWeightN: number): number {
  const area = (Math.PI * (driveBoreMm / 1000) ** 2) / 4;
  return Math.sqrt((2 * valveWeightN * SUBMERGED_SHARE) / (WATER_DENSITY * area * wasteValveLossK(driveBoreMm, strokeMm)));
}

/** Valve weight, N in air, that shuts at a given drive velocity (the inverse of closureVelocityMps). */
export function valveWeightForClosureN(driveBoreMm: number, strokeMm: number, closureMps: number): number {
  const area = (Math.PI * (driveBoreMm / 1000) ** 2) / 4;
  return (WATER_DENSITY * area * wasteValveLossK(driveBoreMm, strokeMm) * closureMps * closureMps) / (2 * SUBMERGED_SHARE);
}

const STALLED: Omit<RamCycle, 'steadyVelocityMps' | 'closureVelocityMps'> = {
  closes: false,
  beatsPerMinute: 0,
  wastePerBeatL: 0,
  deliveryPerBeatL: 0,
  drivePerBeatL: 0,
  driveLpm: 0,
  deliveryLpm: 0,
  efficiency: 0,
  surgeHeadM: 0,
  phasesS: { accelerate: Infinity, close: 0, deliver: 0, recoil: 0, reopen: 0 },
};

/**
 * One beat of the ram (after Iversen 1975 and Young 1996, zero recoil flow at the start of each beat):
 * 1. Acceleration with the waste valve open: (L/g)·dv/dt = H − (1 + ΣK + fL/D)·v²/2g, so v = v∞·tanh(t/τ) with
 *    v∞ = √(2gH / (1 + ΣK + fL/D)) and τ = L·v∞/(gH); the water passed is A·v∞·τ·(−½·ln(1 − (vc/v∞)²)).
 * 2. Closure at vc over WASTE_VALVE_CLOSING_S (water still leaving at about vc/2): the head at the valve rises by
 *    a′·Δv/g with a′ = a (Joukowsky) or 2L/t when the valve shuts slower than a wave's round trip (Michaud); it reaches
 *    h after the drive velocity falls by g(h − H)/a′, leaving v1 = vc − g(h − H)/a′.
 * 3. Delivery: the column slows against h − H plus its friction at the mean velocity (rigid column), for
 *    t = L·v1/(g·(h − H + hf)), pushing A·v1·t/2 past the delivery valve.
 * 4. Recoil: one round trip of the pressure wave, 2L/a, drops the head at the ram and lets the valve fall.
 * 5. The valve drops its stroke under its weight in water, √(2s/g′), and the next beat starts from rest.
 */
export function ramCycle(p: RamCycleInput, closureMps = closureVelocityMps(p.driveBoreMm, p.strokeMm, p.valveWeightN)): RamCycle {
  const H = positive(p.fallM, 'fallM');
  const h = positive(p.liftM, 'liftM');
  const L = positive(p.driveLengthM, 'driveLengthM');
  const D = positive(p.driveBoreMm, 'driveBoreMm') / 1000;
  const s = positive(p.strokeMm, 'strokeMm') / 1000;
  const f = p.darcyF === undefined ? DEFAULT_DARCY_F : positive(p.darcyF, 'darcyF');
  const a = p.waveSpeedMps === undefined ? DEFAULT_WAVE_SPEED_MPS : positive(p.waveSpeedMps, 'waveSpeedMps');
  const vc = positive(closureMps, 'closureVelocityMps');
  const area = (Math.PI * D * D) / 4;
  const friction = (f * L) / D;
  const vInf = Math.sqrt((2 * G * H) / (1 + BODY_LOSS_K + wasteValveLossK(p.driveBoreMm, p.strokeMm) + friction));
  if (vc >= vInf) return { ...STALLED, steadyVelocityMps: vInf, closureVelocityMps: vc };

  const r = vc / vInf;
  const tau = (L * vInf) / (G * H);
  const accelerate = tau * Math.atanh(r);
  const close = WASTE_VALVE_CLOSING_S;
  const waste = area * vInf * tau * -0.5 * Math.log(1 - r * r) + (area * vc * close) / 2;
  const surgeSpeed = close > (2 * L) / a ? (2 * L) / close : a;

  const rise = h - H;
  const v1 = rise > 0 ? vc - (G * rise) / surgeSpeed : vc;
  let deliver = 0;
  let delivered = 0;
  if (v1 > 0 && rise > 0) {
    const hf = (friction * (v1 / 2) ** 2) / (2 * G);
    deliver = (L * v1) / (G * (rise + hf));
    delivered = (area * v1 * deliver) / 2;
  }
  const recoil = (2 * L) / a;
  const reopen = Math.sqrt((2 * s) / (G * SUBMERGED_SHARE));
  const period = accelerate + close + deliver + recoil + reopen;
  const beats = 60 / period;
  const drive = waste + delivered;
  return {
    closes: true,
    beatsPerMinute: beats,
    closureVelocityMps: vc,
    steadyVelocityMps: vInf,
    wastePerBeatL: waste * 1000,
    deliveryPerBeatL: delivered * 1000,
    drivePerBeatL: drive * 1000,
    driveLpm: drive * 1000 * beats,
    deliveryLpm: delivered * 1000 * beats,
    efficiency: drive > 0 ? (delivered * h) / (drive * H) : 0,
    surgeHeadM: (surgeSpeed * vc) / G,
    phasesS: { accelerate, close, deliver, recoil, reopen },
  };
}

/**
 * The closure velocity, m/s, at which the model beats at a given rate (bisection: beats fall as the closure velocity
 * rises), or null when no closing valve beats that slowly or that fast on this pipe and fall.
 */
export function closureForBeats(p: Omit<RamCycleInput, 'valveWeightN'>, beatsPerMinute: number): number | null {
  positive(beatsPerMinute, 'beatsPerMinute');
  const probe = { ...p, valveWeightN: 1 };
  const vInf = ramCycle(probe, 1e-9).steadyVelocityMps;
  let lo = vInf * 1e-4;
  let hi = vInf * (1 - 1e-9);
  if (ramCycle(probe, lo).beatsPerMinute < beatsPerMinute || ramCycle(probe, hi).beatsPerMinute > beatsPerMinute) return null;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (ramCycle(probe, mid).beatsPerMinute > beatsPerMinute) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
