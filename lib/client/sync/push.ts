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

/** Ops ready to go now, oldest first (leaving out `skip`: ops this run already deferred). */
export async function readyOps(limit: number, now = Date.now(), skip: ReadonlySet<number> = new Set()): Promise<OutboxEntry[]> {
  return fieldDb()
    .outbox.where('status')
    .equals('pending')
    .filter((e) => e.nextAttemptAt <= now && (e.seq === undefined || !skip.has(e.seq)))
    .limit(limit)
    .sortBy('seq');
}

async function postBatch(entries: OutboxEntry[]): Promise<OpResult[]> {
  const body = JSON.stringify({ ops: entries.map((e) => e.op) });
  const { results } = await requestJson<{ results: OpResult[] }>('/api/sync/push', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body,
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

// A whole batch refused for its content (422) or failing on the server (500) may be the fault of
// one op: the batch is split in halves until that op is alone, so the others are not held up.
const splits = (error: unknown) => error instanceof SyncHttpError && (error.status === 422 || error.status === 500);

interface SplitOutcome {
  acknowledged: number;
  deferred: OutboxEntry[];
  failure: unknown;
}

/**
 * Pushes everything ready (everything waiting when `force`, e.g. the "Sync now" button); returns how
 * many ops the server acknowledged. An op that alone fails on the server (500) waits with backoff
 * while the rest go on. Throws on 401, when offline, and when nothing got through because the
 * server kept failing.
 */
export async function pushAll(force = false): Promise<number> {
  let acknowledged = 0;
  const deferred = new Set<number>();
  let failure: unknown = null;
  for (;;) {
    const batch = await readyOps(PUSH_BATCH, force ? Number.POSITIVE_INFINITY : Date.now(), deferred);
    if (batch.length === 0) break;
    const outcome = await pushSplitting(batch);
    acknowledged += outcome.acknowledged;
    for (const e of outcome.deferred) if (e.seq !== undefined) deferred.add(e.seq);
    if (outcome.deferred.length > 0) failure = outcome.failure;
    // Not one op of the batch went through: the server is in trouble, not an op. Try later.
    if (outcome.deferred.length === batch.length) break;
  }
  if (failure && acknowledged === 0) throw failure;
  return acknowledged;
}

async function pushSplitting(entries: OutboxEntry[]): Promise<SplitOutcome> {
  try {
    const results = await postBatch(entries);
    await applyResults(entries, results);
    return { acknowledged: results.filter((r) => r.status === 'applied' || r.status === 'replayed').length, deferred: [], failure: null };
  } catch (error) {
    if (splits(error) && entries.length > 1) {
      const middle = Math.ceil(entries.length / 2);
      const first = await pushSplitting(entries.slice(0, middle));
      // Every op of a half of two or more failed one by one: the server, not an op, is failing.
      if (middle > 1 && first.deferred.length === middle) {
        await deferEntries(entries.slice(middle));
        return { acknowledged: first.acknowledged, deferred: entries, failure: first.failure };
      }
      const second = await pushSplitting(entries.slice(middle));
      return {
        acknowledged: first.acknowledged + second.acknowledged,
        deferred: [...first.deferred, ...second.deferred],
        failure: second.failure ?? first.failure,
      };
    }
    const one = entries[0];
    if (error instanceof SyncHttpError && error.status === 422 && entries.length === 1 && one?.seq !== undefined) {
      await fieldDb().outbox.update(one.seq, {
        status: 'rejected',
        result: { opId: one.opId, status: 'rejected', rev: null, error: { code: 422, message: error.message } },
      });
      return { acknowledged: 0, deferred: [], failure: null };
    }
    // No signal is not the server's fault: no backoff, the next trigger (e.g. `online`) retries.
    if (error instanceof OfflineError || (error instanceof SyncHttpError && error.status === 401)) throw error;
    await deferEntries(entries);
    return { acknowledged: 0, deferred: entries, failure: error };
  }
}
