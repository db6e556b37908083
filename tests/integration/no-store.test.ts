// Answers about a person (every guarded route, photos included) carry Cache-Control: no-store, so a
// shared or later browser profile finds nothing of theirs in its cache after sign-out.
import { beforeAll, describe, expect, it } from 'vitest';
import { scopeOf } from '@/lib/server/auth/permissions';
import { ROLES } from '@/lib/shared/domain';
import { params } from './support/fixtures';
import { ROUTES, handlerOf, routeParams, type GuardedRoute, type Target } from './support/route-table';
import { callerOf, makeWorld, resourceFor, type World } from './support/world';

const reads = ROUTES.filter((r): r is GuardedRoute => !('public' in r) && r.method === 'GET');
const worlds = new Map<Target, World>();

beforeAll(async () => {
  for (const target of new Set(reads.map((r) => r.target))) worlds.set(target, await makeWorld(target, 'no-store'));
}, 120_000);

describe('Cache-Control on personal answers', () => {
  for (const route of reads) {
    it(`GET ${route.file}: no-store`, async () => {
      const role = ROLES.find((r) => route.permissions.every((p) => scopeOf(r, p)));
      const world = worlds.get(route.target);
      if (!role || !world) throw new Error('no caller for the route');
      const req = await route.build(callerOf(world.org, role), resourceFor(world, route.target, 'own'));
      const res = await handlerOf(await route.load(), 'GET')(req, params(routeParams(route.file, req.nextUrl)));
      expect(res.status).toBe(route.ok);
      expect(res.headers.get('cache-control') ?? '').toMatch(/no-store/);
    });
  }
});
