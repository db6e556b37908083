// Pull: fetch what changed on the server since the cursor and merge it into the phone's database.
// A record with changes still waiting on the phone is left as the person edited it.
import type { Table } from 'dexie';
import type { PulledEntity, PullResponse } from '@/lib/shared/schemas/sync';
import { fieldDb, TABLE_OF } from '../db';
import { getMeta, setMeta } from './meta';
import { requestJson } from './transport';

const CHILD_ENTITIES: PulledEntity[] = ['waterSource', 'flowMeasurement', 'fallReading', 'point', 'photo', 'demandLine', 'pipeRun'];

type Row = { id: string; deletedAt?: string | null } & Record<string, unknown>;

/** Merges one pull page; exported for tests. */
export async function mergePull(page: PullResponse): Promise<void> {
  const db = fieldDb();
  const tables = CHILD_ENTITIES.map((e) => db.table(TABLE_OF[e]));
  await db.transaction('rw', [db.visits, db.farms, db.outbox, db.meta, db.photoBlobs, db.commissionings, ...tables], async () => {
    // From the outbox's indexes: the ops themselves (their changes) are not loaded.
    const waiting = new Set((await db.outbox.orderBy('entityId').keys()) as string[]);
    const waitingVisits = new Set((await db.outbox.orderBy('visitId').keys()) as string[]);
    // One bulk call per table, not one call per row: on a phone each call costs its own round of
    // promise work, and a first pull of a few hundred rows would hold the page for a long moment.
    // The last copy of an id in the page decides, as one call per row in order would.
    const merge = async (table: Table<Row, string>, rows: Row[]) => {
      const latest = new Map<string, Row>();
      for (const row of rows) if (!waiting.has(row.id)) latest.set(row.id, row);
      const gone = [...latest.values()].filter((row) => row.deletedAt).map((row) => row.id);
      const kept = [...latest.values()].filter((row) => !row.deletedAt);
      if (gone.length > 0) await table.bulkDelete(gone);
      if (kept.length > 0) await table.bulkPut(kept);
    };
    await merge(db.farms as unknown as Table<Row, string>, page.farms as unknown as Row[]);
    await merge(db.visits as unknown as Table<Row, string>, page.visits as unknown as Row[]);
    for (const entity of CHILD_ENTITIES) {
      await merge(db.table(TABLE_OF[entity]) as Table<Row, string>, page.records[entity] as unknown as Row[]);
    }
    // Visits reassigned away: forget them, unless the phone still holds changes for them.
    const visible = new Set(page.visibleVisitIds);
    for (const visit of await db.visits.toArray()) {
      if (visible.has(visit.id) || waitingVisits.has(visit.id)) continue;
      await db.visits.delete(visit.id);
      for (const entity of CHILD_ENTITIES) {
        if (entity === 'demandLine') continue;
        const table = db.table(TABLE_OF[entity]);
        const ids = (await table.where('visitId').equals(visit.id).primaryKeys()) as string[];
        await table.bulkDelete(ids);
        if (entity === 'photo') await db.photoBlobs.bulkDelete(ids);
      }
      // Checks recorded here (never pulled) go with the visit once nothing of it waits to be sent.
      await db.commissionings.where('visitId').equals(visit.id).delete();
    }
    await setMeta('settings', page.settings);
    await setMeta('cursor', page.cursor);
  });
}

/** Pulls until the server has nothing more; returns how many records arrived. */
export async function pullAll(): Promise<number> {
  let received = 0;
  for (let guard = 0; guard < 1000; guard++) {
    const cursor = (await getMeta<number>('cursor')) ?? 0;
    const page = await requestJson<PullResponse>(`/api/sync/pull?cursor=${cursor}&limit=500`);
    received += page.farms.length + page.visits.length + CHILD_ENTITIES.reduce((n, e) => n + page.records[e].length, 0);
    await mergePull(page);
    if (!page.hasMore) break;
  }
  return received;
}
