// Photo uploads stream to the store and downloads stream from it: a body is refused while it arrives
// (over the cap, or not a photo by its first bytes) without being read to the end; nothing is left in
// the staging folder (and what a crashed server left there is swept); putFile/open round-trip through both drivers; with S3_SIGNED_URLS the routes
// answer 302 to a presigned URL that fetches the same bytes, only after the access check, whose V4
// signature covers the key and lifetime, and that the store refuses once expired.
import { createHash, randomUUID } from 'node:crypto';
import { mkdir, mkdtemp, readdir, rm, utimes, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { NextRequest } from 'next/server';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GET as getOriginal, PUT as putPhoto } from '@/app/api/photos/[id]/route';
import { GET as getThumbnail } from '@/app/api/photos/[id]/thumbnail/route';
import { Photo } from '@/lib/server/db';
import { getPhotoStorage, s3SettingsFromEnv, setPhotoStorage, uploadStagingDir, type BlobStorage } from '@/lib/server/storage';
import { localFolderStorage } from '@/lib/server/storage/local-folder';
import { s3Storage } from '@/lib/server/storage/s3';
import { MAX_PHOTO_BYTES } from '@/lib/shared/reading-limits';
import { makeOrganisation, params, request, sessionCookie, type TestUser } from './support/fixtures';
import { presignedUrlIsValid } from './support/sigv4';
import { expectNoPhotoStored } from './support/photos';
import { push, putOp } from './support/sync';

const sha = (data: Buffer) => createHash('sha256').update(data).digest('hex');
const CHUNK = 64 * 1024;

let org: Awaited<ReturnType<typeof makeOrganisation>>;
let folder: string;
let jpeg: Buffer;

beforeAll(async () => {
  // The checks below count what is staged: start from an empty staging folder (the e2e fault runs
  // kill servers mid-upload, which leaves staged files behind in the test profile's own folder).
  await rm(uploadStagingDir(), { recursive: true, force: true });
  org = await makeOrganisation('stream');
  folder = await mkdtemp(path.join(tmpdir(), 'fallbook-stream-'));
  jpeg = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#7a6a4f' } })
    .jpeg({ quality: 90 })
    .toBuffer();
});

afterAll(async () => {
  setPhotoStorage(undefined);
  await rm(folder, { recursive: true, force: true });
});

