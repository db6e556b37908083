import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { FieldDatabase } from '@/lib/client/db';
import { savePhoto, saveRecord } from '@/lib/client/outbox';
import { backoffMs, BASE_DELAY_MS, MAX_DELAY_MS } from '@/lib/client/sync/backoff';
import { getMeta } from '@/lib/client/sync/meta';
import { mergePull } from '@/lib/client/sync/pull';
import { pushAll } from '@/lib/client/sync/push';
import { runSync } from '@/lib/client/sync/runner';
import { emptyPull, fakeServer, freshDb, VISIT } from './helpers';

let db: FieldDatabase;
beforeEach(() => {
  db = freshDb();
});
afterEach(() => {
  vi.unstubAllGlobals();
});

const note = (i: number) =>
  saveRecord('waterSource', `44444444-4444-4444-8444-${String(i).padStart(12, '0')}`, {
    visitId: VISIT,
    name: `source ${i}`,
    kind: 'creek',
    notes: '',
  });

describe('backoff (exponential with jitter, capped)', () => {
  it('doubles per attempt within [half, full] of the ceiling and never passes the cap', () => {
    expect(backoffMs(1, 0)).toBe(BASE_DELAY_MS / 2);
    expect(backoffMs(1, 0.999)).toBeLessThanOrEqual(BASE_DELAY_MS);
    expect(backoffMs(3, 0)).toBe((BASE_DELAY_MS * 4) / 2);
    expect(backoffMs(40, 0.999)).toBeLessThanOrEqual(MAX_DELAY_MS);
  });
});

describe('push', () => {
  it('sends ops in order in batches and empties the outbox once acknowledged', async () => {
    const server = fakeServer();
    for (let i = 0; i < 150; i++) await note(i);
    expect(await pushAll()).toBe(150);
    expect(server.pushed.map((b) => b.length)).toEqual([100, 50]);
    const names = server.pushed.flat().map((op) => (op.changes as { name: string }).name);
    expect(names).toEqual(Array.from({ length: 150 }, (_, i) => `source ${i}`));
    expect(await db.outbox.count()).toBe(0);
    expect((await db.waterSources.toArray()).every((s) => s.rev > 0)).toBe(true);
  });

  it('keeps everything and backs off when the server fails', async () => {
    const server = fakeServer();
    await note(1);
    server.failNextWith(500);
    await expect(pushAll()).rejects.toThrow();
    const [entry] = await db.outbox.toArray();
    expect(entry?.attempts).toBe(1);
    expect(entry?.nextAttemptAt).toBeGreaterThan(Date.now());
  });

  it('a batch that fails server-side (500) is split until the one op that fails is found; the rest go through', async () => {
    const server = fakeServer();
    for (let i = 0; i < 150; i++) await note(i);
    const bad = (op: { changes?: unknown }) => (op.changes as { name?: string } | undefined)?.name === 'source 37';
    server.failBatchesContaining(bad, 500);
    expect(await pushAll()).toBe(149);
    const left = await db.outbox.toArray();
    expect(left).toHaveLength(1);
    expect((left[0]?.op.changes as { name: string }).name).toBe('source 37');
    expect(left[0]?.status).toBe('pending');
    expect(left[0]?.attempts).toBe(1);
    expect(left[0]?.nextAttemptAt).toBeGreaterThan(Date.now());
    // Split in halves, not one request per op.
    expect(server.pushed.length).toBeLessThan(30);
    // "Sync now" tries it again, once per run, and the run ends.
    await expect(pushAll(true)).rejects.toThrow();
    expect(await db.outbox.count()).toBe(1);
  });

  it('when every op fails (the server is down) the split gives up early and everything waits, nothing lost', async () => {
    const server = fakeServer();
    for (let i = 0; i < 150; i++) await note(i);
    server.failBatchesContaining(() => true, 500);
    await expect(pushAll()).rejects.toThrow();
    expect(server.pushed.length).toBeLessThan(20);
    const left = await db.outbox.toArray();
    expect(left).toHaveLength(150);
    expect(left.filter((e) => e.attempts === 1)).toHaveLength(100);
  });

  it('a 401 pauses the queue and drops nothing', async () => {
    const server = fakeServer();
    await note(1);
    server.failNextWith(401);
    const outcome = await runSync();
    expect(outcome).toMatchObject({ ok: false });
    expect(await getMeta('authPaused')).toBe(true);
    expect(await db.outbox.count()).toBe(1);
  });

  it('parks a conflict with the server copy instead of retrying or dropping it', async () => {
    fakeServer(() => 'conflict');
    await note(1);
    await pushAll();
    const [entry] = await db.outbox.toArray();
    expect(entry?.status).toBe('conflict');
    expect(entry?.result?.conflict?.server).toEqual({ note: 'theirs' });
    // A parked op is not sent again by the next run.
    expect(await pushAll()).toBe(0);
  });

  it('a replayed op (the server saw it before) is acknowledged like an applied one', async () => {
    const server = fakeServer();
    await note(1);
    const [entry] = await db.outbox.toArray();
    // The first answer was lost: the server already holds the op.
    await server.fetchMock('/api/sync/push', { method: 'POST', body: JSON.stringify({ ops: [entry?.op] }) });
    expect(await pushAll()).toBe(1);
    expect(await db.outbox.count()).toBe(0);
  });

  it('a refused op stays visible as rejected', async () => {
    fakeServer(() => 'rejected');
    await note(1);
    await pushAll();
    expect((await db.outbox.toArray())[0]).toMatchObject({ status: 'rejected', result: { error: { code: 403 } } });
  });
});

