// Raw readings of one site visit: the one shape the phone form, the sync route, the engine and the tests validate.
import * as z from '@/lib/shared/zod';
import { DEMAND_CATALOGUE, type DemandKind } from '@/lib/engine/demand';
import { DRIVE_LENGTH_RULES, RAM_SIZE_TABLE, type DriveLengthRuleId } from '@/lib/engine/drive-pipe';
import { MAX_RAMS } from '@/lib/engine/ram-plan';
import { PIPE_MATERIALS, type PipeMaterialId } from '@/lib/engine/materials';
import { EFFICIENCY_CURVES, type EfficiencyCurveId } from '@/lib/engine/ram';
import { TANK_RULES, type TankRuleId } from '@/lib/engine/tank';
import { estimateRun } from '@/lib/engine/readings';
import {
  isClassOf,
  MAX_BUCKET_L,
  MAX_DEMAND_COUNT,
  MAX_DEMAND_LINES,
  MAX_FALL_M,
  MAX_FALL_RUNS,
  MAX_FLOW_MEASUREMENTS,
  MAX_LEG_M,
  MAX_LEVEL_STATIONS,
  MAX_LIFT_M,
  MAX_LIFT_RUNS,
  MAX_LITRES_PER_HEAD,
  MAX_NOTCH_HEAD_M,
  MAX_PIPE_BORE_MM,
  MAX_PIPE_LENGTH_M,
  MAX_RUN_STEPS,
  MAX_SECTION_M2,
  MAX_STAFF_READING_M,
  MAX_TRIAL_SECONDS,
  MAX_TRIALS,
  MAX_WEIR_CREST_M,
  MAX_WEIR_HEAD_M,
} from '../reading-limits';

function keysOf<K extends string>(record: Readonly<Record<K, unknown>>): [K, ...K[]] {
  return Object.keys(record) as [K, ...K[]];
}

// The label's own words for a missing or non-numeric value; limits fall through to the shared mapping,
// which words them with the field's label in the reader's units.
const num = (label: string) =>
  z.number({ error: (issue) => (issue.code !== 'invalid_type' ? undefined : issue.input === undefined ? `${label} is needed` : `${label} must be a number`) });
const positive = (label: string) => num(label).positive(`${label} must be more than 0`);
const nonNegative = (label: string) => num(label).nonnegative(`${label} must not be negative`);
const between = (label: string, min: number, max: number) =>
  num(label).min(min, `${label} must be at least ${min}`).max(max, `${label} must be at most ${max}`);
const oneOf = <K extends string>(label: string, values: [K, ...K[]]) => z.enum(values, { error: `${label} must be one of: ${values.join(', ')}` });

const TOO_MANY_TRIALS = `At most ${MAX_TRIALS} trials in one measurement`;

/** Unusual values the advisor confirmed on the phone ("is this right?"), kept with the record. */
export const confirmedSchema = z.array(z.string().max(40)).max(20).optional();

// ---- Flow --------------------------------------------------------------------------------------
const flowCommon = {
  id: z.string().optional(),
  season: oneOf('Season', ['dry', 'wet', 'unknown']),
  takenAt: z.string().optional(),
  confirmed: confirmedSchema,
};

const volumetricMeasurement = z.object({
  ...flowCommon,
  method: z.literal('volumetric'),
  trials: z
    .array(z.object({ volumeL: positive('Bucket volume').max(MAX_BUCKET_L), seconds: positive('Seconds').max(MAX_TRIAL_SECONDS) }))
    .min(1, 'Add at least one trial')
    .max(MAX_TRIALS, TOO_MANY_TRIALS),
});

const vNotchMeasurement = z.object({
  ...flowCommon,
  method: z.literal('v-notch'),
  notchAngleDeg: between('Notch angle', 25, 100).default(90),
  trials: z
    .array(z.object({ headM: positive('Head over the notch').max(MAX_NOTCH_HEAD_M) }))
    .min(1, 'Add at least one trial')
    .max(MAX_TRIALS, TOO_MANY_TRIALS),
});

const weirTrial = z
  .object({ crestWidthM: positive('Crest width').max(MAX_WEIR_CREST_M), headM: positive('Head over the weir').max(MAX_WEIR_HEAD_M) })
  .refine((t) => t.crestWidthM > 0.2 * t.headM, { message: 'Crest width must be more than a fifth of the head', path: ['crestWidthM'] });