async function pushPhoto(declared: { bytes: number; sha256: string }) {
  const id = randomUUID();
  const { results } = await push(org.advisor, {
    ops: [
      putOp('photo', id, {
        visitId: org.visit.id,
        pointId: null,
        caption: 'Weir',
        mime: 'image/jpeg',
        bytes: declared.bytes,
        sha256: declared.sha256,
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

/** A body that makes its bytes only when asked (no Content-Length): counts how many were pulled. */
function lazyBody(total: number, first: Buffer) {
  const counter = { pulled: 0, cancelled: false };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (counter.pulled >= total) return controller.close();
      const chunk = counter.pulled === 0 ? first : Buffer.alloc(Math.min(CHUNK, total - counter.pulled), 7);
      counter.pulled += chunk.length;
      controller.enqueue(new Uint8Array(chunk));
    },
    cancel() {
      counter.cancelled = true;
    },
  });
  return { stream, counter };
}

async function putStream(id: string, body: ReadableStream<Uint8Array> | Buffer, user: TestUser = org.advisor) {
  const req = new NextRequest(new URL(`/api/photos/${id}`, 'http://127.0.0.1:3100'), {
    method: 'PUT',
    body: body instanceof Buffer ? new Uint8Array(body) : body,
    duplex: 'half',
    headers: { cookie: await sessionCookie(user), 'content-type': 'application/octet-stream' },
  } as ConstructorParameters<typeof NextRequest>[1]);
  const res = await putPhoto(req, params({ id }));
  return { status: res.status, json: await res.json() };
}

const expectNothingStored = (id: string) => expectNoPhotoStored(id, org.visit.id);

const stagedFiles = async () => (await readdir(uploadStagingDir()).catch(() => [] as string[])).filter((f) => f.endsWith('.upload'));

describe('photo uploads stream', () => {
  it('staging files left by a crashed server (over an hour old) are swept; a recent one is left alone', async () => {
    const dir = uploadStagingDir();
    await mkdir(dir, { recursive: true });
    const stale = path.join(dir, `${randomUUID()}.upload`);
    const recent = path.join(dir, `${randomUUID()}.upload`);
    await writeFile(stale, 'half a photo');
    await writeFile(recent, 'an upload in progress elsewhere');
    const hoursAgo = new Date(Date.now() - 2 * 3600_000);
    await utimes(stale, hoursAgo, hoursAgo);
    const id = await pushPhoto({ bytes: jpeg.length, sha256: sha(jpeg) });
    try {
      expect((await putStream(id, Buffer.from('not a photo at all, just words'))).status).toBe(415);
      await expect.poll(async () => (await stagedFiles()).sort()).toEqual([path.basename(recent)]);
    } finally {
      await rm(recent, { force: true });
    }
  });

  it('a body with no Content-Length is cut off at the cap: 413 before the rest is read, nothing stored or staged', async () => {
    const id = await pushPhoto({ bytes: jpeg.length, sha256: sha(jpeg) });
    const total = MAX_PHOTO_BYTES * 4;
    const { stream, counter } = lazyBody(total, jpeg.subarray(0, CHUNK));
    const res = await putStream(id, stream);
    expect(res.status).toBe(413);
    expect(res.json.error.message).toMatch(/larger than 15 MB/);
    // Read up to the cap (plus the chunk that crossed it and what the stream had queued), not the 60 MB offered.
    expect(counter.pulled).toBeLessThan(MAX_PHOTO_BYTES + 4 * CHUNK);
    expect(counter.cancelled).toBe(true);
    await expectNothingStored(id);
    expect(await stagedFiles()).toEqual([]);
  });

  it('a body whose first bytes are not a photo is refused (415) after the first chunk, nothing stored or staged', async () => {
    const id = await pushPhoto({ bytes: 10 * 1024 * 1024, sha256: 'a'.repeat(64) });
    const { stream, counter } = lazyBody(
      10 * 1024 * 1024,
      Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'.padEnd(CHUNK, ' ')),
    );
    const res = await putStream(id, stream);
    expect(res.status).toBe(415);
    expect(res.json.error.message).toMatch(/not a JPEG, PNG or WebP/);
    expect(counter.pulled).toBeLessThan(8 * CHUNK);
    expect(counter.cancelled).toBe(true);
    await expectNothingStored(id);
    expect(await stagedFiles()).toEqual([]);
  });

  it('a HEIC is told apart by its first bytes; an empty body is "did not arrive whole"', async () => {
    const heicHead = Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from('ftypheic'), Buffer.alloc(200)]);
    const heic = await pushPhoto({ bytes: heicHead.length, sha256: sha(heicHead) });
    const refused = await putStream(heic, heicHead);
    expect([refused.status, refused.json.error.message]).toEqual([415, expect.stringMatching(/HEIC photos cannot be read here/)]);
    const empty = await pushPhoto({ bytes: jpeg.length, sha256: sha(jpeg) });
    const short = await putStream(empty, Buffer.alloc(0));
    expect([short.status, short.json.error.message]).toEqual([422, expect.stringMatching(/did not arrive whole/)]);
    await expectNothingStored(heic);
    await expectNothingStored(empty);
    expect(await stagedFiles()).toEqual([]);
  });

  it('a photo streamed in small chunks is stored whole (same sha-256) and the staging file is gone', async () => {
    const id = await pushPhoto({ bytes: jpeg.length, sha256: sha(jpeg) });
    let offset = 0;
    // Chunks of 7 bytes at first: the signature check must wait for enough bytes, not judge a fragment.
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (offset >= jpeg.length) return controller.close();
        const size = offset < 70 ? 7 : CHUNK;
        controller.enqueue(new Uint8Array(jpeg.subarray(offset, offset + size)));
        offset += size;
      },
    });
    const res = await putStream(id, stream);
    expect(res.status).toBe(200);
    expect(res.json.photo).toMatchObject({ stored: true, width: 1200, height: 900 });
    const row = await Photo.findByPk(id, { rejectOnEmpty: true });
    expect(sha((await getPhotoStorage().get(row.storageKey as string)) as Buffer)).toBe(sha(jpeg));
    expect(await stagedFiles()).toEqual([]);
  });

  it('when the store fails half-way (the thumbnail is refused), the original written before it is removed', async () => {
    const inner = localFolderStorage(path.join(folder, 'failing'));
    setPhotoStorage({
      ...inner,
      put: async () => {
        throw new Error('the store refused the thumbnail');
      },
    });
    const id = await pushPhoto({ bytes: jpeg.length, sha256: sha(jpeg) });
    const res = await putStream(id, jpeg);
    expect(res.status).toBe(500);
    expect(await inner.get(`photos/${org.visit.id}/${id}.jpg`)).toBeNull();
    const row = await Photo.findByPk(id, { rejectOnEmpty: true });
    expect([row.storageKey, row.uploadedAt]).toEqual([null, null]);
    expect(await stagedFiles()).toEqual([]);
    setPhotoStorage(undefined);
  });
});

