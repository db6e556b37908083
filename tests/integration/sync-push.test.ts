import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry, FallReading, FlowMeasurement, Point, Screening, SyncOp, Visit } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';
import { deleteOp, pull, push, putOp, readingOps } from './support/sync';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;

beforeAll(async () => {
  org = await makeOrganisation('push');
});

const pointFields = (visitId: string, label = 'Intake pool') => ({
  visitId,
  role: 'intake',
  label,
  lat: 52.4,
  lon: -3.6,
  accuracyM: 5,
  altitudeM: 236,
  altitudeAccuracyM: 8,
  chainageM: null,
  capturedAt: null,
});

describe('push: create, update, delete', () => {
  it('applies a site walk, moves the visit to surveyed, and stores a screening once', async () => {
    const o = await makeOrganisation('push-walk');
    const { ids, ops } = readingOps(o.visit.id, o.farm.id);
    const { status, results } = await push(o.advisor, { ops });
    expect(status).toBe(200);
    expect(results.map((r) => r.status)).toEqual(ops.map(() => 'applied'));
    expect(results.every((r) => typeof r.rev === 'number' && r.rev > 0)).toBe(true);

    const visit = await Visit.findByPk(o.visit.id, { rejectOnEmpty: true });
    expect(visit.status).toBe('surveyed');
    expect(visit.lastSyncedAt).not.toBeNull();
    expect(await AuditEntry.count({ where: { visitId: o.visit.id, action: 'status' } })).toBe(1);
    const screenings = await Screening.findAll({ where: { visitId: o.visit.id } });
    expect(screenings).toHaveLength(1);
    expect(['go', 'conditional', 'no-go']).toContain(screenings[0]?.verdict);

    // Stored in the shapes loadSiteReadings reads.
    const flow = await FlowMeasurement.findByPk(ids.flow, { rejectOnEmpty: true });
    expect([flow.method, flow.season]).toEqual(['volumetric', 'dry']);
    expect(flow.readings).toEqual({
      trials: [
        { volumeL: 20, seconds: 10.4 },
        { volumeL: 20, seconds: 10.9 },
      ],
    });
    const lift = await FallReading.findByPk(ids.lift, { rejectOnEmpty: true });
    expect(lift.method).toBe('clinometer');
    expect(lift.bookings).toMatchObject({ bookedFrom: 'pump' });
  });

  it('screens again after readings the engine reads, not after points or photos (which it does not read)', async () => {
    const o = await makeOrganisation('push-screen-inputs');
    const { ids, ops } = readingOps(o.visit.id, o.farm.id);
    await push(o.advisor, { ops });
    expect(await Screening.count({ where: { visitId: o.visit.id } })).toBe(1);
    // With the stored screening gone, any screening run would store one again.
    await Screening.destroy({ where: { visitId: o.visit.id } });
    const points = await push(o.advisor, { ops: [putOp('point', randomUUID(), pointFields(o.visit.id, 'Station 9'))] });
    expect(points.results.map((r) => r.status)).toEqual(['applied']);
    expect(await Screening.count({ where: { visitId: o.visit.id } })).toBe(0);
    const flowRev = (await FlowMeasurement.findByPk(ids.flow, { rejectOnEmpty: true })).rev;
    const flow = await push(o.advisor, { ops: [putOp('flowMeasurement', ids.flow, { notes: 'Read again at noon' }, { baseRev: Number(flowRev), base: {} })] });
    expect(flow.results.map((r) => r.status)).toEqual(['applied']);
    expect(await Screening.count({ where: { visitId: o.visit.id } })).toBe(1);
  });

  it('round-trips creates, updates and deletes through pull in the protocol shape', async () => {
    const o = await makeOrganisation('push-round');
    const { ids, ops } = readingOps(o.visit.id, o.farm.id);
    await push(o.advisor, { ops });
    const first = await pull(o.advisor);
    const flow = first.records.flowMeasurement.find((r) => r.id === ids.flow);
    expect(flow?.measurement).toEqual((ops[1]?.changes as { measurement: unknown }).measurement);
    const lift = first.records.fallReading.find((r) => r.id === ids.lift);
    expect(lift?.run).toEqual((ops[3]?.changes as { run: unknown }).run);
    expect(lift?.bookedFrom).toBe('pump');
    expect(first.visits.find((v) => v.id === o.visit.id)?.status).toBe('surveyed');

    const pointRev = first.records.point.find((r) => r.id === ids.point)?.rev as number;
    const deliveryRev = first.records.pipeRun.find((r) => r.id === ids.delivery)?.rev as number;
    const second = await push(o.advisor, {
      ops: [
        putOp('point', ids.point, { label: 'Ram site, moved 3 m upstream' }, { baseRev: pointRev, base: { label: 'Ram site' } }),
        deleteOp('pipeRun', ids.delivery, deliveryRev),
      ],
    });
    expect(second.results.map((r) => r.status)).toEqual(['applied', 'applied']);

    const later = await pull(o.advisor, first.cursor);
    expect(later.records.point.find((r) => r.id === ids.point)?.label).toBe('Ram site, moved 3 m upstream');
    const gone = later.records.pipeRun.find((r) => r.id === ids.delivery);
    expect(gone?.deletedAt).not.toBeNull();
    expect(later.records.flowMeasurement.map((r) => r.id)).not.toContain(ids.flow);
  });

  it('a direct lift is stored as method direct with the lift method in bookings, and comes back whole', async () => {
    const o = await makeOrganisation('push-direct');
    const id = randomUUID();
    const run = { method: 'direct', staticLiftM: 28.5, liftMethod: 'map', uncertaintyM: 3 };
    const { results } = await push(o.advisor, {
      ops: [
        putOp('fallReading', id, {
          visitId: o.visit.id,
          purpose: 'lift',
          seq: 0,
          takenAt: null,
          notes: '',
          bookedFrom: null,
          run,
        }),
      ],
    });
    expect(results[0]?.status).toBe('applied');
    const row = await FallReading.findByPk(id, { rejectOnEmpty: true });
    expect([row.purpose, row.method, row.bookings]).toEqual(['lift', 'direct', { staticLiftM: 28.5, method: 'map', uncertaintyM: 3 }]);
    const pulled = (await pull(o.advisor)).records.fallReading.find((r) => r.id === id);
    expect(pulled?.run).toEqual(run);
  });

  it('a create whose id exists is a conflict carrying the server copy', async () => {
    const id = randomUUID();
    await push(org.advisor, { ops: [putOp('point', id, pointFields(org.visit.id))] });
    const { results } = await push(org.advisor, { ops: [putOp('point', id, pointFields(org.visit.id, 'Another'))] });
    expect(results[0]?.status).toBe('conflict');
    expect(results[0]?.conflict?.server).toMatchObject({ id, label: 'Intake pool' });
  });

  it('a create missing fields is rejected per op with field errors; the other ops still apply', async () => {
    const good = randomUUID();
    const bad = randomUUID();
    const { status, results } = await push(org.advisor, {
      ops: [putOp('point', good, pointFields(org.visit.id)), putOp('point', bad, { visitId: org.visit.id, role: 'pump' })],
    });
    expect(status).toBe(200);
    expect(results.map((r) => r.status)).toEqual(['applied', 'rejected']);
    expect(results[1]?.error?.code).toBe(422);
    expect(Object.keys(results[1]?.error?.fieldErrors ?? {})).toEqual(expect.arrayContaining(['changes.label', 'changes.lat']));
    expect(await Point.count({ where: { id: bad } })).toBe(0);
    expect(await SyncOp.count({ where: { entityId: bad } })).toBe(0);
  });

  it('one batch: each writing op gets its own revision in op order; a refused op in between changes nothing', async () => {
    const o = await makeOrganisation('push-bulk');
    const [a, b, refused] = [randomUUID(), randomUUID(), randomUUID()];
    const { results } = await push(o.advisor, {
      ops: [
        putOp('point', a, pointFields(o.visit.id, 'First')),
        putOp('point', refused, { visitId: o.visit.id, role: 'pump' }),
        putOp('point', b, pointFields(o.visit.id, 'Second')),
        // The phone cannot know the revision the first op got: against it, this base is stale.
        putOp('point', a, { label: 'First, renamed' }, { baseRev: 0 }),
      ],
    });
    expect(results.map((r) => r.status)).toEqual(['applied', 'rejected', 'applied', 'conflict']);
    const [revA, revB] = [results[0]?.rev as number, results[2]?.rev as number];
    expect(revA).toBeGreaterThan(0);
    expect(revB).toBeGreaterThan(revA);
    expect(results[3]?.rev).toBe(revA);
    expect(results[3]?.conflict?.server?.rev).toBe(revA);
    const first = await Point.findByPk(a, { rejectOnEmpty: true });
    expect([first.label, first.rev]).toEqual(['First', revA]);
    expect(await Point.count({ where: { id: refused } })).toBe(0);
    expect(await SyncOp.count({ where: { entityId: refused } })).toBe(0);
    expect(await SyncOp.count({ where: { entityId: a } })).toBe(1);
    // A pull from before the batch returns both rows at their stored revisions.
    const page = await pull(o.advisor, 0);
    expect(page.records.point.map((r) => [r.id, r.rev]).sort()).toEqual(
      [
        [a, revA],
        [b, revB],
      ].sort(),
    );
  });

  it('a record cannot move to another visit', async () => {
    const id = randomUUID();
    const created = await push(org.coordinator, { ops: [putOp('point', id, pointFields(org.visit.id))] });
    const { results } = await push(org.coordinator, {
      ops: [putOp('point', id, { visitId: org.otherVisit.id }, { baseRev: created.results[0]?.rev as number })],
    });
    expect(results[0]?.status).toBe('rejected');
    expect(results[0]?.error?.code).toBe(422);
    expect((await Point.findByPk(id, { rejectOnEmpty: true })).visitId).toBe(org.visit.id);
  });
});