describe('photos', () => {
  const PHOTO = '55555555-5555-4555-8555-555555555555';
  const meta = {
    visitId: VISIT,
    pointId: null,
    caption: '',
    mime: 'image/jpeg' as const,
    bytes: 3,
    sha256: 'b'.repeat(64),
    width: null,
    height: null,
    lat: null,
    lon: null,
    takenAt: null,
  };

  it('upload only after the metadata op was acknowledged, and are kept until the server confirms', async () => {
    const server = fakeServer();
    await savePhoto(PHOTO, meta, new Uint8Array([1, 2, 3]).buffer);
    const outcome = await runSync();
    expect(outcome).toMatchObject({ ok: true, photos: 1 });
    const calls = server.fetchMock.mock.calls.map((c) => String(c[0]));
    expect(calls.indexOf(`/api/photos/${PHOTO}`)).toBeGreaterThan(calls.indexOf('/api/sync/push'));
    expect((await db.photoBlobs.get(PHOTO))?.uploadedAt).not.toBeNull();
  });

  it('a gateway error on an upload backs the photo off, but "Sync now" (force) sends it at once', async () => {
    const server = fakeServer();
    await savePhoto(PHOTO, meta, new Uint8Array([1, 2, 3]).buffer);
    await pushAll();
    server.failNextWith(502);
    expect(await runSync()).toMatchObject({ ok: false });
    expect((await db.photoBlobs.get(PHOTO))?.nextAttemptAt).toBeGreaterThan(Date.now());
    // A few failures later the delay is long (set here, so a slow machine cannot outlast it).
    await db.photoBlobs.update(PHOTO, { attempts: 6, nextAttemptAt: Date.now() + 60_000 });
    // An automatic run leaves it to its delay; the button does not.
    expect(await runSync()).toMatchObject({ ok: true, photos: 0 });
    expect(await runSync(undefined, true)).toMatchObject({ ok: true, photos: 1 });
    expect((await db.photoBlobs.get(PHOTO))?.uploadedAt).not.toBeNull();
  });
});

describe('pull', () => {
  it('merges server records but leaves records with waiting changes as the person edited them', async () => {
    await note(1);
    const edited = (await db.waterSources.toArray())[0];
    const page = emptyPull(500);
    page.records.waterSource = [
      { id: edited?.id ?? '', visitId: VISIT, name: 'server name', kind: 'creek', notes: '', rev: 9, deletedAt: null, updatedAt: '' },
      { id: '66666666-6666-4666-8666-666666666666', visitId: VISIT, name: 'from office', kind: 'spring', notes: '', rev: 10, deletedAt: null, updatedAt: '' },
    ];
    await mergePull(page);
    expect((await db.waterSources.get(edited?.id ?? ''))?.name).toBe('source 1');
    expect((await db.waterSources.get('66666666-6666-4666-8666-666666666666'))?.name).toBe('from office');
    expect(await getMeta('cursor')).toBe(500);
  });

  it('forgets visits reassigned away unless changes for them still wait', async () => {
    await db.visits.bulkPut([
      { id: VISIT, farmId: 'f', plannedOn: null, advisorId: null, notes: '', status: 'scheduled', visitedAt: null, rev: 1, deletedAt: null, updatedAt: '' },
      {
        id: '77777777-7777-4777-8777-777777777777',
        farmId: 'f',
        plannedOn: null,
        advisorId: null,
        notes: '',
        status: 'scheduled',
        visitedAt: null,
        rev: 1,
        deletedAt: null,
        updatedAt: '',
      },
    ]);
    await note(1); // waits, on VISIT
    const page = emptyPull(5);
    page.visibleVisitIds = [];
    await mergePull(page);
    expect(await db.visits.get(VISIT)).toBeDefined();
    expect(await db.visits.get('77777777-7777-4777-8777-777777777777')).toBeUndefined();
  });
});

