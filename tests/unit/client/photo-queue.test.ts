// The photo queue read by keys: what waits and what the server refused, without loading the bytes
// of photos already uploaded.
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { FieldDatabase, PhotoBlob } from '@/lib/client/db';
import { photoQueueCounts, waitingPhotoIds, waitingPhotos } from '@/lib/client/photo-queue';
import { freshDb } from './helpers';

let db: FieldDatabase;
beforeEach(() => {
  db = freshDb();
});

const blob = (n: number, extra: Partial<PhotoBlob> = {}): PhotoBlob => ({
  id: `66666666-6666-4666-8666-${String(n).padStart(12, '0')}`,
  data: new ArrayBuffer(8),
  mime: 'image/jpeg',
  uploadedAt: null,
  attempts: 0,
  nextAttemptAt: 0,
  ...extra,
});

describe('photo queue', () => {
  beforeEach(async () => {
    await db.photoBlobs.bulkPut([
      blob(1, { uploadedAt: '2026-08-01T10:00:00.000Z' }),
      blob(2),
      blob(3, { uploadedAt: '2026-08-01T11:00:00.000Z' }),
      blob(4, { lastError: { status: 413, message: 'Too large.' } }),
      blob(5, { uploadedAt: '2026-08-01T12:00:00.000Z' }),
    ]);
  });

  it('lists the photos not yet uploaded, in id order, from the keys alone', async () => {
    const get = vi.spyOn(db.photoBlobs, 'get');
    expect(await waitingPhotoIds(db)).toEqual([blob(2).id, blob(4).id]);
    expect(get).not.toHaveBeenCalled();
  });

  it('counts what waits and what was refused, reading only the waiting photos', async () => {
    const get = vi.spyOn(db.photoBlobs, 'get');
    expect(await photoQueueCounts(db)).toEqual({ waiting: 2, refused: 1 });
    expect(get.mock.calls.map(([id]) => id)).toEqual([blob(2).id, blob(4).id]);
  });

  it('loads the waiting photos that pass the filter, bytes and all', async () => {
    const refused = await waitingPhotos(db, (b) => !!b.lastError);
    expect(refused.map((b) => b.id)).toEqual([blob(4).id]);
    expect(refused[0]?.data.byteLength).toBe(8);
  });

  it('an upload takes the photo out of the queue', async () => {
    await db.photoBlobs.update(blob(2).id, { uploadedAt: '2026-08-02T09:00:00.000Z' });
    expect(await photoQueueCounts(db)).toEqual({ waiting: 1, refused: 1 });
  });
});
