import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { GET as getExport } from '@/app/api/visits/export.csv/route';
import { GET as getVisits } from '@/app/api/visits/route';
import { getSequelize } from '@/lib/server/db';
import { VERDICTS, VISIT_STATUSES, type Verdict, type VisitStatus } from '@/lib/shared/domain';
import { makeOrganisation, params, request } from './support/fixtures';

// 2,000 visits in an organisation of their own, made with a seeded generator so every filter has
// rows to find and rows to leave out; the expected rows are worked out here from the same data.
type Org = Awaited<ReturnType<typeof makeOrganisation>>;
interface Seeded {
  id: string;
  farmId: string;
  farmName: string;
  area: string;
  farmer: string;
  advisorId: string | null;
  plannedOn: string | null;
  status: VisitStatus;
  verdict: Verdict | null;
}

let org: Org;
const rows: Seeded[] = [];
const AREAS = ['North fell', 'Hafod spring line', 'Lower river', 'Ridge 50% slope'];
const N = 2000;

function rng(seed: number) {
  let s = seed >>> 0;
  return () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
}

beforeAll(async () => {
  org = await makeOrganisation('filters');
  const qi = getSequelize().getQueryInterface();
  const random = rng(42);
  const now = new Date();
  const farms = Array.from({ length: 40 }, (_, i) => ({
    id: randomUUID(),
    name: `Farm ${String(i).padStart(2, '0')} ${i % 7 === 0 ? 'Brookside' : 'Meadow'}`,
    area: AREAS[i % AREAS.length]!,
    ownerId: i % 2 ? org.farmer.id : org.otherFarmer.id,
  }));
  await qi.bulkInsert(
    'farms',
    farms.map((f) => ({
      id: f.id,
      organisation_id: org.organisationId,
      owner_id: f.ownerId,
      name: f.name,
      area: f.area,
      notes: '',
      rev: 0,
      created_at: now,
      updated_at: now,
    })),
  );
  const advisors = [org.advisor.id, org.otherAdvisor.id, null];
  for (let i = 0; i < N; i += 1) {
    const farm = farms[Math.floor(random() * farms.length)]!;
    const day = 1 + Math.floor(random() * 28);
    const month = 1 + Math.floor(random() * 12);
    const status = VISIT_STATUSES[Math.floor(random() * VISIT_STATUSES.length)]!;
    const verdict = random() < 0.4 ? VERDICTS[Math.floor(random() * VERDICTS.length)]! : null;
    rows.push({
      id: randomUUID(),
      farmId: farm.id,
      farmName: farm.name,
      area: farm.area,
      farmer: farm.ownerId === org.farmer.id ? org.farmer.name : org.otherFarmer.name,
      advisorId: advisors[Math.floor(random() * advisors.length)]!,
      plannedOn: random() < 0.1 ? null : `2025-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`,
      status,
      verdict,
    });
  }
  for (let i = 0; i < rows.length; i += 500) {
    await qi.bulkInsert(
      'visits',
      rows.slice(i, i + 500).map((r) => ({
        id: r.id,
        organisation_id: org.organisationId,
        farm_id: r.farmId,
        advisor_id: r.advisorId,
        planned_on: r.plannedOn,
        status: r.status,
        notes: '',
        rev: 0,
        created_at: now,
        updated_at: now,
      })),
    );
  }
  // An older screening with a different verdict first: only the latest one counts.
  const screened = rows.filter((r) => r.verdict);
  const screening = (visitId: string, verdict: string, at: Date) => ({
    id: randomUUID(),
    visit_id: visitId,
    engine_version: 'test',
    inputs_hash: '0'.repeat(64),
    inputs: '{}',
    result: '{}',
    verdict,
    created_at: at,
  });
  await qi.bulkInsert(
    'screenings',
    screened.map((r) => screening(r.id, r.verdict === 'go' ? 'no-go' : 'go', new Date(now.getTime() - 86_400_000))),
  );
  await qi.bulkInsert(
    'screenings',
    screened.map((r) => screening(r.id, r.verdict!, now)),
  );
  // makeOrganisation's own two visits are part of the organisation too.
  rows.push(
    {
      id: org.visit.id,
      farmId: org.farm.id,
      farmName: org.farm.name,
      area: 'test',
      farmer: org.farmer.name,
      advisorId: org.advisor.id,
      plannedOn: '2026-12-10',
      status: 'scheduled',
      verdict: null,
    },
    {
      id: org.otherVisit.id,
      farmId: org.otherFarm.id,
      farmName: org.otherFarm.name,
      area: 'test',
      farmer: org.otherFarmer.name,
      advisorId: org.otherAdvisor.id,
      plannedOn: '2026-12-11',
      status: 'scheduled',
      verdict: null,
    },
  );
}, 120_000);

