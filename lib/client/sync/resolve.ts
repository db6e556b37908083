// Deciding parked changes: a conflict (someone changed the same fields on the server) or a refusal.
import type { Table } from 'dexie';
import type { SyncOp } from '@/lib/shared/schemas/sync';
import { fieldDb, TABLE_OF } from '../db';
import { newId } from '../ids';

type AnyRecord = { id: string; rev: number } & Record<string, unknown>;

/**
 * Keep mine: re-queue my values on top of the server's revision (so they win knowingly).
 * Take theirs: put the server's values into the phone's copy and drop my change.
 */
export async function resolveConflict(seq: number, choice: 'mine' | 'theirs'): Promise<void> {
  const db = fieldDb();
  const entry = await db.outbox.get(seq);
  if (!entry || entry.status !== 'conflict') return;
  const server = (entry.result?.conflict?.server ?? {}) as Record<string, unknown>;
  const serverRev = typeof server.rev === 'number' ? server.rev : 0;
  const table = db.table(TABLE_OF[entry.entity]) as Table<AnyRecord, string>;
  await db.transaction('rw', db.outbox, table, async () => {
    await db.outbox.delete(seq);
    const local = await table.get(entry.entityId);
    if (choice === 'theirs') {
      if (local) await table.put({ ...local, ...server, id: entry.entityId, rev: serverRev });
      return;
    }
    if (local) await table.update(entry.entityId, { rev: serverRev });
    const changes = entry.op.changes ?? {};
    const base = Object.fromEntries(Object.keys(changes).map((k) => [k, server[k] ?? null]));
    const op = { ...entry.op, opId: newId(), baseRev: serverRev, base, madeAt: new Date().toISOString() } as SyncOp;
    await db.outbox.add({ ...entry, seq: undefined, opId: op.opId, op, status: 'pending', attempts: 0, nextAttemptAt: 0, result: undefined });
  });
}

/** Sends a refused change again (after the reason was fixed, e.g. the visit was reassigned back). */
export async function retryParked(seq: number): Promise<void> {
  await fieldDb().outbox.update(seq, { status: 'pending', attempts: 0, nextAttemptAt: 0, result: undefined });
}

/**
 * Gives up a refused change on purpose; the only way a change leaves the phone unsent. The phone's
 * copy goes back to what the server holds: a record the server never accepted is removed; an edit's
 * fields return to the values the phone had before it (`base`, the server's as far as the phone knew),
 * except where a later change still waiting rewrites them; a refused delete shows the record again.
 */
export async function discardParked(seq: number): Promise<void> {
  const db = fieldDb();
  const entry = await db.outbox.get(seq);
  if (!entry) return;
  await db.transaction('rw', db.outbox, db.table(TABLE_OF[entry.entity]), async () => {
    await db.outbox.delete(seq);
    const table = db.table(TABLE_OF[entry.entity]) as Table<AnyRecord, string>;
    const local = await table.get(entry.entityId);
    if (!local) return;
    const later = await db.outbox.where('entityId').equals(entry.entityId).toArray();
    if (local.rev === 0 && entry.op.baseRev === null) {
      if (later.length === 0) await table.delete(entry.entityId);
      return;
    }
    if (entry.op.action === 'delete') {
      await table.put({ ...local, deletedAt: null });
      return;
    }
    const rewritten = new Set(later.flatMap((e) => Object.keys(e.op.changes ?? {})));
    const restore = Object.fromEntries(Object.entries(entry.op.base ?? {}).filter(([k]) => !rewritten.has(k)));
    await table.put({ ...local, ...restore });
  });
}
