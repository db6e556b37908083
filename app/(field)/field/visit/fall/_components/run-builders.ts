// Turns the rows typed on the fall page into a run of the shared schema, and computes the live
// result with the engine (the same code the server runs).
// The fall module itself, not the engine's index (which brings the shared schemas, and zod, with it).
import { altitudeFallM, barometricFallM, clinometerFallM, hoseLevelFallM, levelRun } from '@/lib/engine/fall';
import type { EntityFields } from '@/lib/shared/schemas/sync';
import type { Row } from './row-editor';

export type RunMethod = 'level' | 'hose' | 'clinometer' | 'gps' | 'barometric' | 'direct';
export type Run = EntityFields<'fallReading'>['run'];

const num = (v: number | undefined) => (v === undefined || !Number.isFinite(v) ? undefined : v);

/** Level book: first set-up backsight only, change points both, last station foresight only. */
export function levelRows(rows: Row[]) {
  return rows.map((r, i) => ({
    ...(i < rows.length - 1 ? { backsightM: num(r.backsightM) } : {}),
    ...(i > 0 ? { foresightM: num(r.foresightM) } : {}),
  }));
}

export function buildRun(method: RunMethod, rows: Row[], single: Row, liftMethod: 'level' | 'hose' | 'clinometer' | 'gps' | 'barometric' | 'map'): Run | null {
  const complete = (objs: Record<string, number | undefined>[]) => objs.every((o) => Object.values(o).every((v) => v !== undefined));
  if (method === 'level') {
    const book = levelRows(rows);
    return rows.length >= 2 && complete(book) ? { method, rows: book as { backsightM?: number; foresightM?: number }[] } : null;
  }
  if (method === 'hose') {
    const steps = rows.map((r) => ({ upperReadingM: num(r.upperReadingM), lowerReadingM: num(r.lowerReadingM) }));
    return steps.length && complete(steps) ? { method, steps: steps as { upperReadingM: number; lowerReadingM: number }[] } : null;
  }
  if (method === 'clinometer') {
    const legs = rows.map((r) => ({ slopeDistanceM: num(r.slopeDistanceM), angleBelowHorizontalDeg: num(r.angleBelowHorizontalDeg) }));
    return legs.length && complete(legs) ? { method, legs: legs as { slopeDistanceM: number; angleBelowHorizontalDeg: number }[] } : null;
  }
  if (method === 'gps') {
    const { startAltitudeM, endAltitudeM, horizontalAccuracyM } = single;
    return startAltitudeM !== undefined && endAltitudeM !== undefined && horizontalAccuracyM
      ? { method, startAltitudeM, endAltitudeM, horizontalAccuracyM }
      : null;
  }
  if (method === 'barometric') {
    const { startPressureHPa, endPressureHPa } = single;
    return startPressureHPa && endPressureHPa ? { method, startPressureHPa, endPressureHPa, airTemperatureC: 15, baseStationCorrected: false } : null;
  }
  return single.staticLiftM ? { method: 'direct', staticLiftM: single.staticLiftM, liftMethod } : null;
}

export interface LiveResult {
  dropM: number | null;
  levelsM: number[];
  checkOk: boolean | null;
  message: string | null;
}

/** The drop along the run so far (positive downhill), reduced levels and the booking check. */
export function liveResult(run: Run | null): LiveResult {
  if (!run) return { dropM: null, levelsM: [], checkOk: null, message: null };
  try {
    switch (run.method) {
      case 'level': {
        const r = levelRun(run.rows);
        return { dropM: r.fallM, levelsM: r.reducedLevelsM, checkOk: r.arithmeticCheckOk, message: null };
      }
      case 'hose': {
        const levels = run.steps.reduce<number[]>((acc, s) => [...acc, (acc[acc.length - 1] ?? 0) - (s.lowerReadingM - s.upperReadingM)], [0]);
        return { dropM: hoseLevelFallM(run.steps), levelsM: levels, checkOk: null, message: null };
      }
      case 'clinometer': {
        const levels = run.legs.reduce<number[]>((acc, l) => [...acc, (acc[acc.length - 1] ?? 0) - clinometerFallM([l])], [0]);
        return { dropM: clinometerFallM(run.legs), levelsM: levels, checkOk: null, message: null };
      }
      case 'gps':
        return {
          dropM: altitudeFallM(run.startAltitudeM, run.endAltitudeM),
          levelsM: [],
          checkOk: null,
          message: 'Rough: GPS heights can be off by several metres.',
        };
      case 'barometric':
        return {
          dropM: barometricFallM(run.startPressureHPa, run.endPressureHPa, run.airTemperatureC),
          levelsM: [],
          checkOk: null,
          message: 'Rough: weather moves the barometer by metres of height.',
        };
      default:
        return { dropM: null, levelsM: [], checkOk: null, message: null };
    }
  } catch (error) {
    return { dropM: null, levelsM: [], checkOk: null, message: error instanceof Error ? error.message : null };
  }
}
