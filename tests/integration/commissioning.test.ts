import { beforeAll, describe, expect, it } from 'vitest';
import { GET as listCommissionings } from '@/app/api/commissionings/route';
import { GET as getAudit } from '@/app/api/visits/[id]/audit/route';
import { POST as postCommissioning } from '@/app/api/visits/[id]/commissioning/route';
import { daubuissonEfficiency } from '@/lib/engine';
import { Commissioning, Screening, Visit } from '@/lib/server/db';
import { makeOrganisation, params, request, type TestUser } from './support/fixtures';
import { screenFixtureVisit } from './support/screened';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;
let otherOrg: Org;

beforeAll(async () => {
  org = await makeOrganisation('commission');
  otherOrg = await makeOrganisation('commission-other');
  await screenFixtureVisit(org.visit.id, org.farm.id, org.advisor.id);
  await screenFixtureVisit(org.otherVisit.id, org.otherFarm.id, org.otherAdvisor.id);
});

const reading = {
  driveLpm: 55,
  deliveredLpm: 4,
  beatsPerMinute: 70,
  liftM: 20,
  fallM: 3,
  drivePipeMaterial: 'galvanized-steel',
  notes: 'bucket at the tank, three fills',
};
const post = async (visitId: string, user: TestUser | undefined, body: unknown) =>
  postCommissioning(await request(`/api/visits/${visitId}/commissioning`, user, { method: 'POST', body }), params({ id: visitId }));

describe('POST /api/visits/:id/commissioning by role', () => {
  it('without a session is 401', async () => {
    expect((await post(org.visit.id, undefined, reading)).status).toBe(401);
  });
  it('a farmer is refused (403), and nothing is stored', async () => {
    const res = await post(org.visit.id, org.farmer, reading);
    expect(res.status).toBe(403);
    expect(await Commissioning.count({ where: { visitId: org.visit.id } })).toBe(0);
  });
  it('an advisor not assigned to the visit is refused (404: as if it did not exist)', async () => {
    expect((await post(org.visit.id, org.otherAdvisor, reading)).status).toBe(404);
  });
  it('a coordinator of another organisation is refused (404: as if it did not exist)', async () => {
    expect((await post(org.visit.id, otherOrg.coordinator, reading)).status).toBe(404);
  });
  it('bad input is a 422 naming the field, and changes nothing', async () => {
    const res = await post(org.visit.id, org.advisor, { ...reading, deliveredLpm: 60 });
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.fieldErrors.deliveredLpm?.[0]).toMatch(/less than the drive flow/);
    expect((await post(org.visit.id, org.advisor, { ...reading, beatsPerMinute: 'fast' })).status).toBe(422);
    const visit = await Visit.findByPk(org.visit.id, { rejectOnEmpty: true });
    expect(visit.status).toBe('screened');
  });
  it('a visit not yet screened is a 409', async () => {
    const res = await post(otherOrg.visit.id, otherOrg.advisor, reading);
    expect(res.status).toBe(409);
  });
  it('the assigned advisor records it: efficiencies from the engine, the screening compared, the visit commissioned, an audit line', async () => {
    const res = await post(org.visit.id, org.advisor, reading);
    expect(res.status).toBe(201);
    const { commissioning } = await res.json();
    expect(commissioning.status).toBe('commissioned');
    expect(commissioning.check.daubuissonEfficiency).toBeCloseTo(daubuissonEfficiency({ supplyLpm: 55, deliveryLpm: 4, fallM: 3, liftM: 20 }), 12);
    const screening = await Screening.findOne({ where: { visitId: org.visit.id }, order: [['createdAt', 'DESC']], rejectOnEmpty: true });
    expect(commissioning.check.prediction.deliveryLpd).toBe(screening.deliveryLpd);
    expect(['as-predicted', 'above-band', 'short', 'well-short']).toContain(commissioning.check.outcome);
    // The waste-valve advice from the cycle model at the measured fall and lift, on the screening's drive pipe.
    expect(['slow-down', 'speed-up', 'leave']).toContain(commissioning.check.valve.move);
    expect(commissioning.check.valve.text).toMatch(/waste valve/);
    expect(commissioning.check.valve.atDesign.driveLpm).toBeCloseTo(
      (screening.result as { figures: { driveFlowLpm: { value: number } } }).figures.driveFlowLpm.value,
      0,
    );
    const visit = await Visit.findByPk(org.visit.id, { rejectOnEmpty: true });
    expect(visit.status).toBe('commissioned');
    const audit = await getAudit(await request(`/api/visits/${org.visit.id}/audit`, org.coordinator), params({ id: org.visit.id }));
    const lines = (await audit.json()).items as { action: string }[];
    expect(lines.map((l) => l.action)).toContain('commission');
  });
  it('the coordinator may record one too, and the fall defaults to the screening\u2019s', async () => {
    const { fallM: _omit, ...withoutFall } = reading;
    const res = await post(org.otherVisit.id, org.coordinator, { ...withoutFall, deliveredLpm: 1 });
    expect(res.status).toBe(201);
    const row = await Commissioning.findOne({ where: { visitId: org.otherVisit.id }, rejectOnEmpty: true });
    const screening = await Screening.findOne({ where: { visitId: org.otherVisit.id }, order: [['createdAt', 'DESC']], rejectOnEmpty: true });
    expect(row.fallM).toBe((screening.result as { figures: { fallM: { value: number } } }).figures.fallM.value);
  });
});

describe('GET /api/commissionings', () => {
  it('coordinators see predicted against measured for their organisation only; advisors and farmers are refused', async () => {
    const res = await listCommissionings(await request('/api/commissionings', org.coordinator), params({}));
    expect(res.status).toBe(200);
    const items = (await res.json()).items as { visitId: string; measuredLpd: number; predictedLpd: number | null }[];
    expect(items.map((i) => i.visitId).sort()).toEqual([org.visit.id, org.otherVisit.id].sort());
    const mine = items.find((i) => i.visitId === org.visit.id);
    expect(mine?.measuredLpd).toBeCloseTo(4 * 1440, 9);
    const other = await listCommissionings(await request('/api/commissionings', otherOrg.coordinator), params({}));
    expect((await other.json()).items).toEqual([]);
    expect((await listCommissionings(await request('/api/commissionings', org.advisor), params({}))).status).toBe(403);
    expect((await listCommissionings(await request('/api/commissionings', org.farmer), params({}))).status).toBe(403);
  });
});