describe('push: idempotent replays', () => {
  it('the same batch pushed three times applies each op once', async () => {
    const o = await makeOrganisation('push-replay');
    const { ops } = readingOps(o.visit.id, o.farm.id);
    const first = await push(o.advisor, { ops });
    const second = await push(o.advisor, { ops });
    const third = await push(o.advisor, { ops });
    expect(first.results.every((r) => r.status === 'applied')).toBe(true);
    for (const again of [second, third]) {
      expect(again.results.map((r) => r.status)).toEqual(ops.map(() => 'replayed'));
      expect(again.results.map((r) => r.rev)).toEqual(first.results.map((r) => r.rev));
    }
    expect(await SyncOp.count({ where: { opId: ops.map((op) => op.opId) } })).toBe(ops.length);
    expect(await AuditEntry.count({ where: { entityId: ops.map((op) => op.entityId), action: 'created' } })).toBe(ops.length);
    expect(await Screening.count({ where: { visitId: o.visit.id } })).toBe(1);
  });

  it('the same batch pushed concurrently applies each op exactly once', async () => {
    const o = await makeOrganisation('push-race');
    const { ops } = readingOps(o.visit.id, o.farm.id);
    const runs = await Promise.all([1, 2, 3].map(() => push(o.advisor, { ops })));
    expect(runs.map((r) => r.status)).toEqual([200, 200, 200]);
    ops.forEach((_op, i) => {
      const statuses = runs.map((r) => r.results[i]?.status);
      expect(statuses.filter((s) => s === 'applied')).toHaveLength(1);
      expect(statuses.filter((s) => s === 'replayed')).toHaveLength(2);
      expect(new Set(runs.map((r) => r.results[i]?.rev)).size).toBe(1);
    });
    expect(await Point.count({ where: { visitId: o.visit.id } })).toBe(1);
    expect(await SyncOp.count({ where: { opId: ops.map((op) => op.opId) } })).toBe(ops.length);
  });
});

