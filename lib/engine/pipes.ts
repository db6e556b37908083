import { G, WATER_BULK_MODULUS_PA, WATER_DENSITY, waterDensityKgM3, waterViscosityPaS } from './physics';
import { inRange, nonNegative, positive } from './validate';

export interface HazenWilliamsInput {
  lengthM: number;
  flowLps: number;
  diameterMm: number;
  c: number;
}

/** Hazen–Williams head loss, m: 10.67·L·Q^1.852/(C^1.852·D^4.87) (EPANET 2 manual, Table 3.1). */
export function hazenWilliamsLossM({ lengthM, flowLps, diameterMm, c }: HazenWilliamsInput): number {
  nonNegative(lengthM, 'lengthM');
  nonNegative(flowLps, 'flowLps');
  positive(diameterMm, 'diameterMm');
  inRange(c, 'c', 40, 160);
  return hazenWilliamsCoefficient(lengthM, diameterMm, c) * (flowLps / 1000) ** 1.852;
}

/** The part of Hazen–Williams that does not depend on flow (loss = k·Q^1.852, Q in m³/s); used in hot loops. */
export function hazenWilliamsCoefficient(lengthM: number, diameterMm: number, c: number): number {
  return (10.67 * lengthM) / (c ** 1.852 * (diameterMm / 1000) ** 4.87);
}

/** Mean velocity, m/s, of a flow in L/s through a bore in mm. */
export function pipeVelocityMps(flowLps: number, diameterMm: number): number {
  nonNegative(flowLps, 'flowLps');
  const d = positive(diameterMm, 'diameterMm') / 1000;
  return flowLps / 1000 / ((Math.PI * d * d) / 4);
}

/** Darcy friction factor: laminar 64/Re; turbulent Colebrook (1939) iterated from Swamee–Jain (1976). */
export function frictionFactor(reynolds: number, relativeRoughness: number): number {
  if (reynolds < 2300) return 64 / reynolds;
  const swameeJain = 0.25 / Math.log10(relativeRoughness / 3.7 + 5.74 / reynolds ** 0.9) ** 2;
  let invRoot = 1 / Math.sqrt(swameeJain);
  for (let i = 0; i < 30; i++) {
    const next = -2 * Math.log10(relativeRoughness / 3.7 + (2.51 * invRoot) / reynolds);
    if (Math.abs(next - invRoot) < 1e-12) break;
    invRoot = next;
  }
  const turbulent = 1 / (invRoot * invRoot);
  // Transition zone (2300–4000): take the larger of the two so the loss is not understated.
  return reynolds < 4000 ? Math.max(turbulent, 64 / reynolds) : turbulent;
}

export interface DarcyWeisbachInput {
  lengthM: number;
  flowLps: number;
  diameterMm: number;
  roughnessMm: number;
  temperatureC?: number;
}

/** Darcy–Weisbach head loss, m: f·(L/D)·v²/(2g), f from Colebrook, viscosity from temperature. */
export function darcyWeisbachLossM({ lengthM, flowLps, diameterMm, roughnessMm, temperatureC = 15 }: DarcyWeisbachInput): number {
  nonNegative(lengthM, 'lengthM');
  nonNegative(flowLps, 'flowLps');
  positive(diameterMm, 'diameterMm');
  nonNegative(roughnessMm, 'roughnessMm');
  inRange(temperatureC, 'temperatureC', 0, 60);
  if (flowLps === 0 || lengthM === 0) return 0;
  const d = diameterMm / 1000;
  const v = pipeVelocityMps(flowLps, diameterMm);
  const reynolds = (waterDensityKgM3(temperatureC) * v * d) / waterViscosityPaS(temperatureC);
  const f = frictionFactor(reynolds, roughnessMm / diameterMm);
  return (f * (lengthM / d) * v * v) / (2 * G);
}

export interface WaveSpeedInput {
  diameterMm: number;
  wallMm: number;
  pipeModulusGPa: number;
  /** Pipe restraint factor c: 1 with expansion joints, 1 − ν² anchored throughout (Wylie & Streeter). */
  supportFactor?: number;
}

/** Pressure-wave speed in a water-filled pipe, m/s: Korteweg a = √(K/ρ)/√(1 + c·K·D/(E·e)). */
export function waveSpeedMps({ diameterMm, wallMm, pipeModulusGPa, supportFactor = 1 }: WaveSpeedInput): number {
  const d = positive(diameterMm, 'diameterMm');
  const e = positive(wallMm, 'wallMm');
  const modulusPa = positive(pipeModulusGPa, 'pipeModulusGPa') * 1e9;
  const c = inRange(supportFactor, 'supportFactor', 0.5, 1);
  const k = WATER_BULK_MODULUS_PA;
  return Math.sqrt(k / WATER_DENSITY) / Math.sqrt(1 + (c * k * d) / (modulusPa * e));
}

export interface JoukowskyInput {
  waveSpeedMps: number;
  velocityChangeMps: number;
}

/** Joukowsky surge head, m: ΔH = a·Δv/g (Joukowsky 1900; Wylie & Streeter 1993). */
export function joukowskySurgeM({ waveSpeedMps: a, velocityChangeMps: dv }: JoukowskyInput): number {
  positive(a, 'waveSpeedMps');
  nonNegative(dv, 'velocityChangeMps');
  return (a * dv) / G;
}
