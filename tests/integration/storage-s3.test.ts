// The S3 driver against the fake S3 server the test set-up starts on loopback (s3rver), beside the
// local folder: the same photo goes through both with the same sha-256; the folder → bucket copy resumes.
import { createHash, randomUUID } from 'node:crypto';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { NextRequest } from 'next/server';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GET as getOriginal, PUT as putPhoto } from '@/app/api/photos/[id]/route';
import { GET as getThumbnail } from '@/app/api/photos/[id]/thumbnail/route';
import { Photo } from '@/lib/server/db';
import { s3SettingsFromEnv, setPhotoStorage, type BlobStorage } from '@/lib/server/storage';
import { copyPhotos } from '@/lib/server/storage/copy-photos';
import { localFolderStorage } from '@/lib/server/storage/local-folder';
import { s3Storage } from '@/lib/server/storage/s3';
import { makeOrganisation, params, request, sessionCookie } from './support/fixtures';
import { push, putOp } from './support/sync';

const sha = (data: Buffer) => createHash('sha256').update(data).digest('hex');

let org: Awaited<ReturnType<typeof makeOrganisation>>;
let folder: string;
let local: BlobStorage;
let bucket: BlobStorage;
const photos: Buffer[] = [];

beforeAll(async () => {
  org = await makeOrganisation('s3');
  folder = await mkdtemp(path.join(tmpdir(), 'fallbook-photos-'));
  local = localFolderStorage(folder);
  // A prefix per run, so reruns against the same fake server start empty.
  bucket = s3Storage({ ...s3SettingsFromEnv(), prefix: `run-${randomUUID().slice(0, 8)}/` });
  for (const colour of ['#6b8f5a', '#8a6d3b', '#3b5f8a']) {
    photos.push(
      await sharp({ create: { width: 900, height: 600, channels: 3, background: colour } })
        .jpeg({ quality: 90 })
        .toBuffer(),
    );
  }
});

afterAll(async () => {
  setPhotoStorage(undefined);
  await rm(folder, { recursive: true, force: true });
});

async function pushAndUpload(data: Buffer) {
  const id = randomUUID();
  const { results } = await push(org.advisor, {
    ops: [
      putOp('photo', id, {
        visitId: org.visit.id,
        pointId: null,
        caption: 'Spring box',
        mime: 'image/jpeg',
        bytes: data.length,
        sha256: sha(data),
        width: null,
        height: null,
        lat: null,
        lon: null,
        takenAt: null,
      }),
    ],
  });
  expect(results[0]?.status).toBe('applied');
  const res = await putPhoto(
    new NextRequest(new URL(`/api/photos/${id}`, 'http://127.0.0.1:3100'), {
      method: 'PUT',
      body: new Uint8Array(data),
      headers: { cookie: await sessionCookie(org.advisor), 'content-type': 'application/octet-stream' },
    }),
    params({ id }),
  );
  expect(res.status).toBe(200);
  return id;
}

async function download(id: string) {
  const res = await getOriginal(await request(`/api/photos/${id}`, org.coordinator), params({ id }));
  expect(res.status).toBe(200);
  return Buffer.from(await res.arrayBuffer());
}

describe('S3-compatible photo storage', () => {
  it('a blob round-trips through both drivers with the same sha-256; missing keys are null; remove removes', async () => {
    const data = photos[0] as Buffer;
    for (const store of [local, bucket]) {
      await store.put('photos/v/one.jpg', data, 'image/jpeg');
      expect(sha((await store.get('photos/v/one.jpg')) as Buffer)).toBe(sha(data));
      expect(await store.get('photos/v/none.jpg')).toBeNull();
      await store.remove('photos/v/one.jpg');
      expect(await store.get('photos/v/one.jpg')).toBeNull();
      await expect(store.put('../escape.jpg', data, 'image/jpeg')).rejects.toThrow(/unsafe storage key/);
    }
  });

  it('the photo routes upload and serve through either driver, the same bytes each way', async () => {
    const data = photos[1] as Buffer;
    const served: string[] = [];
    for (const store of [local, bucket]) {
      setPhotoStorage(store);
      const id = await pushAndUpload(data);
      const row = await Photo.findByPk(id, { rejectOnEmpty: true });
      // The bytes are in this store (and the thumbnail beside them), not only somewhere.
      expect(sha((await store.get(row.storageKey as string)) as Buffer)).toBe(sha(data));
      expect(await store.get((row.storageKey as string).replace('.jpg', '-thumb.jpg'))).not.toBeNull();
      served.push(sha(await download(id)));
      const thumb = await getThumbnail(await request(`/api/photos/${id}/thumbnail`, org.farmer), params({ id }));
      expect([thumb.status, (await sharp(Buffer.from(await thumb.arrayBuffer())).metadata()).width]).toEqual([200, 480]);
    }
    expect(served).toEqual([sha(data), sha(data)]);
  });

  it('storage:migrate copies folder → bucket, resumes where it stopped, verifies hashes, leaves bad files alone', async () => {
    setPhotoStorage(local);
    // A visit of its own, so only this test's photos are copied.
    org = await makeOrganisation('s3-migrate');
    const visitIds = [org.visit.id];
    const ids: string[] = [];
    for (const data of photos) ids.push(await pushAndUpload(data));
    const target = s3Storage({ ...s3SettingsFromEnv(), prefix: `migrate-${randomUUID().slice(0, 8)}/` });
    const stored = await Photo.findAll({ where: { id: ids } });
    const keyOf = new Map(stored.map((p) => [p.id, p.storageKey as string]));

    // The last photo (in id order) is damaged in the folder: it must be reported, not copied.
    const sorted = [...ids].sort();
    const damaged = keyOf.get(sorted[2] as string) as string;
    await writeFile(path.join(folder, damaged), Buffer.from('not the photo'));

    const first = await copyPhotos(local, target, { visitIds, limit: 1 });
    expect([first.photos, first.copied, first.present]).toEqual([1, 2, 0]);
    const second = await copyPhotos(local, target, { visitIds });
    expect([second.photos, second.copied, second.present]).toEqual([3, 3, 2]);
    expect(second.problems).toEqual([expect.stringContaining(`${damaged}: sha-256`)]);
    for (const id of sorted.slice(0, 2)) {
      const original = photos[ids.indexOf(id)] as Buffer;
      expect(sha((await target.get(keyOf.get(id) as string)) as Buffer)).toBe(sha(original));
    }
    expect(await target.get(damaged)).toBeNull();
    const third = await copyPhotos(local, target, { visitIds });
    expect([third.copied, third.present]).toEqual([0, 5]);
  });
});
