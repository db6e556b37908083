// The sync protocol between the phone's outbox and the server (push, pull, photo upload).
// One shape for the client that builds ops, the route that applies them and the tests.
import * as z from '@/lib/shared/zod';
import { DEMAND_CATALOGUE, type DemandKind } from '@/lib/engine/demand';
import { PIPE_MATERIALS, type PipeMaterialId } from '@/lib/engine/materials';
import { POINT_ROLES, type VisitStatus } from '../domain';
import { STATION_FLAGS } from '@/lib/engine/profile-pairs';
import { checkRunHeight, confirmedSchema, fallRunSchema, flowMeasurementSchema, LIFT_DIRECT_METHODS } from './site-readings';
import { isoDateTime, MAX_PHOTO_SIDE_PX } from './bounds';
import {
  isClassOf,
  MAX_DEMAND_COUNT,
  MAX_LIFT_M,
  MAX_LITRES_PER_HEAD,
  MAX_PIPE_BORE_MM,
  MAX_PIPE_LENGTH_M,
  PRESSURE_CLASS_IDS,
  MAX_PHOTO_BYTES,
  PHOTO_MIME_TYPES,
} from '../reading-limits';

// A UUID names the same thing in either case: kept in lower case, so an upper-cased copy of an op
// id is a replay and an upper-cased record id the same record.
const uuid = z
  .string()
  .uuid('Must be a UUID.')
  .transform((id) => id.toLowerCase());
const isoTime = isoDateTime;
const text = (max: number) => z.string().max(max, `At most ${max} characters.`);
const finite = z.number().finite('Must be a finite number.');
const keys = <K extends string>(record: Readonly<Record<K, unknown>>) => Object.keys(record) as [K, ...K[]];

export const MAX_OPS_PER_PUSH = 200;
/** A push body larger than this is refused (413) before it is parsed: 200 full ops fit well inside. */
export const MAX_PUSH_BYTES = 8 * 1024 * 1024;

/** A lift entered as one figure (e.g. read off a level run done another day). */
const directLiftRun = z.object({
  method: z.literal('direct'),
  staticLiftM: finite.positive('Height of the tank above the pump must be more than 0.').max(MAX_LIFT_M),
  liftMethod: z.enum(LIFT_DIRECT_METHODS),
  uncertaintyM: finite.positive().optional(),
  confirmed: confirmedSchema,
});