describe('push: stale base revisions', () => {
  it('a stale base on a field changed meanwhile is a conflict and changes nothing', async () => {
    const id = randomUUID();
    const created = await push(org.advisor, { ops: [putOp('point', id, pointFields(org.visit.id))] });
    const phoneRev = created.results[0]?.rev as number;
    const office = await push(org.coordinator, {
      ops: [putOp('point', id, { label: 'Intake (office)' }, { baseRev: phoneRev, base: { label: 'Intake pool' } })],
    });
    expect(office.results[0]?.status).toBe('applied');

    const { results } = await push(org.advisor, {
      ops: [putOp('point', id, { label: 'Intake, lower pool' }, { baseRev: phoneRev, base: { label: 'Intake pool' } })],
    });
    expect(results[0]?.status).toBe('conflict');
    expect(results[0]?.conflict?.fields).toEqual(['label']);
    expect(results[0]?.conflict?.server).toMatchObject({ label: 'Intake (office)', rev: office.results[0]?.rev });
    const row = await Point.findByPk(id, { rejectOnEmpty: true });
    expect([row.label, row.rev]).toEqual(['Intake (office)', office.results[0]?.rev]);
  });

  it('a stale base on fields nobody else changed applies, keeping the other change', async () => {
    const id = randomUUID();
    const created = await push(org.advisor, { ops: [putOp('point', id, pointFields(org.visit.id))] });
    const phoneRev = created.results[0]?.rev as number;
    await push(org.coordinator, { ops: [putOp('point', id, { label: 'Intake (office)' }, { baseRev: phoneRev, base: { label: 'Intake pool' } })] });
    const { results } = await push(org.advisor, { ops: [putOp('point', id, { altitudeM: 237.5 }, { baseRev: phoneRev, base: { altitudeM: 236 } })] });
    expect(results[0]?.status).toBe('applied');
    const row = await Point.findByPk(id, { rejectOnEmpty: true });
    expect([row.label, row.altitudeM]).toEqual(['Intake (office)', 237.5]);
  });

  it('a stale delete of a record changed meanwhile is a conflict; a current one soft-deletes', async () => {
    const id = randomUUID();
    const created = await push(org.advisor, { ops: [putOp('point', id, pointFields(org.visit.id))] });
    const phoneRev = created.results[0]?.rev as number;
    const office = await push(org.coordinator, { ops: [putOp('point', id, { label: 'Keep me' }, { baseRev: phoneRev })] });
    const stale = await push(org.advisor, { ops: [deleteOp('point', id, phoneRev, pointFields(org.visit.id))] });
    expect(stale.results[0]?.status).toBe('conflict');
    expect(stale.results[0]?.conflict?.fields).toEqual(['label']);
    expect((await Point.findByPk(id, { rejectOnEmpty: true })).deletedAt).toBeNull();
    const current = await push(org.advisor, { ops: [deleteOp('point', id, office.results[0]?.rev as number)] });
    expect(current.results[0]?.status).toBe('applied');
    expect((await Point.findByPk(id, { rejectOnEmpty: true })).deletedAt).not.toBeNull();
  });
});

