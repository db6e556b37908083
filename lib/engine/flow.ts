import { EngineInputError } from './errors';
import { G } from './physics';
import { finite, inRange, nonEmptyArray, positive } from './validate';

export interface VolumetricTrial {
  volumeL: number;
  seconds: number;
}

/** Bucket and stopwatch: mean of V/t over the trials, L/s (Peace Corps hydram manual, Session 3). */
export function volumetricFlowLps(trials: readonly VolumetricTrial[]): number {
  nonEmptyArray(trials, 'trials');
  let sum = 0;
  trials.forEach((t, i) => {
    sum += positive(t?.volumeL, `trials.${i}.volumeL`) / positive(t?.seconds, `trials.${i}.seconds`);
  });
  return sum / trials.length;
}

// Kindsvater–Shen effective coefficient Ce and head correction kh (m) by notch angle.
// 90°: Ce 0.578, kh 0.85 mm (USBR WMM ch. 7, found); other angles read off the ISO 1438 figure (from memory).
const KS_TABLE: readonly (readonly [angleDeg: number, ce: number, khM: number])[] = [
  [25, 0.59, 0.0024],
  [45, 0.581, 0.0016],
  [60, 0.577, 0.0012],
  [90, 0.578, 0.00085],
  [100, 0.58, 0.0008],
];

// USBR WMM ch. 7: Kindsvater–Shen holds for fully contracted notches of 25–100° (Kulin & Compton 1975).
export const V_NOTCH_ANGLE_RANGE_DEG = [25, 100] as const;

function interpolateKs(angleDeg: number): { ce: number; khM: number } {
  for (let i = 1; i < KS_TABLE.length; i++) {
    const hi = KS_TABLE[i];
    const lo = KS_TABLE[i - 1];
    if (hi && lo && angleDeg <= hi[0]) {
      const f = (angleDeg - lo[0]) / (hi[0] - lo[0]);
      return { ce: lo[1] + f * (hi[1] - lo[1]), khM: lo[2] + f * (hi[2] - lo[2]) };
    }
  }
  return { ce: 0.58, khM: 0.0008 };
}

/** Thin-plate V-notch flow, L/s: Kindsvater–Shen (ISO 1438; USBR WMM eq. 7-3). */
export function vNotchFlowLps(headM: number, notchAngleDeg = 90): number {
  positive(headM, 'headM');
  const [min, max] = V_NOTCH_ANGLE_RANGE_DEG;
  inRange(notchAngleDeg, 'notchAngleDeg', min, max);
  const { ce, khM } = interpolateKs(notchAngleDeg);
  const halfAngle = (notchAngleDeg * Math.PI) / 360;
  // Q = Ce·(8/15)·√(2g)·tan(θ/2)·(h + kh)^2.5
  const m3s = ce * (8 / 15) * Math.sqrt(2 * G) * Math.tan(halfAngle) * (headM + khM) ** 2.5;
  return m3s * 1000;
}

/** USBR WMM lower head limit for V-notch readings (0.2 ft ≈ 0.06 m); below it the reading is unreliable. */
export const V_NOTCH_MIN_HEAD_M = 0.06;

export interface RectangularWeirReading {
  crestWidthM: number;
  headM: number;
}

/** Contracted rectangular weir, L/s: Francis Q = 1.84·(L − 0.2h)·h^1.5 (SI form of 3.33 ft-cfs). */
export function rectangularWeirFlowLps({ crestWidthM, headM }: RectangularWeirReading): number {
  positive(crestWidthM, 'crestWidthM');
  positive(headM, 'headM');
  const effectiveM = crestWidthM - 0.2 * headM;
  if (effectiveM <= 0) {
    throw new EngineInputError('crestWidthM', 'must be more than 0.2 × the head for a contracted weir');
  }
  return 1.84 * effectiveM * headM ** 1.5 * 1000;
}

export interface FloatReading {
  distanceM: number;
  seconds: number;
  areaM2: number;
  coefficient?: number;
}

/** Float method, L/s: Q = k·(L/t)·A, k = 0.85 by default (USGS WSP 2175; Herschy 0.8–0.9). */
export function floatFlowLps({ distanceM, seconds, areaM2, coefficient = 0.85 }: FloatReading): number {
  positive(distanceM, 'distanceM');
  positive(seconds, 'seconds');
  positive(areaM2, 'areaM2');
  inRange(coefficient, 'coefficient', 0.5, 1);
  return coefficient * (distanceM / seconds) * areaM2 * 1000;
}

/** Mean, sample standard deviation, minimum and maximum of a list of values. */
export function summarise(values: readonly number[], field: string): { mean: number; sd: number; min: number; max: number } {
  nonEmptyArray(values, field);
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  values.forEach((v, i) => {
    finite(v, `${field}.${i}`);
    sum += v;
    min = Math.min(min, v);
    max = Math.max(max, v);
  });
  const mean = sum / values.length;
  let ss = 0;
  for (const v of values) ss += (v - mean) ** 2;
  const sd = values.length > 1 ? Math.sqrt(ss / (values.length - 1)) : 0;
  return { mean, sd, min, max };
}
