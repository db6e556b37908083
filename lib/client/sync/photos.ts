// Photo bytes go up one per request, after their metadata was acknowledged; the phone keeps them
// until the server has confirmed size and sha-256.
import { fieldDb, type PhotoBlob } from '../db';
import { waitingPhotoIds } from '../photo-queue';
import { backoffMs } from './backoff';
import { OfflineError, SyncHttpError } from './transport';

export type UploadProgress = (photoId: string, sentBytes: number, totalBytes: number) => void;

interface Answer {
  status: number;
  body: string;
}

/** The message of the server's JSON error ({ error: { message } }), or a plain fallback. */
export function refusalMessage(status: number, body: string): string {
  try {
    const message = (JSON.parse(body) as { error?: { message?: unknown } }).error?.message;
    if (typeof message === 'string' && message.trim() !== '') return message;
  } catch {
    // Not JSON (a proxy's page): fall through.
  }
  return `The server refused the photo (${status}).`;
}

/** XHR where there is one (page: upload progress), fetch in the service worker. */
function send(blob: PhotoBlob, onProgress?: UploadProgress): Promise<Answer> {
  if (typeof XMLHttpRequest !== 'undefined' && onProgress) {
    return new Promise((resolve, reject) => {
      const xhr = new XMLHttpRequest();
      xhr.open('PUT', `/api/photos/${blob.id}`);
      xhr.setRequestHeader('content-type', blob.mime);
      xhr.upload.onprogress = (e) => onProgress(blob.id, e.loaded, blob.data.byteLength);
      xhr.onload = () => resolve({ status: xhr.status, body: xhr.status >= 400 ? xhr.responseText : '' });
      xhr.onerror = () => reject(new OfflineError());
      xhr.send(blob.data);
    });
  }
  return fetch(`/api/photos/${blob.id}`, { method: 'PUT', headers: { 'content-type': blob.mime }, body: blob.data, credentials: 'same-origin' }).then(
    async (r) => ({ status: r.status, body: r.status >= 400 ? await r.text().catch(() => '') : '' }),
    () => {
      throw new OfflineError();
    },
  );
}

/**
 * Uploads every photo that is ready (every waiting one when `force`: the person pressed "Sync now",
 * which sends what waits out a retry delay, photos as well as changes); returns how many the server confirmed.
 */
export async function uploadPhotos(onProgress?: UploadProgress, force = false): Promise<number> {
  const db = fieldDb();
  let done = 0;
  const now = force ? Number.POSITIVE_INFINITY : Date.now();
  // One photo's bytes in memory at a time, read once: a day offline can leave dozens waiting.
  for (const id of await waitingPhotoIds(db)) {
    // The server must know the photo's metadata first: its op must have left the outbox.
    if ((await db.outbox.where('entityId').equals(id).count()) > 0) continue;
    const blob = await db.photoBlobs.get(id);
    if (!blob || blob.uploadedAt !== null || blob.nextAttemptAt > now) continue;
    const { status, body } = await send(blob, onProgress);
    if (status === 401) throw new SyncHttpError(401, 'Sign in again to send your photos.');
    if (status >= 200 && status < 300) {
      await db.photoBlobs.update(blob.id, { uploadedAt: new Date().toISOString(), lastError: null });
      done++;
    } else {
      const attempts = blob.attempts + 1;
      const temporary = status >= 500 || status === 429;
      // A refusal (4xx) is kept with its reason for the sync page; the bytes never leave the phone unsent.
      await db.photoBlobs.update(blob.id, {
        attempts,
        nextAttemptAt: Date.now() + backoffMs(attempts),
        ...(temporary ? {} : { lastError: { status, message: refusalMessage(status, body) } }),
      });
      if (temporary) throw new SyncHttpError(status, 'The server could not take the photo now.');
    }
  }
  return done;
}
