// The phone's own sync loop (lib/client/sync, Dexie on fake-indexeddb) against the real route
// handlers and MariaDB, through a network that fails: 200 ops and 20 photos captured offline, then
// synced while 30 % of requests fail at random (seeded): half never reach the server, half reach it
// and lose the answer. After: every record in MariaDB exactly once, photos match their sha-256, the
// outbox is empty.
import 'fake-indexeddb/auto';
import { createHash, randomUUID } from 'node:crypto';
import { NextRequest } from 'next/server';
import sharp from 'sharp';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { PUT as putPhoto } from '@/app/api/photos/[id]/route';
import { GET as pullRoute } from '@/app/api/sync/pull/route';
import { POST as pushRoute } from '@/app/api/sync/push/route';
import { FieldDatabase, setFieldDbForTests } from '@/lib/client/db';
import { savePhoto, saveRecord } from '@/lib/client/outbox';
import { runSync } from '@/lib/client/sync/runner';
import { AuditEntry, Photo, Point, SyncOp, WaterSource } from '@/lib/server/db';
import { getPhotoStorage } from '@/lib/server/storage';
import { makeOrganisation, params, sessionCookie, type TestUser } from './support/fixtures';
import { mulberry32 } from '@/lib/engine/random';

const SEEDS = [20260607, 20260608, 20260609];
const FAILURE_RATE = 0.3;

// The engine's seeded generator, so a failing run can be replayed exactly.
const seeded = mulberry32;

const faults = { requests: 0, lostBefore: 0, lostAfter: 0 };

/** fetch for the phone: the same-origin sync URLs go to the route handlers, some of them fail. */
function faultyNetwork(user: TestUser, random: () => number) {
  return async (url: string, init: RequestInit = {}): Promise<Response> => {
    faults.requests += 1;
    const roll = random();
    if (roll < FAILURE_RATE / 2) {
      faults.lostBefore += 1;
      throw new TypeError('Failed to fetch');
    }
    const headers = new Headers(init.headers);
    headers.set('cookie', await sessionCookie(user));
    headers.set('host', '127.0.0.1:3100');
    headers.set('origin', 'http://127.0.0.1:3100');
    const req = new NextRequest(new URL(url, 'http://127.0.0.1:3100'), { method: init.method ?? 'GET', headers, body: init.body as BodyInit | undefined });
    const path = req.nextUrl.pathname;
    const res =
      path === '/api/sync/push'
        ? await pushRoute(req, params({}))
        : path === '/api/sync/pull'
          ? await pullRoute(req, params({}))
          : path.startsWith('/api/photos/')
            ? await putPhoto(req, params({ id: path.split('/')[3] ?? '' }))
            : new Response('{}', { status: 404 });
    if (roll < FAILURE_RATE) {
      // The server did the work; the answer never reached the phone.
      faults.lostAfter += 1;
      throw new TypeError('Failed to fetch');
    }
    return res;
  };
}

const sha = (data: Buffer | ArrayBuffer) =>
  createHash('sha256')
    .update(Buffer.from(data as ArrayBuffer))
    .digest('hex');

