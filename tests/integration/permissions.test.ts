import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { GET as getFarms } from '@/app/api/farms/route';
import { GET as getMe } from '@/app/api/me/route';
import { GET as getPeople } from '@/app/api/people/route';
import { GET as getVisits } from '@/app/api/visits/route';
import { GET as getVisit } from '@/app/api/visits/[id]/route';
import { ROLE_PERMISSIONS, scopeOf, type Permission } from '@/lib/server/auth/permissions';
import { ROLES } from '@/lib/shared/domain';
import { User } from '@/lib/server/db';
import { makeOrganisation, params, request, type TestUser } from './support/fixtures';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let org: Org;
let otherOrg: Org;

beforeAll(async () => {
  org = await makeOrganisation('perm');
  otherOrg = await makeOrganisation('perm-other');
});

const userOf = (o: Org, role: (typeof ROLES)[number]): TestUser => (role === 'coordinator' ? o.coordinator : role === 'advisor' ? o.advisor : o.farmer);

// Collection routes: the status each role gets follows the permission table.
const collectionRoutes: { path: string; permission: Permission; handler: typeof getVisits }[] = [
  { path: '/api/me', permission: 'profile:read', handler: getMe },
  { path: '/api/visits', permission: 'visit:read', handler: getVisits },
  { path: '/api/farms', permission: 'farm:read', handler: getFarms },
  { path: '/api/people', permission: 'people:read', handler: getPeople },
];

describe('collection routes × roles, as the permission table says', () => {
  for (const route of collectionRoutes) {
    it(`${route.path} without a session is 401`, async () => {
      const res = await route.handler(await request(route.path), params({}));
      expect(res.status).toBe(401);
      expect((await res.json()).error.message).toMatch(/sign in/i);
    });
    for (const role of ROLES) {
      const expected = scopeOf(role, route.permission) ? 200 : 403;
      it(`${route.path} as ${role} is ${expected}`, async () => {
        const res = await route.handler(await request(route.path, userOf(org, role)), params({}));
        expect(res.status).toBe(expected);
      });
    }
  }

  it('every permission in the table names a scope for at least one role', () => {
    for (const [permission, row] of Object.entries(ROLE_PERMISSIONS)) {
      expect(Object.keys(row).length, permission).toBeGreaterThan(0);
    }
  });
});

describe('lists are scoped to what the caller may see', () => {
  const ids = async (user: TestUser) => {
    const res = await getVisits(await request('/api/visits?pageSize=100', user), params({}));
    return ((await res.json()).items as { id: string }[]).map((v) => v.id);
  };

  it('a coordinator sees the whole organisation and nothing of another', async () => {
    const seen = await ids(org.coordinator);
    expect(seen).toEqual(expect.arrayContaining([org.visit.id, org.otherVisit.id]));
    expect(seen).not.toContain(otherOrg.visit.id);
  });

  it('an advisor sees only the visits assigned to them', async () => {
    expect(await ids(org.advisor)).toEqual([org.visit.id]);
  });

  it("a farmer sees only their own farm's visits", async () => {
    expect(await ids(org.farmer)).toEqual([org.visit.id]);
  });

  it('a bad query is a 422 naming the field, not a 500', async () => {
    const res = await getVisits(await request('/api/visits?pageSize=5000', org.coordinator), params({}));
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toMatch(/pageSize/);
  });
});

describe('one visit: role and ownership', () => {
  const get = async (user: TestUser | undefined, id: string) => (await getVisit(await request(`/api/visits/${id}`, user), params({ id }))).status;

  it('allows the coordinator, the assigned advisor and the farm owner', async () => {
    expect(await get(org.coordinator, org.visit.id)).toBe(200);
    expect(await get(org.advisor, org.visit.id)).toBe(200);
    expect(await get(org.farmer, org.visit.id)).toBe(200);
  });

  it("refuses another advisor's visit, another farmer's visit and another organisation's visit (404: their existence is not given away)", async () => {
    expect(await get(org.advisor, org.otherVisit.id)).toBe(404);
    expect(await get(org.farmer, org.otherVisit.id)).toBe(404);
    expect(await get(org.coordinator, otherOrg.visit.id)).toBe(404);
  });

  it('answers 401 without a session, 404 for no such visit, 422 for a malformed id', async () => {
    expect(await get(undefined, org.visit.id)).toBe(401);
    expect(await get(org.coordinator, randomUUID())).toBe(404);
    expect(await get(org.coordinator, 'not-a-uuid')).toBe(422);
  });
});

describe('sessions end with the account', () => {
  it('a deactivated user is 401 at once, whatever the cookie says', async () => {
    const o = await makeOrganisation('deact');
    expect((await getMe(await request('/api/me', o.advisor), params({}))).status).toBe(200);
    await User.update({ active: false }, { where: { id: o.advisor.id } });
    expect((await getMe(await request('/api/me', o.advisor), params({}))).status).toBe(401);
  });

  it('a bumped session version ends older sessions', async () => {
    const o = await makeOrganisation('version');
    await User.update({ sessionVersion: 2 }, { where: { id: o.farmer.id } });
    expect((await getMe(await request('/api/me', o.farmer), params({}))).status).toBe(401);
    expect((await getMe(await request('/api/me', { ...o.farmer, sessionVersion: 2 }), params({}))).status).toBe(200);
  });

  it('a forged cookie signed with another secret is 401', async () => {
    const o = await makeOrganisation('forged');
    const { encode } = await import('next-auth/jwt');
    const token = await encode({
      secret: 'some-other-secret-0123456789',
      token: { uid: o.coordinator.id, sessionVersion: 1, role: 'coordinator', organisationId: o.organisationId },
    });
    const req = await request('/api/me', undefined, { headers: { cookie: `next-auth.session-token=${token}` } });
    expect((await getMe(req, params({}))).status).toBe(401);
  });
});
