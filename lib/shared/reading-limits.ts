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

// ---- What a reading can be (hard limits: beyond them a value is a slip, never a site) ----------
// Common practice, no source: a levelling staff extends to 5 m at most, a hose-level stake to 2–3 m;
// 6 m leaves room for any make.
export const MAX_STAFF_READING_M = 6;
/** One clinometer leg or float run is sighted or paced, not surveyed: 1 km is far beyond either. */
export const MAX_LEG_M = 1000;
/** The largest bucket or drum a flow is timed into (a 1,000 L bulk container; common practice, no source). */
export const MAX_BUCKET_L = 1000;
/** A timed fill or float run over an hour is not a trial (common practice, no source). */
export const MAX_TRIAL_SECONDS = 3600;
/** Head on a V-notch: a notch plate deeper than 1 m is not a field weir (common practice, no source). */
export const MAX_NOTCH_HEAD_M = 1;
/** Head and crest of a rectangular weir built in a creek (common practice, no source). */
export const MAX_WEIR_HEAD_M = 2;
export const MAX_WEIR_CREST_M = 20;
/** Cross-section of a creek gauged with a float (100 m² is a river; common practice, no source). */
export const MAX_SECTION_M2 = 100;
/**
 * Fall from the intake to the ram. Ram makers list working falls up to about 100 m for their
 * heaviest models (from memory); 150 m leaves margin and still refuses a slipped decimal point.
 */
export const MAX_FALL_M = 150;
/** Lift to the tank: the highest lifts makers list are about 250 m (from memory); 500 m refuses a slip. */
export const MAX_LIFT_M = 500;
/** Head of people or animals on one demand line, and square metres of garden. */
export const MAX_DEMAND_COUNT = 100_000;
/** Litres per head (or per m²) per day: a dairy cow drinks up to about 150 L (from memory); 2,000 refuses a slip. */
export const MAX_LITRES_PER_HEAD = 2000;
/** Bore of a drive, feed or delivery pipe: 600 mm (24″) is twice the largest ram drive (12″). */
export const MAX_PIPE_BORE_MM = 600;
/** A waste valve's stroke: usually 10–25 mm (common practice, no source); 100 mm refuses a slip. */
export const MAX_WASTE_VALVE_STROKE_MM = 100;
/** Length of one pipe run (20 km; common practice, no source). */
export const MAX_PIPE_LENGTH_M = 20_000;

// ---- What a reading usually is (asked "is this right?" beyond these; saved once confirmed) -----
/** Falls above 30 m are rare for a ram (most work on 1–20 m; common practice, no source). */
export const UNUSUAL_FALL_M = 30;
/** Lifts above 250 m are past what makers list (from memory). */
export const UNUSUAL_LIFT_M = 250;
/** More than 200 people on one small-farm supply is a village, not a farm (common practice, no source). */
export const UNUSUAL_PEOPLE = 200;
/** More than 2,000 head of one kind on one small farm (common practice, no source). */
export const UNUSUAL_HEAD = 2000;
/**
 * A 90° V-notch's calibrated range: heads of 0.06–0.38 m (0.2–1.25 ft) for a fully contracted notch
 * (US Bureau of Reclamation, Water Measurement Manual, ch. 7 — from memory). Outside it the formula
 * is an extrapolation.
 */
export const NOTCH_HEAD_RANGE_M = [0.06, 0.38] as const;
/** Trials of one measurement that differ tenfold are a slip or a changed creek (common practice, no source). */
export const UNUSUAL_TRIAL_RATIO = 10;

/** The largest photo a phone may send (bytes), and the formats it may be in. */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
export const PHOTO_MIME_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
