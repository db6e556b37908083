// The phone's own database (IndexedDB through Dexie): pulled visits and farms, everything
// captured, photo bytes, and the outbox of changes waiting for the server.
import Dexie, { type Table } from 'dexie';
import type { EntityFields, OpResult, SyncEntity, SyncOp } from '@/lib/shared/schemas/sync';
import type { SessionUser } from '@/lib/shared/domain';

/** A record as the phone holds it: the protocol's fields plus server revision and soft delete. */
export type LocalRecord<E extends SyncEntity> = EntityFields<E> & {
  id: string;
  /** Last server revision this copy is based on; 0 for a record made on the phone and not yet acknowledged. */
  rev: number;
  deletedAt: string | null;
  updatedAt: string;
};

export type LocalVisit = LocalRecord<'visit'> & { farmId: string; plannedOn: string | null; advisorId: string | null };
export interface LocalFarm {
  id: string;
  rev: number;
  name: string;
  area: string;
  lat: number | null;
  lon: number | null;
  notes: string;
  ownerName: string | null;
}

export type OutboxStatus = 'pending' | 'conflict' | 'rejected';

export interface OutboxEntry {
  seq?: number;
  opId: string;
  entity: SyncEntity;
  entityId: string;
  /** The visit the change belongs to (for per-visit counts); null for farm-level records. */
  visitId: string | null;
  status: OutboxStatus;
  attempts: number;
  nextAttemptAt: number;
  op: SyncOp;
  /** Server's answer when the op was parked (conflict or rejected). */
  result?: OpResult;
}

export interface PhotoBlob {
  id: string;
  /** Bytes as an ArrayBuffer plus MIME type: sturdier than Blob in some browsers' IndexedDB. */
  data: ArrayBuffer;
  mime: string;
  uploadedAt: string | null;
  attempts: number;
  nextAttemptAt: number;
  /** The server's last refusal (a 4xx with its message): shown on the sync page; the bytes stay. */
  lastError?: { status: number; message: string } | null;
}

export interface MetaEntry {
  key: string;
  value: unknown;
}

export type StoredUser = SessionUser;

export class FieldDatabase extends Dexie {
  visits!: Table<LocalVisit, string>;
  farms!: Table<LocalFarm, string>;
  waterSources!: Table<LocalRecord<'waterSource'>, string>;
  flowMeasurements!: Table<LocalRecord<'flowMeasurement'>, string>;
  fallReadings!: Table<LocalRecord<'fallReading'>, string>;
  points!: Table<LocalRecord<'point'>, string>;
  photos!: Table<LocalRecord<'photo'>, string>;
  demandLines!: Table<LocalRecord<'demandLine'>, string>;
  pipeRuns!: Table<LocalRecord<'pipeRun'>, string>;
  /** Commissioning checks recorded on this phone (sent through the outbox, never pulled back). */
  commissionings!: Table<LocalRecord<'commissioning'>, string>;
  photoBlobs!: Table<PhotoBlob, string>;
  outbox!: Table<OutboxEntry, number>;
  meta!: Table<MetaEntry, string>;

  constructor(name = 'fallbook-field') {
    super(name);
    // Keep every version: a phone may skip several releases between openings.
    this.version(1).stores({
      visits: 'id, farmId, plannedOn',
      farms: 'id',
      waterSources: 'id, visitId',
      flowMeasurements: 'id, visitId',
      fallReadings: 'id, visitId',
      points: 'id, visitId',
      photos: 'id, visitId',
      demandLines: 'id, farmId',
      pipeRuns: 'id, visitId',
      photoBlobs: 'id, uploadedAt',
      outbox: '++seq, &opId, entityId, visitId, status',
      meta: 'key',
    });
    this.version(2).stores({ commissionings: 'id, visitId' });
  }
}

/** Table of each synced entity (visits apart: they come from the office, the phone only edits notes/status). */
export const TABLE_OF: Record<SyncEntity, keyof FieldDatabase & string> = {
  visit: 'visits',
  waterSource: 'waterSources',
  flowMeasurement: 'flowMeasurements',
  fallReading: 'fallReadings',
  point: 'points',
  photo: 'photos',
  demandLine: 'demandLines',
  pipeRun: 'pipeRuns',
  commissioning: 'commissionings',
};

let database: FieldDatabase | undefined;

/** The one database of this page or worker. */
export function fieldDb(): FieldDatabase {
  database ??= new FieldDatabase();
  return database;
}

/** Swaps the database (tests use a fresh name each). */
export function setFieldDbForTests(db: FieldDatabase): void {
  database = db;
}
