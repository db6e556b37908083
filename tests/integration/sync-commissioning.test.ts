import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { daubuissonEfficiency, designPointFromFigures, wasteValveAdvice } from '@/lib/engine';
import { AuditEntry, Commissioning, Screening, SyncOp, Visit } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';
import { screenFixtureVisit } from './support/screened';
import { pull, push, putOp } from './support/sync';

// A commissioning check recorded on the phone (often offline) arrives through the sync push.

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;

beforeAll(async () => {
  org = await makeOrganisation('push-commission');
  await screenFixtureVisit(org.visit.id, org.farm.id, org.advisor.id);
});

const fields = (visitId: string, over: Record<string, unknown> = {}) => ({
  visitId,
  driveLpm: 55,
  deliveredLpm: 4,
  beatsPerMinute: 70,
  liftM: 20,
  fallM: 3,
  drivePipeMaterial: 'galvanized-steel',
  notes: 'bucket at the tank, three fills',
  ...over,
});

const counts = async (visitId: string) => ({
  commissionings: await Commissioning.count({ where: { visitId } }),
  audits: await AuditEntry.count({ where: { visitId } }),
  status: (await Visit.findByPk(visitId, { rejectOnEmpty: true })).status,
});

describe('push: commissioning', () => {
  it('refuses bad readings with a message naming the field, and changes nothing', async () => {
    const before = await counts(org.visit.id);
    const op = putOp('commissioning', randomUUID(), fields(org.visit.id, { deliveredLpm: 60 }));
    const { status, results } = await push(org.advisor, { ops: [op] });
    expect(status).toBe(200);
    expect(results[0]?.status).toBe('rejected');
    expect(results[0]?.error?.code).toBe(422);
    expect(results[0]?.error?.message).toMatch(/less than the drive flow/);
    expect(results[0]?.error?.fieldErrors?.['changes.deliveredLpm']?.[0]).toMatch(/less than the drive flow/);
    // A lift below the fall is caught after the screening's fall is known: refused too.
    const low = await push(org.advisor, { ops: [putOp('commissioning', randomUUID(), fields(org.visit.id, { liftM: 2 }))] });
    expect(low.results[0]?.status).toBe('rejected');
    expect(await counts(org.visit.id)).toEqual(before);
    // A refused op leaves no trace in sync_ops: the person may fix the readings and send again.
    expect(await SyncOp.count({ where: { opId: op.opId } })).toBe(0);
  });

  it('refuses a missing reading, an edit and a delete of a check', async () => {
    const { driveLpm: _d, ...partial } = fields(org.visit.id);
    const id = randomUUID();
    const missing = await push(org.advisor, { ops: [putOp('commissioning', id, partial)] });
    expect(missing.results[0]?.status).toBe('rejected');
    expect(Object.keys(missing.results[0]?.error?.fieldErrors ?? {})).toContain('changes.driveLpm');
    const edit = await push(org.advisor, { ops: [putOp('commissioning', id, { liftM: 30 }, { baseRev: 1 })] });
    expect(edit.results[0]?.error?.message).toMatch(/cannot be changed/);
    expect(await Commissioning.count({ where: { id } })).toBe(0);
  });

  it('refuses an advisor who is not assigned, and a farmer', async () => {
    const before = await counts(org.visit.id);
    for (const user of [org.otherAdvisor, org.farmer]) {
      const { status, results } = await push(user, { ops: [putOp('commissioning', randomUUID(), fields(org.visit.id))] });
      expect(status === 403 || results[0]?.status === 'rejected').toBe(true);
    }
    expect(await counts(org.visit.id)).toEqual(before);
  });

  it('refuses a visit that has no screening yet (409), changing nothing', async () => {
    const o = await makeOrganisation('push-commission-unscreened');
    const { results } = await push(o.advisor, { ops: [putOp('commissioning', randomUUID(), fields(o.visit.id))] });
    expect(results[0]?.status).toBe('rejected');
    expect(results[0]?.error?.code).toBe(409);
    expect((await counts(o.visit.id)).commissionings).toBe(0);
  });

  it('applies a valid check: the engine runs on the server, the visit is commissioned, one audit line; replays apply it once', async () => {
    const id = randomUUID();
    const op = putOp('commissioning', id, fields(org.visit.id));
    const first = await push(org.advisor, { ops: [op] });
    expect(first.results[0]?.status).toBe('applied');
    const row = await Commissioning.findByPk(id, { rejectOnEmpty: true });
    expect(row.recordedById).toBe(org.advisor.id);
    const check = row.result as { daubuissonEfficiency: number; prediction: { deliveryLpd: number } | null };
    expect(check.daubuissonEfficiency).toBeCloseTo(daubuissonEfficiency({ supplyLpm: 55, deliveryLpm: 4, fallM: 3, liftM: 20 }), 12);
    const screening = await Screening.findOne({ where: { visitId: org.visit.id }, order: [['createdAt', 'DESC']], rejectOnEmpty: true });
    expect(row.screeningId).toBe(screening.id);
    expect(check.prediction?.deliveryLpd).toBe(screening.deliveryLpd);
    expect((await Visit.findByPk(org.visit.id, { rejectOnEmpty: true })).status).toBe('commissioned');
    expect(await AuditEntry.count({ where: { entityId: id, action: 'commission' } })).toBe(1);

    // The same op again (the answer was lost on the way back): replayed, stored once.
    const again = await push(org.advisor, { ops: [op] });
    expect(again.results[0]?.status).toBe('replayed');
    // The same record under a new op id (queued twice on the phone): acknowledged, stored once.
    const twice = await push(org.advisor, { ops: [putOp('commissioning', id, fields(org.visit.id))] });
    expect(twice.results[0]?.status).toBe('applied');
    expect(await Commissioning.count({ where: { id } })).toBe(1);
    expect(await AuditEntry.count({ where: { entityId: id, action: 'commission' } })).toBe(1);

    // The phone learns the new status from the pull; commissionings themselves are never pulled.
    const page = await pull(org.advisor);
    expect(page.visits.find((v) => v.id === org.visit.id)?.status).toBe('commissioned');
    expect(Object.keys(page.records)).not.toContain('commissioning');
  });

  it('the fall defaults to the screening\u2019s when the phone sends none', async () => {
    const o = await makeOrganisation('push-commission-fall');
    await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
    const id = randomUUID();
    const { results } = await push(o.advisor, {
      ops: [putOp('commissioning', id, fields(o.visit.id, { fallM: null, drivePipeMaterial: null, deliveredLpm: 1 }))],
    });
    expect(results[0]?.status).toBe('applied');
    const row = await Commissioning.findByPk(id, { rejectOnEmpty: true });
    const screening = await Screening.findOne({ where: { visitId: o.visit.id }, order: [['createdAt', 'DESC']], rejectOnEmpty: true });
    expect(row.fallM).toBe((screening.result as { figures: { fallM: { value: number } } }).figures.fallM.value);
  });

  it('keeps the waste valve stroke the advisor measured and models it; a phone that sends none stores none; a 500 mm stroke is refused', async () => {
    const o = await makeOrganisation('push-commission-stroke');
    await screenFixtureVisit(o.visit.id, o.farm.id, o.advisor.id);
    const withStroke = randomUUID();
    const a = await push(o.advisor, { ops: [putOp('commissioning', withStroke, fields(o.visit.id, { wasteValveStrokeMm: 22 }))] });
    expect(a.results[0]?.status).toBe('applied');
    const row = await Commissioning.findByPk(withStroke, { rejectOnEmpty: true });
    expect(row.wasteValveStrokeMm).toBe(22);
    const screening = await Screening.findOne({ where: { visitId: o.visit.id }, order: [['createdAt', 'DESC']], rejectOnEmpty: true });
    const design = designPointFromFigures((screening.result as { figures: Record<string, { value: number | null }> }).figures);
    const stored = (row.result as { valve: unknown }).valve;
    expect(stored).toEqual(design ? wasteValveAdvice({ driveLpm: 55, deliveredLpm: 4, beatsPerMinute: 70, liftM: 20, fallM: 3 }, design, 22) : null);

    // A phone from before the field (the key absent) still commissions; nothing is stored for it.
    const { wasteValveStrokeMm: _none, ...older } = fields(o.visit.id) as Record<string, unknown>;
    const withoutId = randomUUID();
    expect((await push(o.advisor, { ops: [putOp('commissioning', withoutId, older)] })).results[0]?.status).toBe('applied');
    expect((await Commissioning.findByPk(withoutId, { rejectOnEmpty: true })).wasteValveStrokeMm).toBeNull();

    const before = await Commissioning.count({ where: { visitId: o.visit.id } });
    const refused = await push(o.advisor, { ops: [putOp('commissioning', randomUUID(), fields(o.visit.id, { wasteValveStrokeMm: 500 }))] });
    expect(refused.results[0]?.status).toBe('rejected');
    expect(refused.results[0]?.error?.message).toMatch(/stroke/i);
    expect(await Commissioning.count({ where: { visitId: o.visit.id } })).toBe(before);
  });
});
