// Limits on what one reading may hold, shared by the sync schemas and the forms (and meant for the
// engine's own input checks): what sync stores, the screen must be able to use. A field book never
// needs more than these; far more is a fault or an attack (150,000 trials is 3.9 MB of JSON, and
// Math.max over 120,000 values overflows the call stack).
import { PIPE_MATERIALS } from '@/lib/engine/materials';

/** Trials in one flow measurement (bucket fills, notch heads, weir heads, float runs). */
export const MAX_TRIALS = 100;
/** Stations in one level run (and in its return run). */
export const MAX_LEVEL_STATIONS = 500;
/** Steps of one hose-level run, legs of one clinometer run. */
export const MAX_RUN_STEPS = 500;
/** Runs in one lift booked as runs. */
export const MAX_LIFT_RUNS = 50;
/** What one visit's screening takes: flow measurements (so at most 20,000 trials in all), fall runs, demand lines. */
export const MAX_FLOW_MEASUREMENTS = 200;
export const MAX_FALL_RUNS = 100;
export const MAX_DEMAND_LINES = 200;

/** Every pressure class id the engine knows, for any material. */
export const PRESSURE_CLASS_IDS = [...new Set(Object.values(PIPE_MATERIALS).flatMap((m) => m.classes.map((c) => c.id)))] as [string, ...string[]];

/** Whether the class is one of the material's (an unknown material has none). */
export function isClassOf(material: string, classId: string): boolean {
  if (!Object.hasOwn(PIPE_MATERIALS, material)) return false;
  return PIPE_MATERIALS[material as keyof typeof PIPE_MATERIALS].classes.some((c) => c.id === classId);
}