describe('sync under a failing network (the phone’s own loop, real server)', () => {
  afterAll(() => {
    vi.unstubAllGlobals();
    console.log(
      `[faults] ${SEEDS.length} phones × (200 ops + 20 photos): ${faults.requests} requests, ${faults.lostBefore} lost before the server, ${faults.lostAfter} lost after it answered`,
    );
  });

  it.each(SEEDS)('200 ops and 20 photos captured offline arrive exactly once when 30 in 100 requests fail (seed %i)', async (SEED) => {
    const org = await makeOrganisation('faults');
    const db = new FieldDatabase(`faults-${randomUUID()}`);
    setFieldDbForTests(db);
    const sources: string[] = [];
    const points: string[] = [];
    const photos = new Map<string, string>();
    const before = { ...faults };
    const visitId = org.visit.id;
    // Offline capture: 90 sources, 90 points, 20 photos (200 ops), nothing sent yet.
    for (let i = 0; i < 90; i++) {
      const id = randomUUID();
      sources.push(id);
      await saveRecord('waterSource', id, { visitId, name: `Seep ${i}`, kind: 'seep', notes: `walked at ${i}` });
      const pointId = randomUUID();
      points.push(pointId);
      await saveRecord('point', pointId, {
        visitId,
        role: 'station',
        label: `Station ${i}`,
        lat: 52.41 + i / 1e4,
        lon: -3.61,
        accuracyM: 5,
        altitudeM: 230 - i / 10,
        altitudeAccuracyM: 8,
        chainageM: i * 5,
        capturedAt: new Date().toISOString(),
      });
    }
    for (let i = 0; i < 20; i++) {
      const bytes = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: i * 10, g: 100, b: 60 } } })
        .jpeg()
        .toBuffer();
      const id = randomUUID();
      photos.set(id, sha(bytes));
      const data = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
      await savePhoto(
        id,
        {
          visitId,
          pointId: null,
          caption: `Photo ${i}`,
          mime: 'image/jpeg',
          bytes: bytes.length,
          sha256: sha(bytes),
          width: 320,
          height: 240,
          lat: null,
          lon: null,
          takenAt: null,
        },
        data,
      );
    }
    expect(await db.outbox.count()).toBe(200);

    vi.stubGlobal('fetch', faultyNetwork(org.advisor, seeded(SEED)));
    const started = Date.now();
    let runs = 0;
    for (; runs < 200; runs++) {
      await runSync(undefined, true);
      // Time passes between runs: retry delays have run out.
      await db.photoBlobs.toCollection().modify({ nextAttemptAt: 0 });
      await db.outbox.toCollection().modify({ nextAttemptAt: 0 });
      const waitingPhotos = await db.photoBlobs.filter((b) => b.uploadedAt === null).count();
      if ((await db.outbox.count()) === 0 && waitingPhotos === 0) break;
    }
    const seconds = (Date.now() - started) / 1000;
    console.log(
      `[faults] seed ${SEED}: synced in ${runs + 1} runs, ${seconds.toFixed(1)} s; ${faults.requests - before.requests} requests, ` +
        `${faults.lostBefore - before.lostBefore} lost before the server, ${faults.lostAfter - before.lostAfter} lost after it answered`,
    );

    expect(faults.requests - before.requests).toBeGreaterThan(faults.lostBefore + faults.lostAfter - before.lostBefore - before.lostAfter);
    expect(await db.outbox.count()).toBe(0);
    expect(await db.photoBlobs.filter((b) => b.uploadedAt === null).count()).toBe(0);
    // Exactly once: every record is there, each op applied once, one "created" audit line each.
    expect(await WaterSource.count({ where: { id: sources } })).toBe(90);
    expect(await Point.count({ where: { id: points } })).toBe(90);
    expect(await Photo.count({ where: { id: [...photos.keys()] } })).toBe(20);
    const entityIds = [...sources, ...points, ...photos.keys()];
    expect(await SyncOp.count({ where: { entityId: entityIds } })).toBe(200);
    expect(await AuditEntry.count({ where: { entityId: entityIds, action: 'created' } })).toBe(200);
    expect(await AuditEntry.count({ where: { entityId: [...photos.keys()], action: 'uploaded' } })).toBe(20);
    for (const [id, expected] of photos) {
      const row = await Photo.findByPk(id, { rejectOnEmpty: true });
      const stored = await getPhotoStorage().get(row.storageKey ?? '');
      expect(stored && sha(stored)).toBe(expected);
    }
    // The phone's copies carry the server's revisions.
    expect((await db.waterSources.toArray()).every((s) => s.rev > 0)).toBe(true);
  });

  it('both kinds of failure happened: requests lost before the server and answers lost after it', () => {
    expect(faults.lostBefore).toBeGreaterThan(0);
    expect(faults.lostAfter).toBeGreaterThan(0);
  });
});
