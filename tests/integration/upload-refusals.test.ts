// Uploads the server must refuse, beyond the ones in photos.test.ts: other non-images declared as
// JPEG (SVG with script, PDF, HTML, a ZIP), a pixel flood in a 300-byte JPEG, a HEIF/AVIF and a
// HEIC it cannot decode, random bytes. Each: a clear 4xx message, nothing stored, no audit line.
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { PUT as putPhoto } from '@/app/api/photos/[id]/route';
import { makeOrganisation, params } from './support/fixtures';
import { rawPut, sha256 } from './support/route-table';
import { expectNoPhotoStored } from './support/photos';
import { push, putOp } from './support/sync';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;
let refused = 0;

beforeAll(async () => {
  org = await makeOrganisation('upload');
});

/** Pushes metadata that matches the bytes exactly (so only the content can be refused), then PUTs them. */
async function uploadAsPhoto(bytes: Buffer, mime = 'image/jpeg') {
  const id = randomUUID();
  const { results } = await push(org.advisor, {
    ops: [
      putOp('photo', id, {
        visitId: org.visit.id,
        pointId: null,
        caption: 'upload.jpg',
        mime,
        bytes: bytes.length,
        sha256: sha256(bytes),
        width: null,
        height: null,
        lat: null,
        lon: null,
        takenAt: null,
      }),
    ],
  });
  expect(results[0]?.status).toBe('applied');
  const res = await putPhoto(await rawPut(`/api/photos/${id}`, org.advisor, bytes), params({ id }));
  return { id, status: res.status, message: ((await res.json()) as { error?: { message: string } }).error?.message ?? '' };
}

async function expectNothingStored(id: string) {
  await expectNoPhotoStored(id, org.visit.id);
  refused += 1;
}

/** A tiny JPEG whose frame header claims width × height (the pixels are never there). */
async function pixelFlood(width: number, height: number): Promise<Buffer> {
  const jpeg = Buffer.from(
    await sharp({ create: { width: 16, height: 16, channels: 3, background: '#777' } })
      .jpeg()
      .toBuffer(),
  );
  const sof = jpeg.indexOf(Buffer.from([0xff, 0xc0]));
  jpeg.writeUInt16BE(height, sof + 5);
  jpeg.writeUInt16BE(width, sof + 7);
  return jpeg;
}

describe('uploads that are not photos the server can read', () => {
  const notPhotos: [string, () => Buffer][] = [
    [
      'an SVG with a script',
      () => Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10" onload="alert(1)"><rect width="10" height="10"/></svg>'),
    ],
    ['a PDF', () => Buffer.from('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n')],
    ['an HTML page', () => Buffer.from('<!doctype html><script>fetch("/api/me")</script>')],
    ['a ZIP archive', () => Buffer.from('504b0304140000000000000000000000000000000000000000000000', 'hex')],
    ['a JPEG start marker and then text', () => Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.from('not really a photo at all')])],
  ];
  for (const [what, bytes] of notPhotos) {
    it(`${what}, named .jpg and declared image/jpeg: 415 or 422 with a plain message, nothing stored`, async () => {
      const { id, status, message } = await uploadAsPhoto(bytes());
      expect([415, 422]).toContain(status);
      expect(message).toMatch(/not a JPEG, PNG or WebP|damaged or incomplete/);
      await expectNothingStored(id);
    });
  }

  it('a pixel flood: a 300-byte JPEG that claims 65,000 × 65,000 pixels is refused before decoding', async () => {
    const flood = await pixelFlood(65_000, 65_000);
    expect(flood.length).toBeLessThan(1000);
    const { id, status, message } = await uploadAsPhoto(flood);
    expect(status).toBe(422);
    expect(message).toMatch(/65000 × 65000 pixels; photos may have at most 40 million/);
    await expectNothingStored(id);
  });

  it('a HEIF container (as an iPhone sends) is refused with advice to switch the camera to JPEG', async () => {
    const heif = await sharp({ create: { width: 64, height: 64, channels: 3, background: '#468' } })
      .heif({ compression: 'av1' })
      .toBuffer();
    const { id, status, message } = await uploadAsPhoto(heif);
    expect(status).toBe(415);
    expect(message).toMatch(/HEIC photos cannot be read here; set the camera to JPEG/);
    await expectNothingStored(id);
  });

  it('a HEIC (HEVC) file the server has no decoder for is refused with a plain message', async () => {
    // ftyp box naming the heic brand, then a meta box the server cannot decode.
    const ftyp = Buffer.concat([Buffer.from([0, 0, 0, 24]), Buffer.from('ftypheic'), Buffer.from([0, 0, 0, 0]), Buffer.from('mif1heic')]);
    const heic = Buffer.concat([ftyp, Buffer.from([0, 0, 0, 16]), Buffer.from('meta'), Buffer.alloc(8)]);
    const { id, status, message } = await uploadAsPhoto(heic, 'image/jpeg');
    expect(status).toBe(415);
    expect(message).toMatch(/HEIC photos cannot be read here|not a JPEG, PNG or WebP/);
    await expectNothingStored(id);
  });

  it('random bytes (seeded, 25 cases) are refused with 415 or 422, nothing stored', async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ minLength: 1, maxLength: 4096 }), async (bytes) => {
        const { id, status, message } = await uploadAsPhoto(Buffer.from(bytes));
        expect([415, 422], message).toContain(status);
        expect(message.length).toBeGreaterThan(10);
        await expectNothingStored(id);
      }),
      { seed: 20260607, numRuns: 25 },
    );
    console.log(`[uploads] ${refused} uploads refused, none stored`);
  });
});
