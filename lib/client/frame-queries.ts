// The shared field queries: the frame's and home's reads of the phone's database, by name. Pages ask
// for them through useFieldQuery; the field worker runs them (field-host.ts), so those pages
// evaluate no Dexie at all, and a page without the worker runs them itself. Small summaries only:
// counts from indexes, never ops or photo bytes.
import type { FieldDatabase, LocalFarm, LocalVisit } from './db';
import { photoQueueCounts } from './photo-queue';
import type { SyncRecord } from './sync/meta';

/** What the sync bar shows: changes and photos waiting or parked, the last runs, a paused sync. */
export async function syncSummary(db: FieldDatabase) {
  const [waiting, changes, photos, facts] = await Promise.all([
    db.outbox.where('status').equals('pending').count(),
    db.outbox.count(),
    photoQueueCounts(db),
    db.meta.bulkGet(['lastSuccess', 'lastRun', 'authPaused']),
  ]);
  const [lastSuccess, lastRun, paused] = facts.map((f) => f?.value);
  return {
    waiting,
    parked: changes - waiting,
    photos: photos.waiting,
    refusedPhotos: photos.refused,
    lastSuccess: lastSuccess as string | undefined,
    lastRun: lastRun as SyncRecord | undefined,
    paused: (paused as boolean | undefined) ?? false,
  };
}

/** The home's list: the phone's visits by planned day with their farms and waiting changes. */
export async function homeVisits(db: FieldDatabase) {
  // Not orderBy('plannedOn'): an index leaves out the rows whose key is null, and a visit assigned
  // before its date is set must be on the list too. Dated ones first, by date; then the undated.
  const rows = (await db.visits.toArray()).sort((a, b) => (a.plannedOn ?? '9999').localeCompare(b.plannedOn ?? '9999'));
  // The visit of each change, from the indexes alone (no op is loaded), counted as the sync bar counts:
  // waiting to send, or parked for the person's decision.
  const pending = new Set(await db.outbox.where('status').equals('pending').primaryKeys());
  const waiting = new Map<string, number>();
  const parked = new Map<string, number>();
  await db.outbox.orderBy('visitId').eachKey((key, cursor) => {
    const counts = pending.has(cursor.primaryKey as number) ? waiting : parked;
    counts.set(key as string, (counts.get(key as string) ?? 0) + 1);
  });
  const farms = new Map((await db.farms.bulkGet(rows.map((v) => v.farmId))).flatMap((f) => (f ? [[f.id, f] as const] : [])));
  return {
    // Before the phone's first sync an empty list means "not fetched yet", not "none assigned".
    synced: (await db.meta.get('lastRun')) !== undefined,
    rows: rows.map((v): LocalVisit & { farm: LocalFarm | undefined; waiting: number; parked: number } => ({
      ...v,
      farm: farms.get(v.farmId),
      waiting: waiting.get(v.id) ?? 0,
      parked: parked.get(v.id) ?? 0,
    })),
  };
}

export const FRAME_QUERIES = { syncSummary, homeVisits };
export type FrameQuery = keyof typeof FRAME_QUERIES;
export type FrameAnswer<Q extends FrameQuery> = Awaited<ReturnType<(typeof FRAME_QUERIES)[Q]>>;
