// The photo queue read by keys, never by loading every blob: each blob carries its photo's bytes
// (megabytes), and uploaded ones stay on the phone, so reading the whole table to count what waits
// would pull every photo ever taken into memory at each redraw of the sync bar.
import type { FieldDatabase, PhotoBlob } from './db';

/**
 * Ids of the photos not yet uploaded. IndexedDB leaves a record out of an index when the indexed
 * value is not a key (null is not), so the `uploadedAt` index holds exactly the uploaded photos.
 */
export async function waitingPhotoIds(db: FieldDatabase): Promise<string[]> {
  const [all, uploaded] = await Promise.all([db.photoBlobs.toCollection().primaryKeys(), db.photoBlobs.where('uploadedAt').aboveOrEqual('').primaryKeys()]);
  const sent = new Set(uploaded);
  return all.filter((id) => !sent.has(id));
}

/** The photos waiting to go up, read one by one (only they are loaded, bytes and all). */
export async function waitingPhotos(db: FieldDatabase, keep: (blob: PhotoBlob) => boolean = () => true): Promise<PhotoBlob[]> {
  const out: PhotoBlob[] = [];
  for (const id of await waitingPhotoIds(db)) {
    const blob = await db.photoBlobs.get(id);
    if (blob && blob.uploadedAt === null && keep(blob)) out.push(blob);
  }
  return out;
}

/** How many photos wait, and how many of them the server refused (a 4xx kept with its reason). */
export async function photoQueueCounts(db: FieldDatabase): Promise<{ waiting: number; refused: number }> {
  const ids = await waitingPhotoIds(db);
  if (ids.length === 0) return { waiting: 0, refused: 0 };
  let refused = 0;
  // Only the waiting ones, one at a time: usually none or a few.
  for (const id of ids) if ((await db.photoBlobs.get(id))?.lastError) refused += 1;
  return { waiting: ids.length, refused };
}
