import 'server-only';
import type { Model, ModelStatic } from 'sequelize';
import { Commissioning, DemandLine, FallReading, FlowMeasurement, Photo, PipeRun, Point, Visit, WaterSource } from '@/lib/server/db';
import { canonicalJson } from '@/lib/shared/canonical-json';
import type { SyncEntity } from '@/lib/shared/schemas/sync';

type Json = Record<string, unknown>;
/**
 * A synced row seen through its attributes (every synced model has these): a model instance
 * (visits, saved through their hooks) or a plain row (the push's and pull's other tables).
 */
export interface SyncedRow {
  id: string;
  rev: number;
  deletedAt: Date | null;
  updatedAt: Date;
  get(key: string): unknown;
  set(key: string | Json, value?: unknown): void;
}

const asObject = (value: unknown): Json => (value && typeof value === 'object' && !Array.isArray(value) ? (value as Json) : {});
const iso = (value: unknown) => (value instanceof Date ? value.toISOString() : value == null ? null : String(value));
const date = (value: unknown) => (typeof value === 'string' ? new Date(value) : null);

/**
 * How one protocol entity maps to its table: `toRow` turns protocol fields (a full set) into
 * column values, `toFields` turns a stored row back into protocol fields. The storage shapes of
 * flow measurements and fall readings are the ones loadSiteReadings reads (site-readings.ts).
 */
export interface EntitySpec {
  model: ModelStatic<Model>;
  /** The column that ties the row to its visit or farm; it never changes after creation. */
  parentKey: 'visitId' | 'farmId' | null;
  fields: readonly string[];
  toRow(fields: Json): Json;
  toFields(row: SyncedRow): Json;
}

/** Columns that hold a protocol field as is, except ISO date-times (Date columns). */
function plain(model: ModelStatic<Model>, parentKey: EntitySpec['parentKey'], fields: string[], dates: string[] = []): EntitySpec {
  return {
    model,
    parentKey,
    fields,
    toRow: (f) => Object.fromEntries(fields.map((k) => [k, dates.includes(k) ? date(f[k]) : f[k]])),
    toFields: (row) => Object.fromEntries(fields.map((k) => [k, dates.includes(k) ? iso(row.get(k)) : row.get(k)])),
  };
}

const flowMeasurement: EntitySpec = {
  model: FlowMeasurement,
  parentKey: 'visitId',
  fields: ['visitId', 'sourceId', 'takenAt', 'notes', 'measurement'],
  toRow(f) {
    const { method, season, ...readings } = asObject(f.measurement);
    return { visitId: f.visitId, sourceId: f.sourceId, takenAt: date(f.takenAt), notes: f.notes, method, season, readings };
  },
  toFields(row) {
    return {
      visitId: row.get('visitId'),
      sourceId: row.get('sourceId'),
      takenAt: iso(row.get('takenAt')),
      notes: row.get('notes'),
      measurement: { method: row.get('method'), season: row.get('season'), ...asObject(row.get('readings')) },
    };
  },
};

// A direct lift is stored as method 'direct' with bookings {staticLiftM, method: liftMethod, uncertaintyM};
// other runs as method = run.method and bookings = the rest of the run; bookedFrom rides in bookings.
const fallReading: EntitySpec = {
  model: FallReading,
  parentKey: 'visitId',
  fields: ['visitId', 'purpose', 'seq', 'takenAt', 'notes', 'bookedFrom', 'run'],
  toRow(f) {
    const { method, ...rest } = asObject(f.run);
    const booked = f.bookedFrom ? { bookedFrom: f.bookedFrom } : {};
    let bookings: Json;
    if (method === 'direct') {
      const { liftMethod, ...lift } = rest;
      bookings = { ...lift, method: liftMethod, ...booked };
    } else {
      bookings = { ...rest, ...booked };
    }
    return { visitId: f.visitId, purpose: f.purpose, seq: f.seq, takenAt: date(f.takenAt), notes: f.notes, method, bookings };
  },
  toFields(row) {
    const { bookedFrom = null, ...bookings } = asObject(row.get('bookings'));
    const method = row.get('method');
    let run: Json;
    if (method === 'direct') {
      const { method: liftMethod, ...lift } = bookings;
      run = { method, ...lift, liftMethod };
    } else {
      run = { method, ...bookings };
    }
    return {
      visitId: row.get('visitId'),
      purpose: row.get('purpose'),
      seq: row.get('seq'),
      takenAt: iso(row.get('takenAt')),
      notes: row.get('notes'),
      bookedFrom,
      run,
    };
  },
};

export const ENTITY_SPECS: Record<SyncEntity, EntitySpec> = {
  visit: plain(Visit, null, ['notes', 'status', 'visitedAt'], ['visitedAt']),
  waterSource: plain(WaterSource, 'visitId', ['visitId', 'name', 'kind', 'notes']),
  flowMeasurement,
  fallReading,
  point: plain(
    Point,
    'visitId',
    ['visitId', 'role', 'label', 'lat', 'lon', 'accuracyM', 'altitudeM', 'altitudeAccuracyM', 'chainageM', 'capturedAt', 'reducedLevelM', 'flags'],
    ['capturedAt'],
  ),
  photo: plain(Photo, 'visitId', ['visitId', 'pointId', 'caption', 'mime', 'bytes', 'sha256', 'width', 'height', 'lat', 'lon', 'takenAt'], ['takenAt']),
  demandLine: plain(DemandLine, 'farmId', ['farmId', 'kind', 'count', 'litresPerHeadPerDay', 'figureSource', 'note', 'confirmed']),
  pipeRun: plain(PipeRun, 'visitId', ['visitId', 'purpose', 'lengthM', 'diameterMm', 'material', 'pressureClass']),
  // Push-only and create-only: applied by applyCommissioningOp, never pulled.
  commissioning: plain(Commissioning, 'visitId', [
    'visitId',
    'driveLpm',
    'deliveredLpm',
    'beatsPerMinute',
    'liftM',
    'fallM',
    'drivePipeMaterial',
    'wasteValveStrokeMm',
    'notes',
  ]),
};

/** A row as the phone receives it: protocol fields plus id, rev and the soft-delete time. */
export function pulledRecord(spec: EntitySpec, row: SyncedRow): Json {
  return { id: row.id, rev: Number(row.rev), deletedAt: iso(row.deletedAt), updatedAt: iso(row.updatedAt), ...spec.toFields(row) };
}

const ISO_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

/** Deep equality of two field values; date-times compare as instants (…+02:00 equals …Z). */
export function sameValue(a: unknown, b: unknown): boolean {
  if (typeof a === 'string' && typeof b === 'string' && ISO_TIME.test(a) && ISO_TIME.test(b)) {
    return Date.parse(a) === Date.parse(b);
  }
  return canonicalJson(a) === canonicalJson(b);
}
