import { createHash, randomUUID } from 'node:crypto';
import exifr from 'exifr';
import { NextRequest } from 'next/server';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { GET as getOriginal, PUT as putPhoto } from '@/app/api/photos/[id]/route';
import { GET as getThumbnail } from '@/app/api/photos/[id]/thumbnail/route';
import { AuditEntry, Photo } from '@/lib/server/db';
import { MAX_PHOTO_BYTES } from '@/lib/shared/reading-limits';
import { makeOrganisation, params, request, sessionCookie, type TestUser } from './support/fixtures';
import { expectNoPhotoStored } from './support/photos';
import { push, putOp } from './support/sync';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;
let gpsJpeg: Buffer;

beforeAll(async () => {
  org = await makeOrganisation('photo');
  // A camera-like JPEG: 1600 × 1200, EXIF with GPS and orientation 6 (shown upright as 1200 × 1600).
  gpsJpeg = await sharp({ create: { width: 1600, height: 1200, channels: 3, background: '#6b8f5a' } })
    .jpeg()
    .withMetadata({ orientation: 6 })
    .withExif({
      IFD0: { Make: 'Fieldcam' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '52/1 25/1 930/100', GPSLongitudeRef: 'W', GPSLongitude: '3/1 37/1 120/100' },
    })
    .toBuffer();
});

const sha = (data: Buffer) => createHash('sha256').update(data).digest('hex');

/** Pushes the photo's metadata as the phone would (sha and size of `declared`), returns its id. */
async function pushPhoto(declared: Buffer, mime = 'image/jpeg', user: TestUser = org.advisor, visitId = org.visit.id) {
  const id = randomUUID();
  const { results } = await push(user, {
    ops: [
      putOp('photo', id, {
        visitId,
        pointId: null,
        caption: 'Intake pool',
        mime,
        bytes: declared.length,
        sha256: sha(declared),
        width: null,
        height: null,
        lat: null,
        lon: null,
        takenAt: null,
      }),
    ],
  });
  expect(results[0]?.status).toBe('applied');
  return id;
}

async function upload(id: string, body: Buffer, user: TestUser = org.advisor) {
  const req = new NextRequest(new URL(`/api/photos/${id}`, 'http://127.0.0.1:3100'), {
    method: 'PUT',
    body: new Uint8Array(body),
    headers: { cookie: await sessionCookie(user), 'content-type': 'application/octet-stream' },
  });
  const res = await putPhoto(req, params({ id }));
  return { status: res.status, json: await res.json() };
}

const expectNothingStored = (id: string) => expectNoPhotoStored(id, org.visit.id);

