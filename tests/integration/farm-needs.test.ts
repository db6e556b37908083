import { beforeAll, describe, expect, it } from 'vitest';
import { GET as getNeeds, PUT as putNeeds } from '@/app/api/farms/[id]/demand/route';
import { DemandLine } from '@/lib/server/db';
import { makeOrganisation, params, request } from './support/fixtures';

let org: Awaited<ReturnType<typeof makeOrganisation>>;
beforeAll(async () => {
  org = await makeOrganisation('needs');
});

const needs = {
  people: 4,
  animals: [
    { kind: 'goat', count: 25 },
    { kind: 'laying-hen', count: 40 },
  ],
  gardenArea: 50,
  gardenUnit: 'm2',
  tankSite: 'On the bank above the house',
};

describe('PUT /api/farms/:id/demand (the farmer enters needs)', () => {
  it('writes demand lines with revisions, which the assigned advisor then reads', async () => {
    const res = await putNeeds(await request(`/api/farms/${org.farm.id}/demand`, org.farmer, { method: 'PUT', body: needs }), params({ id: org.farm.id }));
    expect(res.status).toBe(200);
    const advisorView = await getNeeds(await request(`/api/farms/${org.farm.id}/demand`, org.advisor), params({ id: org.farm.id }));
    expect(advisorView.status).toBe(200);
    const { needs: seen } = await advisorView.json();
    const counts = Object.fromEntries(seen.lines.map((l: { kind: string; count: number }) => [l.kind, l.count]));
    expect(counts).toEqual({ 'person-tap-on-plot': 4, goat: 25, 'laying-hen': 40, 'garden-m2': 50 });
    expect(seen.tankSite).toBe('On the bank above the house');
    expect(seen.lines.every((l: { rev: number }) => l.rev > 0)).toBe(true);
  });

  it('changing the needs keeps existing lines (new count, new revision) and drops what is gone', async () => {
    const goat = await DemandLine.findOne({ where: { farmId: org.farm.id, kind: 'goat', deletedAt: null } });
    const body = { ...needs, animals: [{ kind: 'goat', count: 30 }], gardenArea: 1076.39, gardenUnit: 'ft2' };
    const res = await putNeeds(await request(`/api/farms/${org.farm.id}/demand`, org.farmer, { method: 'PUT', body }), params({ id: org.farm.id }));
    const { needs: after } = await res.json();
    const line = after.lines.find((l: { kind: string }) => l.kind === 'goat');
    expect(line.id).toBe(goat?.id);
    expect(line.count).toBe(30);
    expect(line.rev).toBeGreaterThan(Number(goat?.rev));
    expect(after.lines.map((l: { kind: string }) => l.kind)).not.toContain('laying-hen');
    expect(after.gardenM2).toBe(100); // 1,076.39 ft² is 100 m² (1 ft = 0.3048 m)
    const dropped = await DemandLine.findOne({ where: { farmId: org.farm.id, kind: 'laying-hen' } });
    expect(dropped?.deletedAt).not.toBeNull();
  });

  it('bad input is a 422 naming the field, and changes nothing', async () => {
    const before = await DemandLine.count({ where: { farmId: org.farm.id, deletedAt: null } });
    const res = await putNeeds(
      await request(`/api/farms/${org.farm.id}/demand`, org.farmer, { method: 'PUT', body: { ...needs, people: -2 } }),
      params({ id: org.farm.id }),
    );
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toMatch(/people: The number of people cannot be negative/);
    expect(await DemandLine.count({ where: { farmId: org.farm.id, deletedAt: null } })).toBe(before);
  });

  it("another farmer can neither read nor write this farm's needs (404: as if the farm did not exist)", async () => {
    const get = await getNeeds(await request(`/api/farms/${org.farm.id}/demand`, org.otherFarmer), params({ id: org.farm.id }));
    expect(get.status).toBe(404);
    const put = await putNeeds(await request(`/api/farms/${org.farm.id}/demand`, org.otherFarmer, { method: 'PUT', body: needs }), params({ id: org.farm.id }));
    expect(put.status).toBe(404);
    const advisor = await getNeeds(await request(`/api/farms/${org.farm.id}/demand`, org.otherAdvisor), params({ id: org.farm.id }));
    expect(advisor.status).toBe(404);
  });
});
