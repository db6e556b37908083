import { beforeAll, describe, expect, it } from 'vitest';
import { GET as getFarm, PATCH as patchFarm } from '@/app/api/farms/[id]/route';
import { POST as postFarm } from '@/app/api/farms/route';
import { GET as getSettings, PUT as putSettings } from '@/app/api/organisation/settings/route';
import { PATCH as patchPerson } from '@/app/api/people/[id]/route';
import { POST as postInvitation } from '@/app/api/people/invitations/route';
import { PUT as putAssignment } from '@/app/api/visits/[id]/assignment/route';
import { GET as getAudit } from '@/app/api/visits/[id]/audit/route';
import { PATCH as patchVisit } from '@/app/api/visits/[id]/route';
import { POST as postAssignments } from '@/app/api/visits/assignments/route';
import { GET as getExport } from '@/app/api/visits/export.csv/route';
import { POST as postVisit } from '@/app/api/visits/route';
import { ROLES, type Role } from '@/lib/shared/domain';
import { makeOrganisation, params, request, type TestUser } from './support/fixtures';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;
let other: Org;

beforeAll(async () => {
  org = await makeOrganisation('office-perm');
  other = await makeOrganisation('office-perm-other');
});

const userOf = (o: Org, role: Role): TestUser => (role === 'coordinator' ? o.coordinator : role === 'advisor' ? o.advisor : o.farmer);
type Handler = (req: import('next/server').NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

// Each office route, with a body that is valid for its organisation `o`. Bodies are built per call
// (they name records of the organisation under test), `target` is the record id in the path.
interface Case {
  name: string;
  method: string;
  handler: Handler;
  path: (o: Org) => string;
  id?: (o: Org) => string;
  body?: (o: Org) => unknown;
  ok: number;
}
const cases: Case[] = [
  {
    name: 'POST /api/visits',
    method: 'POST',
    handler: postVisit as Handler,
    path: () => '/api/visits',
    body: (o) => ({ farmId: o.farm.id, confirmDuplicate: true }),
    ok: 201,
  },
  { name: 'GET /api/visits/export.csv', method: 'GET', handler: getExport as Handler, path: () => '/api/visits/export.csv', ok: 200 },
  {
    name: 'PATCH /api/visits/:id',
    method: 'PATCH',
    handler: patchVisit as Handler,
    path: (o) => `/api/visits/${o.visit.id}`,
    id: (o) => o.visit.id,
    body: () => ({ status: 'scheduled' }),
    ok: 200,
  },
  {
    name: 'PUT /api/visits/:id/assignment',
    method: 'PUT',
    handler: putAssignment as Handler,
    path: (o) => `/api/visits/${o.visit.id}/assignment`,
    id: (o) => o.visit.id,
    body: (o) => ({ advisorId: o.advisor.id, plannedOn: '2026-12-10' }),
    ok: 200,
  },
  {
    name: 'GET /api/visits/:id/audit',
    method: 'GET',
    handler: getAudit as Handler,
    path: (o) => `/api/visits/${o.visit.id}/audit`,
    id: (o) => o.visit.id,
    ok: 200,
  },
  {
    name: 'POST /api/visits/assignments',
    method: 'POST',
    handler: postAssignments as Handler,
    path: () => '/api/visits/assignments',
    body: (o) => ({ visitIds: [o.otherVisit.id], advisorId: o.otherAdvisor.id, plannedOn: '2026-12-11' }),
    ok: 200,
  },
  {
    name: 'POST /api/farms',
    method: 'POST',
    handler: postFarm as Handler,
    path: () => '/api/farms',
    body: () => ({ name: 'New paddock', area: 'test', lat: '52,1', lon: '-3.5' }),
    ok: 201,
  },
  { name: 'GET /api/farms/:id', method: 'GET', handler: getFarm as Handler, path: (o) => `/api/farms/${o.farm.id}`, id: (o) => o.farm.id, ok: 200 },
  {
    name: 'PATCH /api/farms/:id',
    method: 'PATCH',
    handler: patchFarm as Handler,
    path: (o) => `/api/farms/${o.farm.id}`,
    id: (o) => o.farm.id,
    body: (o) => ({ name: `${o.farm.name}`, area: 'renamed area', ownerId: o.farmer.id, lat: null, lon: null }),
    ok: 200,
  },
  {
    name: 'PATCH /api/people/:id',
    method: 'PATCH',
    handler: patchPerson as Handler,
    path: (o) => `/api/people/${o.otherFarmer.id}`,
    id: (o) => o.otherFarmer.id,
    body: () => ({ active: true }),
    ok: 200,
  },
  {
    name: 'POST /api/people/invitations',
    method: 'POST',
    handler: postInvitation as Handler,
    path: () => '/api/people/invitations',
    body: () => ({ name: 'Newcomer', email: `new-${Math.random().toString(36).slice(2, 10)}@fixtures.test`, role: 'advisor' }),
    ok: 201,
  },
  { name: 'GET /api/organisation/settings', method: 'GET', handler: getSettings as Handler, path: () => '/api/organisation/settings', ok: 200 },
  {
    name: 'PUT /api/organisation/settings',
    method: 'PUT',
    handler: putSettings as Handler,
    path: () => '/api/organisation/settings',
    body: () => ({ unitsDefault: 'metric', designFractionOfLowest: 0.6, demandFigures: { sheep: 8 }, pipePrices: [] }),
    ok: 200,
  },
];

async function call(c: Case, o: Org, user: TestUser | undefined) {
  const body = c.body?.(o);
  const req = await request(c.path(o), user, { method: c.method, body });
  const routeParams: Record<string, string> = c.id ? { id: c.id(o) } : {};
  return c.handler(req, params(routeParams));
}

describe('office routes × roles: only coordinators of the same organisation may act', () => {
  for (const c of cases) {
    it(`${c.name} without a session is 401`, async () => {
      expect((await call(c, org, undefined)).status).toBe(401);
    });
    for (const role of ROLES) {
      const expected = role === 'coordinator' ? c.ok : 403;
      it(`${c.name} as ${role} is ${expected}`, async () => {
        const res = await call(c, org, userOf(org, role));
        expect(res.status, await res.clone().text()).toBe(expected);
      });
    }
    if (c.id) {
      it(`${c.name} on another organisation's record is refused (403/404) to its coordinator`, async () => {
        // The path and body name the other organisation's records; the caller is this organisation's coordinator.
        const req = await request(c.path(other), org.coordinator, { method: c.method, body: c.body?.(other) });
        const res = await c.handler(req, params({ id: c.id!(other) }));
        expect([403, 404, 422]).toContain(res.status);
        expect(res.status).not.toBe(c.ok);
      });
    }
  }

  it("bulk assignment naming another organisation's visit changes nothing and is 404", async () => {
    const res = await postAssignments(
      await request('/api/visits/assignments', org.coordinator, {
        method: 'POST',
        body: { visitIds: [org.visit.id, other.visit.id], advisorId: org.advisor.id, plannedOn: '2026-12-20' },
      }),
      params({}),
    );
    expect(res.status).toBe(404);
  });

  it("creating a visit on another organisation's farm is a 422 naming the farm field", async () => {
    const res = await postVisit(await request('/api/visits', org.coordinator, { method: 'POST', body: { farmId: other.farm.id } }), params({}));
    expect(res.status).toBe(422);
    expect((await res.json()).error.fieldErrors.farmId).toBeDefined();
  });

  it('a cross-site write is refused', async () => {
    const req = await request('/api/visits', org.coordinator, { method: 'POST', body: { farmId: org.farm.id }, headers: { origin: 'https://evil.example' } });
    expect((await postVisit(req, params({}))).status).toBe(403);
  });
});