const weirMeasurement = z.object({
  ...flowCommon,
  method: z.literal('rectangular-weir'),
  trials: z.array(weirTrial).min(1, 'Add at least one trial').max(MAX_TRIALS, TOO_MANY_TRIALS),
});

const floatMeasurement = z.object({
  ...flowCommon,
  method: z.literal('float'),
  areaM2: positive('Cross-section area').max(MAX_SECTION_M2),
  coefficient: between('Float coefficient', 0.5, 1).default(0.85),
  trials: z
    .array(z.object({ distanceM: positive('Float run length').max(MAX_LEG_M), seconds: positive('Seconds').max(MAX_TRIAL_SECONDS) }))
    .min(1, 'Add at least one trial')
    .max(MAX_TRIALS, TOO_MANY_TRIALS),
});

export const flowMeasurementSchema = z.discriminatedUnion('method', [volumetricMeasurement, vNotchMeasurement, weirMeasurement, floatMeasurement], {
  error: 'Flow method must be volumetric, v-notch, rectangular-weir or float',
});

// ---- Fall and lift runs ------------------------------------------------------------------------
const staffReading = (label: string) => nonNegative(label).max(MAX_STAFF_READING_M);
const levelRow = z.object({ backsightM: staffReading('Backsight').optional(), foresightM: staffReading('Foresight').optional() });

function checkBooking(rows: readonly z.infer<typeof levelRow>[], key: string, ctx: z.RefinementCtx): void {
  const last = rows.length - 1;
  rows.forEach((row, i) => {
    const needsBs = i < last;
    const needsFs = i > 0;
    if (needsBs !== (row.backsightM !== undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: [key, i, 'backsightM'],
        message: needsBs ? 'This station needs a backsight' : 'The last station takes no backsight',
      });
    }
    if (needsFs !== (row.foresightM !== undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: [key, i, 'foresightM'],
        message: needsFs ? 'This station needs a foresight' : 'The first station takes no foresight',
      });
    }
  });
}

const levelRun = z
  .object({
    method: z.literal('level'),
    rows: z.array(levelRow).min(2, 'A level run needs at least two stations').max(MAX_LEVEL_STATIONS, `At most ${MAX_LEVEL_STATIONS} stations in one run`),
    /** Optional return run from the last station back to the first, for the misclosure check. */
    returnRows: z
      .array(levelRow)
      .min(2, 'A return run needs at least two stations')
      .max(MAX_LEVEL_STATIONS, `At most ${MAX_LEVEL_STATIONS} stations in one run`)
      .optional(),
    routeLengthM: positive('Route length').max(MAX_PIPE_LENGTH_M).optional(),
    confirmed: confirmedSchema,
  })
  .superRefine((run, ctx) => {
    checkBooking(run.rows, 'rows', ctx);
    if (run.returnRows) checkBooking(run.returnRows, 'returnRows', ctx);
  });

const hoseRun = z.object({
  method: z.literal('hose'),
  confirmed: confirmedSchema,
  steps: z
    .array(z.object({ upperReadingM: staffReading('Reading at the upper end'), lowerReadingM: staffReading('Reading at the lower end') }))
    .min(1, 'Add at least one hose step')
    .max(MAX_RUN_STEPS, `At most ${MAX_RUN_STEPS} steps in one run`),
});

const clinometerRun = z.object({
  method: z.literal('clinometer'),
  confirmed: confirmedSchema,
  legs: z
    .array(z.object({ slopeDistanceM: positive('Slope distance').max(MAX_LEG_M), angleBelowHorizontalDeg: between('Angle', -89, 89) }))
    .min(1, 'Add at least one leg')
    .max(MAX_RUN_STEPS, `At most ${MAX_RUN_STEPS} legs in one run`),
});

const gpsRun = z.object({
  method: z.literal('gps'),
  confirmed: confirmedSchema,
  startAltitudeM: between('Altitude at the start', -500, 9000),
  endAltitudeM: between('Altitude at the end', -500, 9000),
  horizontalAccuracyM: positive('Horizontal accuracy').max(1000),
  verticalAccuracyM: positive('Vertical accuracy').max(1000).optional(),
});

const barometricRun = z.object({
  method: z.literal('barometric'),
  confirmed: confirmedSchema,
  startPressureHPa: between('Start pressure', 300, 1100),
  endPressureHPa: between('End pressure', 300, 1100),
  airTemperatureC: between('Air temperature', -40, 60).default(15),
  baseStationCorrected: z.boolean().default(false),
});

