// Sessions: the cookie settings next-auth is given, and a still-valid JWT of an account that was
// switched off (or whose sessions were ended) refused on every guarded API route.
import { encode } from 'next-auth/jwt';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { authCookieOptions, sessionCookieName } from '@/lib/server/auth/cookies';
import { getRequestUser } from '@/lib/server/auth/current-user';
import { authOptions } from '@/lib/server/auth/options';
import { scopeOf } from '@/lib/server/auth/permissions';
import { User } from '@/lib/server/db';
import { ROLES } from '@/lib/shared/domain';
import { makeOrganisation, params, request, sessionCookie, type TestUser } from './support/fixtures';
import { ROUTES, handlerOf, routeParams, type GuardedRoute, type Target } from './support/route-table';
import { callerOf, makeWorld, resourceFor, type World } from './support/world';

describe('the session cookie', () => {
  it('over plain http: HttpOnly, SameSite=Lax, not Secure, no prefix', () => {
    const { useSecureCookies, cookies } = authCookieOptions('http://127.0.0.1:3100');
    expect(useSecureCookies).toBe(false);
    expect(cookies.sessionToken?.name).toBe('next-auth.session-token');
    expect(cookies.sessionToken?.options).toMatchObject({ httpOnly: true, sameSite: 'lax', path: '/', secure: false });
  });

  it('over https: Secure and __Secure- prefixed (next-auth then makes its other cookies Secure too)', () => {
    const { useSecureCookies, cookies } = authCookieOptions('https://fallbook.example.org');
    expect(useSecureCookies).toBe(true);
    expect(cookies.sessionToken?.name).toBe('__Secure-next-auth.session-token');
    expect(cookies.sessionToken?.options).toMatchObject({ httpOnly: true, sameSite: 'lax', path: '/', secure: true });
  });

  it('the options next-auth runs with are these (the test profile is plain http)', () => {
    expect(authOptions.useSecureCookies).toBe(false);
    expect(authOptions.cookies?.sessionToken?.options).toMatchObject({ httpOnly: true, sameSite: 'lax', secure: false });
    expect(authOptions.session?.strategy).toBe('jwt');
  });

  it('behind https the server reads only the __Secure- cookie', async () => {
    const org = await makeOrganisation('cookie');
    const token = (await sessionCookie(org.advisor)).split('=')[1] ?? '';
    const saved = process.env.NEXTAUTH_URL;
    process.env.NEXTAUTH_URL = 'https://fallbook.example.org';
    try {
      const secureName = sessionCookieName(process.env.NEXTAUTH_URL);
      const plain = await request('/api/me', undefined, { headers: { cookie: `next-auth.session-token=${token}` } });
      const secure = await request('/api/me', undefined, { headers: { cookie: `${secureName}=${token}` } });
      expect(await getRequestUser(plain)).toBeNull();
      expect((await getRequestUser(secure))?.id).toBe(org.advisor.id);
    } finally {
      process.env.NEXTAUTH_URL = saved;
    }
  });

  it('a token signed with another secret is refused', async () => {
    const org = await makeOrganisation('forged');
    const token = await encode({
      secret: 'some-other-secret-0123456789abcdef',
      token: { uid: org.coordinator.id, role: 'coordinator', organisationId: org.organisationId, sessionVersion: 1 },
    });
    const req = await request('/api/me', undefined, { headers: { cookie: `next-auth.session-token=${token}` } });
    expect(await getRequestUser(req)).toBeNull();
  });
});

const guarded = ROUTES.filter((r): r is GuardedRoute => !('public' in r));
const worlds = new Map<Target, World>();
let refused = 0;

beforeAll(async () => {
  for (const target of new Set(guarded.map((r) => r.target))) worlds.set(target, await makeWorld(target, 'session'));
}, 120_000);

/** Calls the route as `user` (who may use it) on its own resource. */
async function call(route: GuardedRoute, world: World, user: TestUser): Promise<Response> {
  const req = await route.build(user, resourceFor(world, route.target, 'own'));
  return handlerOf(await route.load(), route.method)(req, params(routeParams(route.file, req.nextUrl)));
}

for (const [what, end, restore] of [
  ['switched off', { active: false }, { active: true }],
  ['sessions ended (session version bumped)', { sessionVersion: 2 }, { sessionVersion: 1 }],
] as const) {
  describe(`an account ${what}: its unexpired JWT is refused on every guarded route`, () => {
    for (const route of guarded) {
      const role = ROLES.find((r) => route.permissions.every((p) => scopeOf(r, p)));
      it(`${route.method} ${route.file} as ${role}: 401`, async () => {
        const world = worlds.get(route.target);
        if (!role || !world) throw new Error('no caller for the route');
        const user = callerOf(world.org, role);
        const account = await User.findByPk(user.id);
        if (!account) throw new Error('fixture user missing');
        await account.update(end);
        try {
          const res = await call(route, world, user);
          expect(res.status).toBe(401);
          expect((await res.json()).error.message).toMatch(/sign in/i);
          refused += 1;
        } finally {
          await account.update(restore);
        }
      });
    }
  });
}

describe('the same JWT of an active account still works (the refusals above are not blanket)', () => {
  it('GET /api/me answers 200', async () => {
    const world = worlds.get('none');
    if (!world) throw new Error('no world');
    const mod = await import('@/app/api/me/route');
    const res = await mod.GET(await request('/api/me', world.org.advisor), params({}));
    expect(res.status).toBe(200);
  });
});

afterAll(() => {
  console.log(`[sessions] ${refused} refusals: ${guarded.length} guarded route methods × 2 (switched off, sessions ended)`);
});