/** Writable fields of each synced entity, in SI. `put` sends a subset; a create sends them all. */
export const entityFields = {
  visit: z.object({
    notes: text(5000),
    status: z.enum(['scheduled', 'surveyed']),
    visitedAt: isoTime.nullable(),
  }),
  waterSource: z.object({
    visitId: uuid,
    name: text(160).min(1, 'Give the source a name.'),
    kind: z.enum(['spring', 'creek', 'stream', 'seep', 'pond', 'other']),
    notes: text(5000),
  }),
  flowMeasurement: z.object({
    visitId: uuid,
    sourceId: uuid.nullable(),
    takenAt: isoTime.nullable(),
    notes: text(5000),
    /** The method, season and raw trials, replaced as a whole. */
    measurement: flowMeasurementSchema,
  }),
  fallReading: z.object({
    visitId: uuid,
    purpose: z.enum(['fall', 'lift']),
    seq: z.number().int().min(0).max(10_000),
    takenAt: isoTime.nullable(),
    notes: text(5000),
    /** For lift runs: booked uphill from the pump or downhill from the tank. */
    bookedFrom: z.enum(['pump', 'tank']).nullable(),
    run: z.discriminatedUnion('method', [...fallRunSchema.options, directLiftRun]),
  }),
  point: z.object({
    visitId: uuid,
    role: z.enum(POINT_ROLES),
    label: text(120),
    lat: finite.min(-90).max(90).nullable(),
    lon: finite.min(-180).max(180).nullable(),
    accuracyM: finite.min(0).max(100_000).nullable(),
    altitudeM: finite.min(-500).max(9000).nullable(),
    altitudeAccuracyM: finite.min(0).max(100_000).nullable(),
    chainageM: finite.min(0).max(100_000).nullable(),
    capturedAt: isoTime.nullable(),
    /** Profile stations: levelled reduced level, m, and flags such as 'no-pump-site' (optional for older phones). */
    reducedLevelM: finite.min(-500).max(9000).nullable().optional(),
    flags: z.array(z.enum(STATION_FLAGS)).max(STATION_FLAGS.length).nullable().optional(),
  }),
  photo: z.object({
    visitId: uuid,
    pointId: uuid.nullable(),
    caption: text(300),
    mime: z.enum(PHOTO_MIME_TYPES, { message: 'Photos must be JPEG, PNG or WebP.' }),
    bytes: z
      .number()
      .int()
      .min(1)
      .max(MAX_PHOTO_BYTES, `Photos must be at most ${MAX_PHOTO_BYTES / 1024 / 1024} MB.`),
    sha256: z.string().regex(/^[0-9a-f]{64}$/, 'Must be a lower-case hex sha-256.'),
    width: z.number().int().positive().max(MAX_PHOTO_SIDE_PX, `At most ${MAX_PHOTO_SIDE_PX} pixels.`).nullable(),
    height: z.number().int().positive().max(MAX_PHOTO_SIDE_PX, `At most ${MAX_PHOTO_SIDE_PX} pixels.`).nullable(),
    lat: finite.min(-90).max(90).nullable(),
    lon: finite.min(-180).max(180).nullable(),
    takenAt: isoTime.nullable(),
  }),
  demandLine: z.object({
    farmId: uuid,
    kind: z.enum(keys<DemandKind>(DEMAND_CATALOGUE)),
    count: z.number().int().min(0).max(MAX_DEMAND_COUNT),
    litresPerHeadPerDay: finite.min(0).max(MAX_LITRES_PER_HEAD),
    figureSource: text(160),
    note: text(300),
    /** Unusual values the advisor confirmed; optional for older phones. */
    confirmed: confirmedSchema.nullable(),
  }),
  pipeRun: z.object({
    visitId: uuid,
    // 'feed': intake to an open stand pipe where the drive pipe starts (gentle creeks).
    purpose: z.enum(['drive', 'delivery', 'feed']),
    lengthM: finite.positive().max(MAX_PIPE_LENGTH_M).nullable(),
    diameterMm: finite.positive().max(MAX_PIPE_BORE_MM).nullable(),
    material: z.enum(keys<PipeMaterialId>(PIPE_MATERIALS)),
    pressureClass: z.enum(PRESSURE_CLASS_IDS, { message: 'Choose a pressure class from the list.' }).nullable(),
  }),
  /**
   * What an installed ram measured, recorded on the phone (often offline). Create-only: the server
   * checks it with commissioningInputSchema, runs the commissioning check and marks the visit commissioned.
   */
  commissioning: z.object({
    visitId: uuid,
    driveLpm: finite,
    deliveredLpm: finite,
    beatsPerMinute: finite,
    liftM: finite,
    /** Fall measured at installation; null: the screening's. */
    fallM: finite.nullable(),
    drivePipeMaterial: z.enum(keys<PipeMaterialId>(PIPE_MATERIALS)).nullable(),
    /** The waste valve's stroke as set, mm; null (or absent, from a phone that does not ask): not recorded. */
    wasteValveStrokeMm: finite.nullable().default(null),
    notes: text(5000),
  }),
} as const;

/**
 * A whole record as the phone saves it and the server stores it: the entity's fields plus the rules
 * across them (a fall runs downhill, a lift up; a pipe's class is one its material is made in).
 */
export const recordSchemas = {
  ...entityFields,
  fallReading: entityFields.fallReading.superRefine((r, ctx) =>
    checkRunHeight(r.run as Parameters<typeof checkRunHeight>[0], r.purpose, r.bookedFrom, ctx, ['run']),
  ),
  pipeRun: entityFields.pipeRun.refine((p) => p.pressureClass === null || isClassOf(p.material, p.pressureClass), {
    message: 'That pressure class is not one of this pipe material’s. Choose a class from the list.',
    path: ['pressureClass'],
  }),
} as const;

