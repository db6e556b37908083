// Saving on the phone: each save writes the record and its outbox op in one transaction, so a
// change is never on the phone without being queued for the server, nor queued without being kept.
import type { Table } from 'dexie';
import type { UnitSystem } from '@/lib/shared/domain';
import type { EntityFields, SyncEntity, SyncOp } from '@/lib/shared/schemas/sync';
import { fieldDb, TABLE_OF, type LocalRecord, type OutboxEntry, type PhotoBlob } from './db';
import { newId } from './ids';
import { loadedRecordChecks, loadRecordChecks } from './load-record-checks';

export class QuotaError extends Error {
  constructor() {
    super('The phone is out of storage space for Fallbook. Free some space (old photos, other apps), then save again — nothing you saved before is lost.');
    this.name = 'QuotaError';
  }
}

function isQuotaError(error: unknown): boolean {
  const e = error as { name?: string; inner?: { name?: string } } | null;
  return e?.name === 'QuotaExceededError' || e?.inner?.name === 'QuotaExceededError';
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

function visitIdOf(entity: SyncEntity, record: Record<string, unknown>, id: string): string | null {
  if (entity === 'visit') return id;
  return typeof record.visitId === 'string' ? record.visitId : null;
}

type AnyRecord = LocalRecord<SyncEntity> & Record<string, unknown>;

/**
 * Saves fields of a record (creating it when new) and queues one op with only the fields that
 * changed, the values they had before (for the server's conflict check) and the base revision.
 * Returns the queued op, or null when nothing changed.
 */
export async function saveRecord<E extends SyncEntity>(
  entity: E,
  id: string,
  fields: Partial<EntityFields<E>>,
  units: UnitSystem = 'metric',
): Promise<SyncOp | null> {
  // Loaded before the transaction (or already, inside a caller's transaction): it must not wait on a fetch.
  const { checkRecord } = loadedRecordChecks() ?? (await loadRecordChecks());
  const db = fieldDb();
  const table = db.table(TABLE_OF[entity]) as Table<AnyRecord, string>;
  try {
    return await db.transaction('rw', table, db.outbox, async () => {
      const existing = await table.get(id);
      const now = new Date().toISOString();
      const changes: Record<string, unknown> = {};
      const base: Record<string, unknown> = {};
      for (const [key, value] of Object.entries(fields)) {
        if (value === undefined) continue;
        if (existing && same(existing[key], value)) continue;
        changes[key] = value;
        if (existing) base[key] = existing[key] ?? null;
      }
      if (existing && Object.keys(changes).length === 0) return null;
      const record = { ...(existing ?? { id, rev: 0, deletedAt: null }), ...changes, updatedAt: now } as AnyRecord;
      // The same rules the server applies: what it would refuse never enters the outbox.
      const refused = checkRecord(entity, entity === 'visit' ? changes : record, units);
      if (refused) throw refused;
      await table.put(record);
      const op = {
        opId: newId(),
        entity,
        entityId: id,
        action: 'put',
        madeAt: now,
        // A phone-made record not yet acknowledged has rev 0: later edits are updates on top of it.
        baseRev: existing ? existing.rev : null,
        changes,
        base,
      } as SyncOp;
      await db.outbox.add(entryFor(op, visitIdOf(entity, record, id)));
      return op;
    });
  } catch (error) {
    if (isQuotaError(error)) throw new QuotaError();
    throw error;
  }
}

/** Marks a record deleted on the phone and queues the delete (held back `holdMs`); the row goes once the server agrees. */
export async function deleteRecord(entity: SyncEntity, id: string, holdMs = 0): Promise<void> {
  const db = fieldDb();
  const table = db.table(TABLE_OF[entity]) as Table<AnyRecord, string>;
  await db.transaction('rw', table, db.outbox, async () => {
    const existing = await table.get(id);
    if (!existing || existing.deletedAt) return;
    const now = new Date().toISOString();
    await table.put({ ...existing, deletedAt: now, updatedAt: now });
    const op = { opId: newId(), entity, entityId: id, action: 'delete', baseRev: existing.rev, changes: {}, base: {}, madeAt: now } as SyncOp;
    // A delete that can still be undone waits out its window even if a sync runs meanwhile.
    await db.outbox.add({ ...entryFor(op, visitIdOf(entity, existing, id)), nextAttemptAt: holdMs > 0 ? Date.now() + holdMs : 0 });
  });
}

/**
 * Takes back a delete the server has not been sent yet: the delete leaves the outbox and the record
 * is shown again. False once the delete has gone (then the record is gone on the server too).
 */
export async function undoDelete(entity: SyncEntity, id: string): Promise<boolean> {
  const db = fieldDb();
  const table = db.table(TABLE_OF[entity]) as Table<AnyRecord, string>;
  return db.transaction('rw', table, db.outbox, async () => {
    const entries = await db.outbox.where('entityId').equals(id).toArray();
    const pending = entries.filter((e) => e.entity === entity && e.op.action === 'delete' && e.status === 'pending');
    const record = await table.get(id);
    if (pending.length === 0 || !record) return false;
    await db.outbox.bulkDelete(pending.map((e) => e.seq!));
    await table.put({ ...record, deletedAt: null, updatedAt: new Date().toISOString() });
    return true;
  });
}

/** Saves a photo's metadata (queued like any record) and its bytes (uploaded after the metadata). */
export async function savePhoto(id: string, fields: EntityFields<'photo'>, data: ArrayBuffer): Promise<void> {
  await loadRecordChecks();
  const db = fieldDb();
  try {
    await db.transaction('rw', db.photos, db.photoBlobs, db.outbox, async () => {
      const blob: PhotoBlob = { id, data, mime: fields.mime, uploadedAt: null, attempts: 0, nextAttemptAt: 0 };
      await db.photoBlobs.put(blob);
      await saveRecord('photo', id, fields);
    });
  } catch (error) {
    if (isQuotaError(error)) throw new QuotaError();
    throw error;
  }
}

function entryFor(op: SyncOp, visitId: string | null): OutboxEntry {
  return { opId: op.opId, entity: op.entity, entityId: op.entityId, visitId, status: 'pending', attempts: 0, nextAttemptAt: 0, op };
}
