import { G } from './physics';
import { finite, positive } from './validate';

/** Velocity head, m: v²/(2g) (Bernoulli). */
export function velocityHeadM(velocityMps: number): number {
  const v = finite(velocityMps, 'velocityMps');
  return (v * v) / (2 * G);
}

/** Pressure head, m: p/(ρ·g) (hydrostatics). */
export function pressureHeadM(pressureKPa: number, densityKgM3 = 1000): number {
  const p = finite(pressureKPa, 'pressureKPa');
  const rho = positive(densityKgM3, 'densityKgM3');
  return (p * 1000) / (rho * G);
}

/** Pressure, kPa, of a head of water in m (inverse of pressureHeadM). */
export function headToKPa(headM: number, densityKgM3 = 1000): number {
  return (finite(headM, 'headM') * positive(densityKgM3, 'densityKgM3') * G) / 1000;
}