export type SyncEntity = keyof typeof entityFields;
/** Entities the phone sends but never pulls back (the server keeps its own result). */
export type PushOnlyEntity = 'commissioning';
/** Entities the pull returns besides visits. */
export type PulledEntity = Exclude<SyncEntity, 'visit' | PushOnlyEntity>;
export const SYNC_ENTITIES = Object.keys(entityFields) as SyncEntity[];
export type EntityFields<E extends SyncEntity> = z.infer<(typeof entityFields)[E]>;

function opSchema<E extends SyncEntity, F extends z.ZodObject<z.ZodRawShape>>(entity: E, fields: F) {
  return z.object({
    opId: uuid,
    entity: z.literal(entity),
    entityId: uuid,
    action: z.enum(['put', 'delete']),
    /** The server revision the phone's copy was made against; null when the phone created it. */
    baseRev: z.number().int().min(0).nullable(),
    /** New values (put). A create carries every field. */
    changes: fields.partial().strict().optional(),
    /** The values the phone saw before its edit, for the per-field conflict check. */
    base: fields.partial().optional(),
    madeAt: isoTime,
  });
}

export const syncOpSchema = z.discriminatedUnion('entity', [
  opSchema('visit', entityFields.visit),
  opSchema('waterSource', entityFields.waterSource),
  opSchema('flowMeasurement', entityFields.flowMeasurement),
  opSchema('fallReading', entityFields.fallReading),
  opSchema('point', entityFields.point),
  opSchema('photo', entityFields.photo),
  opSchema('demandLine', entityFields.demandLine),
  opSchema('pipeRun', entityFields.pipeRun),
  opSchema('commissioning', entityFields.commissioning),
]);
export type SyncOp = z.infer<typeof syncOpSchema>;
export type SyncOpInput = z.input<typeof syncOpSchema>;

export const pushRequestSchema = z.object({
  ops: z.array(syncOpSchema).min(1, 'Send at least one op.').max(MAX_OPS_PER_PUSH, `At most ${MAX_OPS_PER_PUSH} ops per push.`),
});

/** Per-op outcome. `replayed`: the op id was applied before; its first outcome is returned. */
export const opResultSchema = z.object({
  opId: uuid,
  status: z.enum(['applied', 'replayed', 'conflict', 'rejected']),
  rev: z.number().int().nullable(),
  /** conflict: the fields that changed on the server meanwhile, and the server's copy. */
  conflict: z.object({ fields: z.array(z.string()), server: z.record(z.string(), z.unknown()).nullable() }).optional(),
  /** rejected: why (HTTP-like code and a plain message); the phone parks the op for the person. */
  error: z.object({ code: z.number().int(), message: z.string(), fieldErrors: z.record(z.string(), z.array(z.string())).optional() }).optional(),
});
export type OpResult = z.infer<typeof opResultSchema>;

export const pushResponseSchema = z.object({ results: z.array(opResultSchema) });

export const pullQuerySchema = z.object({
  cursor: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(2000).default(500),
});

/** A pulled record: the entity's fields plus id, rev and soft-delete time. */
export type PulledRecord<E extends SyncEntity> = EntityFields<E> & { id: string; rev: number; deletedAt: string | null; updatedAt: string };

export interface PullResponse {
  /** Pass back as ?cursor= next time. */
  cursor: number;
  /** More changes wait: pull again at once with the new cursor. */
  hasMore: boolean;
  /** Every visit currently assigned to (or visible by) the caller: the phone may drop others it holds. */
  visibleVisitIds: string[];
  farms: { id: string; rev: number; name: string; area: string; lat: number | null; lon: number | null; notes: string; ownerName: string | null }[];
  /** `status` is the visit's whole life (the phone may only write scheduled → surveyed). */
  visits: (Omit<PulledRecord<'visit'>, 'status'> & { status: VisitStatus; farmId: string; plannedOn: string | null; advisorId: string | null })[];
  records: { [E in PulledEntity]: PulledRecord<E>[] };
  /** Organisation settings the phone's live preview needs. */
  settings: { unitsDefault: 'metric' | 'us'; designFractionOfLowest: number; minProbabilityForGo?: number; demandFigures: Record<string, number> };
}
