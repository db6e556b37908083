// One sync run: push the outbox, upload photos, pull changes. The same module runs in the service
// worker (Background Sync) and in the page's field worker (or the page itself); a Web Lock makes sure only one runs at a
// time, whichever context it is in.
import { fieldDb, type MetaEntry } from '../db';
import { keepTilesForVisits } from '../offline-tiles';
import type { SyncRecord } from './meta';
import { uploadPhotos, type UploadProgress } from './photos';
import { pullAll } from './pull';
import { pushAll } from './push';
import { SYNC_NAME } from './sync-name';
import { OfflineError, SyncHttpError } from './transport';

export type SyncOutcome = SyncRecord | { skipped: 'busy' };

async function runOnce(onProgress?: UploadProgress, force = false): Promise<SyncRecord> {
  const record: SyncRecord = { at: new Date().toISOString(), ok: false, message: null, pushed: 0, pulled: 0, photos: 0 };
  // What the run leaves behind is written in one go at the end: each write wakes every open page's
  // live queries, so three separate writes would redraw the sync bar three times.
  const facts: MetaEntry[] = [];
  try {
    record.pushed = await pushAll(force);
    record.photos = await uploadPhotos(onProgress, force);
    record.pulled = await pullAll();
    // Photos whose metadata went up in this run.
    record.photos += await uploadPhotos(onProgress, force);
    record.ok = true;
    facts.push({ key: 'authPaused', value: false }, { key: 'lastSuccess', value: record.at });
  } catch (error) {
    if (error instanceof SyncHttpError && error.status === 401) {
      // Never drop anything: pause until the person signs in again.
      facts.push({ key: 'authPaused', value: true });
      record.message = 'Sign in again to send what is waiting. Nothing is lost.';
    } else if (error instanceof OfflineError) {
      record.message = 'No signal: everything stays on this phone and goes up when there is coverage.';
    } else {
      record.message = error instanceof Error ? error.message : 'Sync failed; it will try again.';
    }
  }
  await fieldDb().meta.bulkPut([...facts, { key: 'lastRun', value: record }]);
  return record;
}

/**
 * Runs a sync unless one is already running (here, in another tab or in the worker). `force`
 * (the person pressed "Sync now") also sends what waits out a retry delay.
 */
export async function runSync(onProgress?: UploadProgress, force = false): Promise<SyncOutcome> {
  const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined;
  if (!locks) {
    const record = await runOnce(onProgress, force);
    if (record.ok) void keepTilesForVisits();
    return record;
  }
  // A pressed button waits for a running sync to finish, then runs; automatic triggers skip.
  const outcome = await locks.request(SYNC_NAME, force ? {} : { ifAvailable: true }, async (lock) => (lock ? runOnce(onProgress, force) : null));
  // With a signal, the map around the phone's visits is kept for offline use; after the run, so the
  // outcome never waits on tiles.
  if (outcome?.ok) void keepTilesForVisits();
  return outcome ?? { skipped: 'busy' };
}