async function fetchAll(query: string): Promise<{ ids: string[]; total: number }> {
  const ids: string[] = [];
  let total = 0;
  for (let page = 1; ; page += 1) {
    const res = await getVisits(await request(`/api/visits?${query}&pageSize=100&page=${page}`, org.coordinator), params({}));
    expect(res.status).toBe(200);
    const body = await res.json();
    total = body.total;
    ids.push(...(body.items as { id: string }[]).map((v) => v.id));
    if (page * 100 >= total) break;
  }
  return { ids, total };
}

const sorted = (ids: string[]) => [...ids].sort();

describe('visits list on 2,000 visits', () => {
  it('pages cover the whole organisation exactly once', async () => {
    const { ids, total } = await fetchAll('sort=planned&dir=asc');
    expect(total).toBe(N + 2);
    expect(new Set(ids).size).toBe(N + 2);
    expect(sorted(ids)).toEqual(sorted(rows.map((r) => r.id)));
  });

  it.each([
    ['status', 'status=screened', (r: Seeded) => r.status === 'screened'],
    [
      'planned date range',
      'plannedFrom=2025-03-01&plannedTo=2025-04-15',
      (r: Seeded) => !!r.plannedOn && r.plannedOn >= '2025-03-01' && r.plannedOn <= '2025-04-15',
    ],
    ['area', `area=${encodeURIComponent('Hafod spring line')}`, (r: Seeded) => r.area === 'Hafod spring line'],
    ['verdict (latest screening)', 'verdict=conditional', (r: Seeded) => r.verdict === 'conditional'],
    ['no screening yet', 'verdict=none', (r: Seeded) => r.verdict === null],
    ['text search on the farm', 'q=brookside', (r: Seeded) => r.farmName.toLowerCase().includes('brookside')],
  ])('filter by %s returns exactly the matching rows', async (_name, query, keep) => {
    const expected = rows.filter(keep).map((r) => r.id);
    expect(expected.length).toBeGreaterThan(0);
    expect(expected.length).toBeLessThan(rows.length);
    const { ids, total } = await fetchAll(query);
    expect(total).toBe(expected.length);
    expect(sorted(ids)).toEqual(sorted(expected));
  });

  it('filters by advisor, by "not assigned", and by farmer name, combined with a status', async () => {
    for (const [query, keep] of [
      [`advisor=${org.otherAdvisor.id}&status=requested`, (r: Seeded) => r.advisorId === org.otherAdvisor.id && r.status === 'requested'],
      ['advisor=none', (r: Seeded) => r.advisorId === null],
      [`q=${encodeURIComponent(org.otherFarmer.name)}`, (r: Seeded) => r.farmer === org.otherFarmer.name],
    ] as const) {
      const expected = rows.filter(keep).map((r) => r.id);
      const { ids } = await fetchAll(query);
      expect(sorted(ids), query).toEqual(sorted(expected));
    }
  });

  it('a search for "%" is literal text, not a wildcard', async () => {
    const expected = rows.filter((r) => r.farmName.includes('%')).map((r) => r.id);
    const { total } = await fetchAll('q=%25');
    expect(total).toBe(expected.length);
  });

  it('sorts by farm name ascending across pages', async () => {
    const res = await getVisits(await request('/api/visits?sort=farm&dir=asc&pageSize=100&page=3', org.coordinator), params({}));
    const names = ((await res.json()).items as { farm: { name: string } }[]).map((v) => v.farm.name);
    expect(names).toEqual([...names].sort((a, b) => a.localeCompare(b)));
    const expectedThirdPage = rows
      .map((r) => r.farmName)
      .sort((a, b) => a.localeCompare(b))
      .slice(200, 300);
    expect(names).toEqual(expectedThirdPage);
  });

  it('a bad filter is a 422 naming it, not a 500', async () => {
    for (const query of ['verdict=maybe', 'plannedFrom=yesterday', 'sort=colour', 'plannedFrom=2025-05-01&plannedTo=2025-04-01']) {
      const res = await getVisits(await request(`/api/visits?${query}`, org.coordinator), params({}));
      expect(res.status, query).toBe(422);
    }
  });

  it('the CSV export holds exactly the filtered rows, in the same order as the list', async () => {
    const query = 'plannedFrom=2025-06-01&plannedTo=2025-09-30&sort=farm&dir=asc';
    const { ids } = await fetchAll(query);
    const res = await getExport(await request(`/api/visits/export.csv?${query}`, org.coordinator), params({}));
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toContain('text/csv');
    const lines = (await res.text())
      .replace(/^\uFEFF/, '')
      .trimEnd()
      .split('\r\n');
    expect(lines[0]).toContain('Farm,Area,Farmer');
    const csvIds = lines.slice(1).map((l) => l.split(',').at(-1));
    expect(csvIds).toEqual(ids);
  });
});
