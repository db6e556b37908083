import { beforeEach, describe, expect, it } from 'vitest';
import { deleteRecord, savePhoto, saveRecord, undoDelete } from '@/lib/client/outbox';
import { discardParked } from '@/lib/client/sync/resolve';
import type { FieldDatabase } from '@/lib/client/db';
import { freshDb, VISIT } from './helpers';

const POINT = '22222222-2222-4222-8222-222222222222';
let db: FieldDatabase;
beforeEach(() => {
  db = freshDb();
});

const pointFields = {
  visitId: VISIT,
  role: 'intake' as const,
  label: 'Pool',
  lat: 52.4,
  lon: -3.6,
  accuracyM: 4,
  altitudeM: 236,
  altitudeAccuracyM: 6,
  chainageM: null,
  capturedAt: null,
};

describe('the outbox', () => {
  it('writes the record and its op together; a create carries every field and no base revision', async () => {
    const op = await saveRecord('point', POINT, pointFields);
    expect(await db.points.get(POINT)).toMatchObject({ id: POINT, rev: 0, label: 'Pool' });
    const entries = await db.outbox.toArray();
    expect(entries).toHaveLength(1);
    expect(entries[0]?.op).toMatchObject({ entity: 'point', entityId: POINT, action: 'put', baseRev: null });
    expect(Object.keys(op?.changes ?? {})).toEqual(Object.keys(pointFields));
    expect(entries[0]?.visitId).toBe(VISIT);
  });

  it('an edit queues only the changed fields, with the values seen before and the base revision', async () => {
    await saveRecord('point', POINT, pointFields);
    await db.points.update(POINT, { rev: 7 });
    const op = await saveRecord('point', POINT, { ...pointFields, label: 'Upper pool', altitudeM: 237 });
    expect(op?.changes).toEqual({ label: 'Upper pool', altitudeM: 237 });
    expect(op?.base).toEqual({ label: 'Pool', altitudeM: 236 });
    expect(op?.baseRev).toBe(7);
  });

  it('a save that changes nothing queues nothing', async () => {
    await saveRecord('point', POINT, pointFields);
    expect(await saveRecord('point', POINT, pointFields)).toBeNull();
    expect(await db.outbox.count()).toBe(1);
  });

  it('keeps ops in the order they were made', async () => {
    await saveRecord('point', POINT, pointFields);
    await saveRecord('point', POINT, { label: 'b' });
    await saveRecord('point', POINT, { label: 'c' });
    const labels = (await db.outbox.orderBy('seq').toArray()).map((e) => (e.op.changes as { label?: string }).label);
    expect(labels).toEqual(['Pool', 'b', 'c']);
  });

  it('a delete marks the record and queues the delete; the record stays until the server agrees', async () => {
    await saveRecord('point', POINT, pointFields);
    await deleteRecord('point', POINT);
    expect((await db.points.get(POINT))?.deletedAt).not.toBeNull();
    expect((await db.outbox.orderBy('seq').last())?.op.action).toBe('delete');
  });

  it('a photo keeps its bytes beside its metadata op', async () => {
    const bytes = new Uint8Array([0xff, 0xd8, 0xff, 1, 2, 3]).buffer;
    await savePhoto(
      '33333333-3333-4333-8333-333333333333',
      {
        visitId: VISIT,
        pointId: null,
        caption: 'intake',
        mime: 'image/jpeg',
        bytes: 6,
        sha256: 'a'.repeat(64),
        width: null,
        height: null,
        lat: null,
        lon: null,
        takenAt: null,
      },
      bytes,
    );
    const blob = await db.photoBlobs.get('33333333-3333-4333-8333-333333333333');
    expect(new Uint8Array(blob?.data ?? new ArrayBuffer(0))).toEqual(new Uint8Array([0xff, 0xd8, 0xff, 1, 2, 3]));
    expect(blob?.uploadedAt).toBeNull();
    expect((await db.outbox.toArray()).filter((e) => e.entity === 'photo')).toHaveLength(1);
  });
});

describe('the phone refuses what the server would, and takes back what it can', () => {
  it('an impossible value is refused with its field message, and nothing is written', async () => {
    await expect(saveRecord('point', POINT, { ...pointFields, chainageM: -20 })).rejects.toMatchObject({
      name: 'RecordRefused',
      messages: { chainageM: 'Distance along the route must not be negative.' },
    });
    expect(await db.points.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
  });

  it('an unusual value is refused until confirmed, then saved with its confirmation', async () => {
    const FARM = '33333333-3333-4333-8333-333333333333';
    const line = { farmId: FARM, kind: 'person-tap-on-plot' as const, count: 450, litresPerHeadPerDay: 50, figureSource: '', note: '', confirmed: null };
    await expect(saveRecord('demandLine', POINT, line)).rejects.toMatchObject({ unusual: [expect.objectContaining({ code: 'people-many' })] });
    expect(await db.outbox.count()).toBe(0);
    await saveRecord('demandLine', POINT, { ...line, confirmed: ['people-many'] });
    expect((await db.demandLines.get(POINT))?.confirmed).toEqual(['people-many']);
  });

  it('a delete not yet sent can be undone: the record is back and no delete waits', async () => {
    await saveRecord('point', POINT, pointFields);
    await deleteRecord('point', POINT);
    expect((await db.points.get(POINT))?.deletedAt).not.toBeNull();
    expect(await undoDelete('point', POINT)).toBe(true);
    expect((await db.points.get(POINT))?.deletedAt).toBeNull();
    expect((await db.outbox.toArray()).map((e) => e.op.action)).toEqual(['put']);
    expect(await undoDelete('point', POINT)).toBe(false);
  });

  it("giving up a refused edit puts the server's value back on the phone", async () => {
    await saveRecord('point', POINT, pointFields);
    await db.outbox.clear();
    await db.points.update(POINT, { rev: 4 });
    await saveRecord('point', POINT, { ...pointFields, label: 'Refused name' });
    const entry = (await db.outbox.toArray())[0]!;
    await db.outbox.update(entry.seq!, { status: 'rejected' });
    await discardParked(entry.seq!);
    expect((await db.points.get(POINT))?.label).toBe('Pool');
    expect(await db.outbox.count()).toBe(0);
  });
});