export const fallRunSchema = z.discriminatedUnion('method', [levelRun, hoseRun, clinometerRun, gpsRun, barometricRun], {
  error: 'Fall method must be level, hose, clinometer, gps or barometric',
});

/** The height a run gives, positive downhill (null while its booking is incomplete). */
export function runDropM(run: FallRun): number | null {
  try {
    const drop = estimateRun(run, 0).dropM;
    return Number.isFinite(drop) ? drop : null;
  } catch {
    return null;
  }
}

/**
 * A fall must go down from the intake to the ram, a lift up from the ram to the tank, both within what a
 * ram can use. The issue carries the height in SI (`params`), so each reader sees it in their units.
 */
export function checkRunHeight(run: FallRun, purpose: 'fall' | 'lift', bookedFrom: 'pump' | 'tank' | null, ctx: z.RefinementCtx, path: PropertyKey[]): void {
  const drop = runDropM(run);
  if (drop === null) return;
  const heightM = purpose === 'fall' || bookedFrom === 'tank' ? drop : -drop;
  const maxM = purpose === 'fall' ? MAX_FALL_M : MAX_LIFT_M;
  // At the run's "result", never at the run itself: a message set on the run would hide those of its readings.
  const at = [...path, 'result'];
  if (heightM <= 0) ctx.addIssue({ code: 'custom', path: at, params: { kind: purpose === 'fall' ? 'uphill-fall' : 'downhill-lift', heightM: -heightM } });
  else if (heightM > maxM) ctx.addIssue({ code: 'custom', path: at, params: { kind: purpose === 'fall' ? 'fall-too-high' : 'lift-too-high', heightM, maxM } });
}

export const LIFT_DIRECT_METHODS = ['level', 'hose', 'clinometer', 'gps', 'barometric', 'map'] as const;

export const liftSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({
      kind: z.literal('runs'),
      /** Where the runs start: at the pump (booked uphill) or at the tank (booked downhill). */
      bookedFrom: oneOf('Booked from', ['pump', 'tank']),
      runs: z.array(fallRunSchema).min(1, 'Add at least one lift run').max(MAX_LIFT_RUNS, `At most ${MAX_LIFT_RUNS} lift runs`),
    }),
    z.object({
      kind: z.literal('direct'),
      staticLiftM: positive('Height of the tank above the pump').max(MAX_LIFT_M),
      method: oneOf('Lift method', [...LIFT_DIRECT_METHODS]),
      uncertaintyM: positive('Lift uncertainty').optional(),
      confirmed: confirmedSchema,
    }),
  ],
  { error: 'Lift must be given as runs or as a direct value' },
);

// ---- Pipes, demand, settings -------------------------------------------------------------------
const materialIds = keysOf<PipeMaterialId>(PIPE_MATERIALS);

const drivePipe = z
  .object({
    lengthM: positive('Drive pipe length').max(MAX_PIPE_LENGTH_M).optional(),
    diameterMm: positive('Drive pipe diameter').max(MAX_PIPE_BORE_MM).optional(),
    material: oneOf('Drive pipe material', materialIds).default('galvanized-steel'),
    pressureClass: z.string().optional(),
  })
  .refine((p) => p.pressureClass === undefined || isClassOf(p.material, p.pressureClass), {
    message: 'Drive pipe pressure class is not one of its material’s',
    path: ['pressureClass'],
  });

/** A feed pipe from the intake to an open stand pipe, where the drive pipe starts (gentle creeks). */
const feedPipe = z.object({
  lengthM: positive('Feed pipe length').max(MAX_PIPE_LENGTH_M),
  diameterMm: positive('Feed pipe diameter').max(MAX_PIPE_BORE_MM).optional(),
  material: oneOf('Feed pipe material', materialIds).default('hdpe'),
});

const deliveryPipe = z
  .object({
    lengthM: positive('Delivery pipe length').max(MAX_PIPE_LENGTH_M),
    diameterMm: positive('Delivery pipe diameter').max(MAX_PIPE_BORE_MM).optional(),
    material: oneOf('Delivery pipe material', materialIds).default('hdpe'),
    pressureClass: z.string().optional(),
  })
  .refine((p) => p.pressureClass === undefined || isClassOf(p.material, p.pressureClass), {
    message: 'Delivery pipe pressure class is not one of its material’s',
    path: ['pressureClass'],
  });

const demandKinds = keysOf<DemandKind>(DEMAND_CATALOGUE);

