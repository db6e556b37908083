// Photo bytes go up one per request, after their metadata was acknowledged; the phone keeps them
// until the server has confirmed size and sha-256.
import { fieldDb, type PhotoBlob } from '../db';
import { backoffMs } from './backoff';
import { OfflineError, SyncHttpError } from './transport';

export type UploadProgress = (photoId: string, sentBytes: number, totalBytes: number) => void;

async function readyBlobs(now = Date.now()): Promise<PhotoBlob[]> {
  const db = fieldDb();
  const waiting = await db.photoBlobs.filter((b) => b.uploadedAt === null && b.nextAttemptAt <= now).toArray();
  const out: PhotoBlob[] = [];
  for (const blob of waiting) {
    // The server must know the photo's metadata first: its op must have left the outbox.
    const pending = await db.outbox.where('entityId').equals(blob.id).count();
    if (pending === 0) out.push(blob);
  }
  return out;
}

/** XHR where there is one (page: upload progress), fetch in the service worker. */
function send(blob: PhotoBlob, onProgress?: UploadProgress): Promise<number> {
  if (typeof XMLHttpRequest !== 'undefined' && onProgress) {
    return new Promise((resolve, reject) => {
      const xhr = new XMLHttpRequest();
      xhr.open('PUT', `/api/photos/${blob.id}`);
      xhr.setRequestHeader('content-type', blob.mime);
      xhr.upload.onprogress = (e) => onProgress(blob.id, e.loaded, blob.data.byteLength);
      xhr.onload = () => resolve(xhr.status);
      xhr.onerror = () => reject(new OfflineError());
      xhr.send(blob.data);
    });
  }
  return fetch(`/api/photos/${blob.id}`, { method: 'PUT', headers: { 'content-type': blob.mime }, body: blob.data, credentials: 'same-origin' })
    .then((r) => r.status, () => { throw new OfflineError(); });
}

/**
 * Uploads every photo that is ready (every waiting one when `force`: the person pressed "Sync now",
 * which sends what waits out a retry delay, photos as well as changes); returns how many the server confirmed.
 */
export async function uploadPhotos(onProgress?: UploadProgress, force = false): Promise<number> {
  const db = fieldDb();
  let done = 0;
  for (const blob of await readyBlobs(force ? Number.POSITIVE_INFINITY : Date.now())) {
    const status = await send(blob, onProgress);
    if (status === 401) throw new SyncHttpError(401, 'Sign in again to send your photos.');
    if (status >= 200 && status < 300) {
      await db.photoBlobs.update(blob.id, { uploadedAt: new Date().toISOString() });
      done++;
    } else {
      const attempts = blob.attempts + 1;
      await db.photoBlobs.update(blob.id, { attempts, nextAttemptAt: Date.now() + backoffMs(attempts) });
      if (status >= 500 || status === 429) throw new SyncHttpError(status, 'The server could not take the photo now.');
    }
  }
  return done;
}