describe('push: access and bad input', () => {
  it("an advisor cannot write to another advisor's visit: rejected 404 (as if it did not exist), nothing written", async () => {
    const { ops } = readingOps(org.otherVisit.id, org.otherFarm.id);
    const auditsBefore = await AuditEntry.count({ where: { visitId: org.otherVisit.id } });
    const { status, results } = await push(org.advisor, { ops });
    expect(status).toBe(200);
    expect(results.map((r) => [r.status, r.error?.code])).toEqual(ops.map(() => ['rejected', 404]));
    expect(await Point.count({ where: { visitId: org.otherVisit.id } })).toBe(0);
    expect(await FlowMeasurement.count({ where: { visitId: org.otherVisit.id } })).toBe(0);
    expect(await SyncOp.count({ where: { opId: ops.map((op) => op.opId) } })).toBe(0);
    expect(await AuditEntry.count({ where: { visitId: org.otherVisit.id } })).toBe(auditsBefore);
    expect((await Visit.findByPk(org.otherVisit.id, { rejectOnEmpty: true })).status).toBe('scheduled');
  });

  it('another organisation cannot be written, even by its coordinator; it answers 404 like an unknown visit', async () => {
    const other = await makeOrganisation('push-foreign');
    const { results } = await push(org.coordinator, {
      ops: [putOp('point', randomUUID(), pointFields(other.visit.id)), putOp('point', randomUUID(), pointFields(randomUUID()))],
    });
    expect(results.map((r) => r.error?.code)).toEqual([404, 404]);
  });

  it('farmers cannot push at all (403), signed-out callers get 401', async () => {
    const ops = [putOp('point', randomUUID(), pointFields(org.visit.id))];
    expect((await push(org.farmer, { ops })).status).toBe(403);
    const { POST } = await import('@/app/api/sync/push/route');
    const { request, params } = await import('./support/fixtures');
    expect((await POST(await request('/api/sync/push', undefined, { method: 'POST', body: { ops } }), params({}))).status).toBe(401);
  });

  it('a malformed envelope or any malformed op is a 422 with field errors and applies nothing', async () => {
    const good = putOp('point', randomUUID(), pointFields(org.visit.id));
    const before = await Point.count();
    const cases: [unknown, string][] = [
      [{ ops: [] }, 'ops'],
      [{}, 'ops'],
      [{ ops: [good, { ...putOp('point', randomUUID(), pointFields(org.visit.id)), opId: 'nope' }] }, 'ops.1.opId'],
      [{ ops: [good, putOp('point', randomUUID(), { ...pointFields(org.visit.id), lat: 123 })] }, 'ops.1.changes.lat'],
      [{ ops: [good, putOp('point', randomUUID(), { ...pointFields(org.visit.id), colour: 'red' })] }, 'ops.1.changes'],
      [{ ops: Array.from({ length: 201 }, () => good) }, 'ops'],
    ];
    for (const [body, field] of cases) {
      const res = await push(org.advisor, body);
      expect(res.status, field).toBe(422);
      expect(Object.keys(res.error?.fieldErrors ?? {}), field).toContain(field);
    }
    expect(await Point.count()).toBe(before);
    expect(await SyncOp.count({ where: { opId: good.opId } })).toBe(0);
  });

  it('a body that is not JSON is a 422', async () => {
    const { POST } = await import('@/app/api/sync/push/route');
    const { request, params, sessionCookie } = await import('./support/fixtures');
    const req = await request('/api/sync/push', undefined, {
      method: 'POST',
      headers: { cookie: await sessionCookie(org.advisor), 'content-type': 'application/json' },
    });
    const bad = new (req.constructor as typeof Request)(req.url, { method: 'POST', headers: req.headers, body: '{"ops": [' });
    const res = await POST(bad as typeof req, params({}));
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toMatch(/not valid JSON/);
  });
});