describe('storage drivers: streamed put and open', () => {
  it('putFile and open round-trip through the folder and the bucket with the same sha-256', async () => {
    const source = path.join(folder, 'source.jpg');
    await writeFile(source, jpeg);
    const stores: BlobStorage[] = [
      localFolderStorage(path.join(folder, 'store')),
      s3Storage({ ...s3SettingsFromEnv(), prefix: `stream-${randomUUID().slice(0, 8)}/` }),
    ];
    for (const store of stores) {
      await store.putFile('photos/v/streamed.jpg', source, 'image/jpeg', sha(jpeg));
      const opened = await store.open('photos/v/streamed.jpg');
      expect(opened?.size).toBe(jpeg.length);
      expect(sha(Buffer.from(await new Response(opened?.body).arrayBuffer()))).toBe(sha(jpeg));
      expect(await store.open('photos/v/missing.jpg')).toBeNull();
      expect(store.signedUrl).toBeUndefined();
    }
  });
});

describe('downloads', () => {
  it('the local driver streams the original with its length', async () => {
    setPhotoStorage(localFolderStorage(path.join(folder, 'local')));
    const id = await pushPhoto({ bytes: jpeg.length, sha256: sha(jpeg) });
    expect((await putStream(id, jpeg)).status).toBe(200);
    const res = await getOriginal(await request(`/api/photos/${id}`, org.coordinator), params({ id }));
    expect([res.status, res.headers.get('content-length'), res.headers.get('content-type')]).toEqual([200, String(jpeg.length), 'image/jpeg']);
    expect(sha(Buffer.from(await res.arrayBuffer()))).toBe(sha(jpeg));
  });

  it('with signed URLs the routes check access, then answer 302 to a signed URL that fetches the same bytes and is refused once expired', async () => {
    const prefix = `signed-${randomUUID().slice(0, 8)}/`;
    setPhotoStorage(s3Storage({ ...s3SettingsFromEnv(), prefix, signedUrlSeconds: 3 }));
    const id = await pushPhoto({ bytes: jpeg.length, sha256: sha(jpeg) });
    expect((await putStream(id, jpeg)).status).toBe(200);

    // The access check comes first: a farmer may not have the original, another organisation nothing.
    expect((await getOriginal(await request(`/api/photos/${id}`, org.farmer), params({ id }))).status).toBe(403);
    expect((await getThumbnail(await request(`/api/photos/${id}/thumbnail`, org.otherFarmer), params({ id }))).status).toBe(404);

    const res = await getOriginal(await request(`/api/photos/${id}`, org.coordinator), params({ id }));
    expect([res.status, res.headers.get('cache-control')]).toEqual([302, 'private, no-store']);
    const url = new URL(res.headers.get('location') as string);
    expect(url.origin).toBe(new URL(process.env.S3_ENDPOINT as string).origin);
    expect(url.searchParams.get('X-Amz-Expires')).toBe('3');
    const fetched = await fetch(url);
    expect(fetched.status).toBe(200);
    expect(sha(Buffer.from(await fetched.arrayBuffer()))).toBe(sha(jpeg));

    const thumb = await getThumbnail(await request(`/api/photos/${id}/thumbnail`, org.farmer), params({ id }));
    expect(thumb.status).toBe(302);
    const thumbBytes = Buffer.from(await (await fetch(thumb.headers.get('location') as string)).arrayBuffer());
    expect((await sharp(thumbBytes).metadata()).width).toBe(480);

    // The signature is a valid V4 signature over this key and lifetime (checked here: s3rver does not),
    // so the thumbnail's URL pointed at the original, or a longer lifetime, no longer matches it.
    const secret = process.env.S3_SECRET_ACCESS_KEY as string;
    expect(presignedUrlIsValid(url.href, secret)).toBe(true);
    expect(presignedUrlIsValid(thumb.headers.get('location') as string, secret)).toBe(true);
    const tampered = new URL(thumb.headers.get('location') as string);
    tampered.pathname = url.pathname;
    expect(presignedUrlIsValid(tampered.href, secret)).toBe(false);
    const longer = new URL(url);
    longer.searchParams.set('X-Amz-Expires', '86400');
    expect(presignedUrlIsValid(longer.href, secret)).toBe(false);

    // X-Amz-Date is the signing time (whole seconds, UTC): wait until past its lifetime.
    const signedAt = Date.parse((url.searchParams.get('X-Amz-Date') as string).replace(/^(\d{4})(\d\d)(\d\d)T(\d\d)(\d\d)(\d\d)Z$/, '$1-$2-$3T$4:$5:$6Z'));
    await new Promise((r) => setTimeout(r, Math.max(0, signedAt + 4_100 - Date.now())));
    const late = await fetch(url);
    expect(late.status).toBe(403);
    expect(await late.text()).toMatch(/expired/i);
  });
});
