import { EngineInputError } from './errors';
import { finite, inRange, nonEmptyArray, nonNegative, positive } from './validate';

export interface LevelRow {
  backsightM?: number;
  foresightM?: number;
}

export interface LevelRunResult {
  /** Drop from the first to the last station, m; positive when the last station is lower. */
  fallM: number;
  /** Reduced level of each station relative to the first (0), m. */
  reducedLevelsM: number[];
  /** ΣBS − ΣFS equals last RL − first RL (to 0.1 mm). */
  arithmeticCheckOk: boolean;
  setups: number;
}

/** Differential levelling by height of instrument: HI = RL + BS, RL = HI − FS (surveying textbooks). */
export function levelRun(rows: readonly LevelRow[]): LevelRunResult {
  nonEmptyArray(rows, 'rows');
  if (rows.length < 2) throw new EngineInputError('rows', 'must hold at least two stations');
  const last = rows.length - 1;
  const reducedLevelsM: number[] = [0];
  let sumBs = 0;
  let sumFs = 0;
  let hi = 0;
  rows.forEach((row, i) => {
    const bs = row?.backsightM;
    const fs = row?.foresightM;
    if (i > 0) {
      if (fs === undefined) throw new EngineInputError(`rows.${i}.foresightM`, 'is needed on every station after the first');
      sumFs += nonNegative(fs, `rows.${i}.foresightM`);
      reducedLevelsM.push(hi - fs);
    } else if (fs !== undefined) {
      throw new EngineInputError(`rows.0.foresightM`, 'must be empty on the first station');
    }
    if (i < last) {
      if (bs === undefined) throw new EngineInputError(`rows.${i}.backsightM`, 'is needed on every station before the last');
      sumBs += nonNegative(bs, `rows.${i}.backsightM`);
      hi = (reducedLevelsM[i] ?? 0) + bs;
    } else if (bs !== undefined) {
      throw new EngineInputError(`rows.${i}.backsightM`, 'must be empty on the last station');
    }
  });
  const lastRl = reducedLevelsM[last] ?? 0;
  return {
    fallM: -lastRl,
    reducedLevelsM,
    arithmeticCheckOk: Math.abs(sumBs - sumFs - lastRl) < 1e-4,
    setups: last,
  };
}

/** Staff readings a level run takes for a known drop: set-ups of at most `perSetupM` each (a staff reads to 5 m). */
export function levelRowsDropping(dropM: number, perSetupM = 5): LevelRow[] {
  const n = Math.max(1, Math.ceil(Math.abs(dropM) / perSetupM));
  const step = dropM / n;
  return Array.from({ length: n + 1 }, (_, i) => ({
    ...(i > 0 ? { foresightM: Math.max(step, 0) } : {}),
    ...(i < n ? { backsightM: Math.max(-step, 0) } : {}),
  }));
}

export interface ClinometerLeg {
  slopeDistanceM: number;
  /** Positive when sighting downhill; negative for a rising leg. */
  angleBelowHorizontalDeg: number;
}

/** Clinometer/Abney legs: Δh = slope distance × sin(angle), summed (Peace Corps mapping notes; FAO). */
export function clinometerFallM(legs: readonly ClinometerLeg[]): number {
  nonEmptyArray(legs, 'legs');
  let fall = 0;
  legs.forEach((leg, i) => {
    const s = positive(leg?.slopeDistanceM, `legs.${i}.slopeDistanceM`);
    const a = inRange(leg?.angleBelowHorizontalDeg, `legs.${i}.angleBelowHorizontalDeg`, -89, 89);
    fall += s * Math.sin((a * Math.PI) / 180);
  });
  return fall;
}

export interface HoseLevelStep {
  /** Water surface height above the ground mark at the upper (uphill) station, m. */
  upperReadingM: number;
  /** Water surface height above the ground mark at the lower (downhill) station, m. */
  lowerReadingM: number;
}

/**
 * Water-tube (hose) level, stepped downhill: both water surfaces stand at one elevation, so the ground
 * drops by lowerReading − upperReading at each step; steps are summed (construction practice; FAO).
 */
export function hoseLevelFallM(steps: readonly HoseLevelStep[]): number {
  nonEmptyArray(steps, 'steps');
  let fall = 0;
  steps.forEach((step, i) => {
    const up = nonNegative(step?.upperReadingM, `steps.${i}.upperReadingM`);
    const low = nonNegative(step?.lowerReadingM, `steps.${i}.lowerReadingM`);
    fall += low - up;
  });
  return fall;
}

export type LevellingOrder = 'first' | 'second' | 'third';

// mm per √km of loop (ACSM orders of accuracy; US Army EN0593 gives 8.4 mm for 2nd order class II).
export const MISCLOSURE_MM_PER_ROOT_KM: Readonly<Record<LevellingOrder, number>> = {
  first: 4.0,
  second: 8.4,
  third: 12.0,
};

/** Allowed loop misclosure, mm: k·√K with K the loop length in km (orders of accuracy). */
export function allowedMisclosureMm(loopKm: number, order: LevellingOrder): number {
  positive(loopKm, 'loopKm');
  const k = MISCLOSURE_MM_PER_ROOT_KM[order];
  if (k === undefined) throw new EngineInputError('order', 'must be first, second or third');
  return k * Math.sqrt(loopKm);
}

/** Drop between two altitude fixes, m (GPS or any altimeter). */
export function altitudeFallM(startAltitudeM: number, endAltitudeM: number): number {
  return finite(startAltitudeM, 'startAltitudeM') - finite(endAltitudeM, 'endAltitudeM');
}

/** Barometric drop, m: hypsometric equation Δz = (R·T/g)·ln(p_end/p_start) (standard atmosphere). */
export function barometricFallM(startPressureHPa: number, endPressureHPa: number, airTemperatureC = 15): number {
  const p1 = positive(startPressureHPa, 'startPressureHPa');
  const p2 = positive(endPressureHPa, 'endPressureHPa');
  const t = inRange(airTemperatureC, 'airTemperatureC', -40, 60) + 273.15;
  // R_dry = 287.05 J/(kg·K), g = 9.80665 m/s²: scale height ≈ 8.43 km at 15 °C.
  return ((287.05 * t) / 9.80665) * Math.log(p2 / p1);
}