describe('no signal is not a server failure', () => {
  it('an offline attempt adds no retry delay, so the first run back in coverage sends everything', async () => {
    const server = fakeServer();
    await note(1);
    server.failNextWith(0);
    await expect(pushAll()).rejects.toThrow(/No connection/);
    const [entry] = await db.outbox.toArray();
    expect(entry?.attempts).toBe(0);
    expect(await pushAll()).toBe(1);
  });

  it('a server error backs off, but the "Sync now" button (force) still sends at once', async () => {
    const server = fakeServer();
    await note(1);
    server.failNextWith(503);
    await expect(pushAll()).rejects.toThrow();
    expect(await pushAll()).toBe(0);
    expect(await pushAll(true)).toBe(1);
  });
});

describe('commissioning checks on the phone', () => {
  const CHECK = '55555555-5555-4555-8555-000000000001';
  const check = () =>
    saveRecord('commissioning', CHECK, {
      visitId: VISIT,
      driveLpm: 54,
      deliveredLpm: 3.6,
      beatsPerMinute: 150,
      liftM: 25,
      fallM: 4,
      drivePipeMaterial: null,
      notes: '',
    });

  it('keeps the check and its op until the server acknowledges it, then keeps the check with nothing waiting', async () => {
    const server = fakeServer();
    await check();
    server.failNextWith(0);
    await expect(pushAll()).rejects.toThrow();
    expect(await db.commissionings.count()).toBe(1);
    expect((await db.outbox.where('entityId').equals(CHECK).toArray()).map((e) => e.op.entity)).toEqual(['commissioning']);
    expect(await pushAll(true)).toBe(1);
    // The lost attempt never reached the server; the second is the one it acknowledged.
    expect(server.pushed.flat().filter((op) => op.entityId === CHECK)).toHaveLength(1);
    expect(await db.outbox.count()).toBe(0);
    expect((await db.commissionings.get(CHECK))?.liftM).toBe(25);
  });

  it('a check still waiting is kept when its visit is reassigned away; a sent one goes with the visit', async () => {
    fakeServer();
    await check();
    await db.visits.put({
      id: VISIT,
      rev: 1,
      farmId: 'f',
      plannedOn: null,
      advisorId: null,
      notes: '',
      status: 'screened',
      visitedAt: null,
      deletedAt: null,
      updatedAt: new Date().toISOString(),
    } as never);
    await mergePull({ ...emptyPull(5), visibleVisitIds: [] });
    expect(await db.commissionings.count()).toBe(1);
    await pushAll(true);
    await mergePull({ ...emptyPull(6), visibleVisitIds: [] });
    expect(await db.commissionings.count()).toBe(0);
    expect(await db.visits.count()).toBe(0);
  });
});

describe('a photo the server refuses', () => {
  const PHOTO = '66666666-6666-4666-8666-666666666666';
  const meta = {
    visitId: VISIT,
    pointId: null,
    caption: 'intake pool',
    mime: 'image/jpeg' as const,
    bytes: 3,
    sha256: 'c'.repeat(64),
    width: null,
    height: null,
    lat: null,
    lon: null,
    takenAt: null,
  };

  it("keeps the bytes with the server's reason, and clears the reason once a later upload is taken", async () => {
    const server = fakeServer();
    await savePhoto(PHOTO, meta, new Uint8Array([1, 2, 3]).buffer);
    await pushAll();
    server.failNextWith(415);
    expect(await runSync()).toMatchObject({ ok: true, photos: 0 });
    const refused = await db.photoBlobs.get(PHOTO);
    expect(refused?.uploadedAt).toBeNull();
    expect(refused?.data.byteLength).toBe(3);
    expect(refused?.lastError).toEqual({ status: 415, message: 'status 415' });
    expect(await runSync(undefined, true)).toMatchObject({ ok: true, photos: 1 });
    expect(await db.photoBlobs.get(PHOTO)).toMatchObject({ lastError: null });
    expect((await db.photoBlobs.get(PHOTO))?.uploadedAt).not.toBeNull();
  });
});