const demandLine = z.object({
  kind: oneOf('Demand kind', demandKinds),
  count: nonNegative('How many').max(MAX_DEMAND_COUNT),
  litresPerHeadPerDay: nonNegative('Water each per day').max(MAX_LITRES_PER_HEAD).optional(),
});

export const settingsSchema = z.object({
  /** Share of the lowest measured flow the ram may take (0.5, low end of 0.5–0.8: common practice). */
  designFractionOfLowest: between('Design fraction of the lowest flow', 0.05, 1).default(0.5),
  /** Largest share the organisation would ever take; sets what counts as "within reach". */
  maxDesignFractionOfLowest: between('Largest design fraction', 0.05, 1).default(0.8),
  efficiencyCurve: oneOf('Efficiency curve', keysOf<EfficiencyCurveId>(EFFICIENCY_CURVES)).default('building-trades-table'),
  demandMarginFraction: between('Demand margin', 0, 2).default(0.2),
  tankRule: oneOf('Tank rule', keysOf<TankRuleId>(TANK_RULES)).default('one-day'),
  driveLengthRule: oneOf('Drive length rule', keysOf<DriveLengthRuleId>(DRIVE_LENGTH_RULES)).default('perkin-3-7'),
  fittingsAllowanceFraction: between('Fittings allowance', 0, 1).default(0.25),
  /** Share of the daily demand drunk in the busiest hour (for the peak tank rule). */
  peakHourFraction: between('Peak hour share', 0.02, 1).default(0.1),
  demandOverrides: z.partialRecord(oneOf('Demand kind', demandKinds), nonNegative('Litres per head per day')).default({}),
  /** Least chance of meeting the demand for a plain go (0.8: common practice, no source). */
  minProbabilityForGo: between('Least chance of meeting demand for a go', 0.5, 0.99).default(0.8),
});

const RAM_SIZES_IN = RAM_SIZE_TABLE.map((r) => r.driveIn);

/** A ram size and count the advisor chose instead of the screen's own sizing from demand. */
const forcedRam = z.object({
  driveIn: num('Ram size').refine((v) => RAM_SIZES_IN.includes(v), { message: `Ram size must be one of ${RAM_SIZES_IN.join(', ')} inches` }),
  count: num('Number of rams')
    .int('Number of rams must be a whole number')
    .min(1, 'Number of rams must be at least 1')
    .max(MAX_RAMS, `Number of rams must be at most ${MAX_RAMS}`)
    .default(1),
});

export const monteCarloSchema = z.object({
  samples: num('Samples')
    .int('Samples must be a whole number')
    .min(100, 'Samples must be at least 100')
    .max(200000, 'Samples must be at most 200000')
    .default(10000),
  seed: num('Seed').int('Seed must be a whole number').default(1),
});

export const siteReadingsSchema = z.object({
  flowMeasurements: z
    .array(flowMeasurementSchema)
    .min(1, 'Add at least one flow measurement')
    .max(MAX_FLOW_MEASUREMENTS, `At most ${MAX_FLOW_MEASUREMENTS} flow measurements on one visit`),
  fallRuns: z
    .array(fallRunSchema)
    .min(1, 'Add at least one fall run')
    .max(MAX_FALL_RUNS, `At most ${MAX_FALL_RUNS} fall runs on one visit`)
    .superRefine((runs, ctx) => runs.forEach((run, i) => checkRunHeight(run, 'fall', null, ctx, [i]))),
  lift: liftSchema,
  drivePipe: drivePipe.prefault({}),
  feedPipe: feedPipe.optional(),
  deliveryPipe,
  demand: z.array(demandLine).min(1, 'Add at least one demand line').max(MAX_DEMAND_LINES, `At most ${MAX_DEMAND_LINES} demand lines`),
  ram: forcedRam.optional(),
  settings: settingsSchema.prefault({}),
  monteCarlo: monteCarloSchema.prefault({}),
});

/** Parsed readings (defaults filled in). */
export type SiteReadings = z.infer<typeof siteReadingsSchema>;
/** Readings as the phone sends them (defaults may be left out). */
export type SiteReadingsInput = z.input<typeof siteReadingsSchema>;
export type FlowMeasurement = z.infer<typeof flowMeasurementSchema>;
export type FallRun = z.infer<typeof fallRunSchema>;
export type LiftReadings = z.infer<typeof liftSchema>;
export type ScreenSettings = z.infer<typeof settingsSchema>;