describe('PUT /api/photos/:id', () => {
  it('stores the original and an upright thumbnail ≤ 480 px with no GPS; a second PUT changes nothing', async () => {
    const id = await pushPhoto(gpsJpeg);
    const first = await upload(id, gpsJpeg);
    expect(first.status).toBe(200);
    expect(first.json.photo).toMatchObject({ stored: true, width: 1200, height: 1600 });
    const row = await Photo.findByPk(id, { rejectOnEmpty: true });
    expect(row.storageKey).toBe(`photos/${org.visit.id}/${id}.jpg`);
    expect(row.uploadedAt).not.toBeNull();
    const rev = row.rev;

    const original = await getOriginal(await request(`/api/photos/${id}`, org.coordinator), params({ id }));
    expect(original.status).toBe(200);
    expect(original.headers.get('content-type')).toBe('image/jpeg');
    const originalBytes = Buffer.from(await original.arrayBuffer());
    expect(sha(originalBytes)).toBe(sha(gpsJpeg));
    expect((await exifr.gps(originalBytes))?.latitude).toBeCloseTo(52.419, 2);

    const thumb = await getThumbnail(await request(`/api/photos/${id}/thumbnail`, org.farmer), params({ id }));
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/jpeg');
    const thumbBytes = Buffer.from(await thumb.arrayBuffer());
    const meta = await sharp(thumbBytes).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['jpeg', 360, 480]);
    expect(meta.exif).toBeUndefined();
    expect(await exifr.gps(thumbBytes)).toBeUndefined();

    const again = await upload(id, gpsJpeg);
    expect(again.status).toBe(200);
    expect(again.json.photo.stored).toBe(false);
    expect((await Photo.findByPk(id, { rejectOnEmpty: true })).rev).toBe(rev);
    expect(await AuditEntry.count({ where: { entityId: id, action: 'uploaded' } })).toBe(1);
  });

  it('originals are for staff: a farmer gets 403 on the original but may see the thumbnail', async () => {
    const id = await pushPhoto(gpsJpeg);
    await upload(id, gpsJpeg);
    expect((await getOriginal(await request(`/api/photos/${id}`, org.farmer), params({ id }))).status).toBe(403);
    expect((await getOriginal(await request(`/api/photos/${id}`, org.otherAdvisor), params({ id }))).status).toBe(404);
    expect((await getThumbnail(await request(`/api/photos/${id}/thumbnail`, org.otherFarmer), params({ id }))).status).toBe(404);
  });

  it('a sha mismatch or a short body: 422 "did not arrive whole", nothing stored', async () => {
    const id = await pushPhoto(gpsJpeg);
    const altered = Buffer.from(gpsJpeg);
    altered.writeUInt8((altered.readUInt8(altered.length - 10) + 1) % 256, altered.length - 10);
    const res = await upload(id, altered);
    expect(res.status).toBe(422);
    expect(res.json.error.message).toMatch(/did not arrive whole — it will be sent again/);
    expect((await upload(id, gpsJpeg.subarray(0, 1000))).status).toBe(422);
    await expectNothingStored(id);
  });

  it('a non-image is refused with 415 and a plain message, nothing stored', async () => {
    const text = Buffer.from('these are field notes, not a photo\n'.repeat(20));
    const id = await pushPhoto(text);
    const res = await upload(id, text);
    expect(res.status).toBe(415);
    expect(res.json.error.message).toMatch(/not a JPEG, PNG or WebP/);
    await expectNothingStored(id);
  });

  it('a truncated JPEG (declared as such) is refused as damaged, nothing stored', async () => {
    const truncated = gpsJpeg.subarray(0, Math.floor(gpsJpeg.length / 2));
    const id = await pushPhoto(truncated);
    const res = await upload(id, truncated);
    expect(res.status).toBe(422);
    expect(res.json.error.message).toMatch(/damaged or incomplete/);
    await expectNothingStored(id);
  });

  it('a decompression bomb (a small PNG of 100 Mpx) is refused, nothing stored', async () => {
    const bomb = await sharp({ create: { width: 10000, height: 10000, channels: 3, background: '#fff' } })
      .png()
      .toBuffer();
    expect(bomb.length).toBeLessThan(2 * 1024 * 1024);
    const id = await pushPhoto(bomb, 'image/png');
    const res = await upload(id, bomb);
    expect(res.status).toBe(422);
    expect(res.json.error.message).toMatch(/10000 × 10000 pixels/);
    await expectNothingStored(id);
  });

  it('a body over the limit is a 413, nothing stored', async () => {
    const id = await pushPhoto(gpsJpeg);
    const res = await upload(id, Buffer.alloc(MAX_PHOTO_BYTES + 1, 1));
    expect(res.status).toBe(413);
    expect(res.json.error.message).toMatch(/larger than 15 MB/);
    await expectNothingStored(id);
  });

  it("unknown photos are 404, and so is another advisor's photo; a farmer cannot upload (403)", async () => {
    const missing = randomUUID();
    expect((await upload(missing, gpsJpeg)).status).toBe(404);
    const id = await pushPhoto(gpsJpeg);
    expect((await upload(id, gpsJpeg, org.otherAdvisor)).status).toBe(404);
    expect((await upload(id, gpsJpeg, org.farmer)).status).toBe(403);
    await expectNothingStored(id);
    expect((await getThumbnail(await request(`/api/photos/${id}/thumbnail`, org.advisor), params({ id }))).status).toBe(404);
  });
});
