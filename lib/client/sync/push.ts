// Push: send waiting outbox ops in order, in batches; acknowledge, park conflicts and refusals.
import type { OpResult } from '@/lib/shared/schemas/sync';
import { fieldDb, TABLE_OF, type OutboxEntry } from '../db';
import { backoffMs } from './backoff';
import { OfflineError, requestJson, SyncHttpError } from './transport';

export const PUSH_BATCH = 100;

/** Applies the server's per-op results to the phone: acknowledged ops leave the outbox. */
export async function applyResults(entries: OutboxEntry[], results: OpResult[]): Promise<void> {
  const db = fieldDb();
  const byOp = new Map(results.map((r) => [r.opId, r]));
  const tables = [...new Set(entries.map((e) => db.table(TABLE_OF[e.entity])))];
  await db.transaction('rw', [db.outbox, ...tables], async () => {
    for (const entry of entries) {
      const result = byOp.get(entry.opId);
      if (!result || entry.seq === undefined) continue;
      if (result.status === 'applied' || result.status === 'replayed') {
        await db.outbox.delete(entry.seq);
        const table = db.table(TABLE_OF[entry.entity]);
        const record = (await table.get(entry.entityId)) as { rev: number; deletedAt: string | null } | undefined;
        if (record && result.rev !== null && result.rev > record.rev) await table.update(entry.entityId, { rev: result.rev });
        // The server agreed to the delete and nothing else waits on the record: drop it now.
        if (record && entry.op.action === 'delete' && (await db.outbox.where('entityId').equals(entry.entityId).count()) === 0) {
          await table.delete(entry.entityId);
        }
      } else {
        await db.outbox.update(entry.seq, { status: result.status, result });
      }
    }
  });
}

/** Ops ready to go now, oldest first. */
export async function readyOps(limit: number, now = Date.now()): Promise<OutboxEntry[]> {
  return fieldDb().outbox.where('status').equals('pending').filter((e) => e.nextAttemptAt <= now).limit(limit).sortBy('seq');
}

async function postBatch(entries: OutboxEntry[]): Promise<OpResult[]> {
  const body = JSON.stringify({ ops: entries.map((e) => e.op) });
  const { results } = await requestJson<{ results: OpResult[] }>('/api/sync/push', {
    method: 'POST', headers: { 'content-type': 'application/json' }, body,
  });
  return results;
}

/** Marks entries to be tried again later (network or server trouble). */
export async function deferEntries(entries: OutboxEntry[], now = Date.now()): Promise<void> {
  const db = fieldDb();
  await db.transaction('rw', db.outbox, async () => {
    for (const e of entries) {
      if (e.seq === undefined) continue;
      const attempts = e.attempts + 1;
      await db.outbox.update(e.seq, { attempts, nextAttemptAt: now + backoffMs(attempts) });
    }
  });
}

/**
 * Pushes everything ready (everything waiting when `force`, e.g. the "Sync now" button); returns how
 * many ops the server acknowledged. Throws on 401 and when offline.
 */
export async function pushAll(force = false): Promise<number> {
  let acknowledged = 0;
  for (;;) {
    const batch = await readyOps(PUSH_BATCH, force ? Number.POSITIVE_INFINITY : Date.now());
    if (batch.length === 0) return acknowledged;
    try {
      const results = await postBatch(batch);
      await applyResults(batch, results);
      acknowledged += results.filter((r) => r.status === 'applied' || r.status === 'replayed').length;
    } catch (error) {
      if (error instanceof SyncHttpError && error.status === 422 && batch.length > 1) {
        // One malformed op must not hold up the rest: send them one by one to find it.
        for (const entry of batch) acknowledged += await pushSingle(entry);
        continue;
      }
      // No signal is not the server's fault: no backoff, the next trigger (e.g. `online`) retries.
      if (error instanceof OfflineError || (error instanceof SyncHttpError && error.status === 401)) throw error;
      await deferEntries(batch);
      throw error;
    }
  }
}

async function pushSingle(entry: OutboxEntry): Promise<number> {
  try {
    const results = await postBatch([entry]);
    await applyResults([entry], results);
    return results.filter((r) => r.status === 'applied' || r.status === 'replayed').length;
  } catch (error) {
    if (error instanceof SyncHttpError && error.status === 422 && entry.seq !== undefined) {
      await fieldDb().outbox.update(entry.seq, {
        status: 'rejected',
        result: { opId: entry.opId, status: 'rejected', rev: null, error: { code: 422, message: error.message } },
      });
      return 0;
    }
    throw error;
  }
}
