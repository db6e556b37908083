// The named field queries: the frame's and the home's reads of the phone's database, a visit with its
// farm, and capture screens' records (the flow screen's source and measurements, the fall runs).
// Pages ask for them through useFieldQuery (with an argument where one is named); the field worker
// runs them (field-host.ts), so they are not read again on the page's main thread as the worker's
// sync writes, and a page without the worker runs them itself. Small records and counts from indexes only: never ops or
// photo bytes.
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

/** The visit and its farm (null when the phone does not hold the visit). */
export async function visitWithFarm(db: FieldDatabase, visitId: string) {
  const visit = await db.visits.get(visitId);
  if (!visit) return null;
  return { visit, farm: (await db.farms.get(visit.farmId)) ?? null };
}

/**
 * The visit's water source (the first not deleted). Before the phone's first sync run, none means
 * "not fetched yet" (as on the home): undefined, so the page waits rather than offer to name a source
 * that is on its way; null once a run has finished without one.
 */
export async function flowSource(db: FieldDatabase, visitId: string) {
  const found = (await db.waterSources.where('visitId').equals(visitId).toArray()).find((s) => !s.deletedAt);
  if (found) return found;
  return (await db.meta.get('lastRun')) === undefined ? undefined : null;
}

/** The visit's fall and lift runs, not deleted, in the order they were booked. */
export async function fallReadings(db: FieldDatabase, visitId: string) {
  return (await db.fallReadings.where('visitId').equals(visitId).toArray()).filter((r) => !r.deletedAt).sort((a, b) => a.seq - b.seq);
}

/** The visit's flow measurements, not deleted. */
export async function flowMeasurements(db: FieldDatabase, visitId: string) {
  return (await db.flowMeasurements.where('visitId').equals(visitId).toArray()).filter((m) => !m.deletedAt);
}

export const FRAME_QUERIES = { syncSummary, homeVisits, visitWithFarm, flowSource, flowMeasurements, fallReadings };
export type FrameQuery = keyof typeof FRAME_QUERIES;
/** What a query is asked about (a visit's id), or undefined for one that takes nothing. */
export type FrameArg<Q extends FrameQuery> = Parameters<(typeof FRAME_QUERIES)[Q]>[1];
export type FrameAnswer<Q extends FrameQuery> = Awaited<ReturnType<(typeof FRAME_QUERIES)[Q]>>;

/** Runs a named query on a database with its argument (where the worker runs it, and the page without one). */
export function runFrameQuery<Q extends FrameQuery>(db: FieldDatabase, query: Q, arg: FrameArg<Q>): Promise<FrameAnswer<Q>> {
  return (FRAME_QUERIES[query] as (db: FieldDatabase, arg: unknown) => Promise<FrameAnswer<Q>>)(db, arg);
}