describe('the bulk writer (rows through the connector, not model instances)', () => {
  it('stores times in UTC, JSON as JSON, timestamps, audit lines and outcomes as the models read them', async () => {
    const o = await makeOrganisation('push-bulk');
    const { ids, ops } = readingOps(o.visit.id, o.farm.id);
    const before = Date.now();
    const { results } = await push(o.advisor, { ops });
    const point = await Point.findByPk(ids.point, { rejectOnEmpty: true });
    // The phone's ISO time comes back as the same instant.
    expect(point.capturedAt?.toISOString()).toBe('2026-08-01T09:30:00.000Z');
    expect(point.createdAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
    expect(point.updatedAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
    expect(point.createdAt.getTime()).toBeLessThanOrEqual(Date.now() + 1000);
    const flow = await FlowMeasurement.findByPk(ids.flow, { rejectOnEmpty: true });
    expect(flow.takenAt?.toISOString()).toBe('2026-08-01T09:30:00.000Z');
    const audit = await AuditEntry.findOne({ where: { entityId: ids.flow, action: 'created' }, rejectOnEmpty: true });
    const changes = typeof audit.changes === 'string' ? JSON.parse(audit.changes) : audit.changes;
    expect(changes).toMatchObject({ sourceId: ids.source, measurement: { method: 'volumetric', season: 'dry' } });
    expect(audit.createdAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
    const stored = await SyncOp.findByPk(ops[1]?.opId ?? '', { rejectOnEmpty: true });
    const outcome = typeof stored.outcome === 'string' ? JSON.parse(stored.outcome) : stored.outcome;
    expect(outcome).toEqual(results[1]);
    expect(stored.userId).toBe(o.advisor.id);

    // An update through the bulk path changes only its field, and moves updated_at, not created_at.
    const created = point.createdAt.getTime();
    const [update] = (
      await push(o.advisor, { ops: [putOp('point', ids.point, { label: 'Ram site, moved' }, { baseRev: point.rev, base: { label: 'Ram site' } })] })
    ).results;
    expect(update?.status).toBe('applied');
    await point.reload();
    expect([point.label, point.role, point.altitudeM]).toEqual(['Ram site, moved', 'pump', 232]);
    expect(point.createdAt.getTime()).toBe(created);
    expect(point.rev).toBe(update?.rev);
  });
});
