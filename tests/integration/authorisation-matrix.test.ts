// The authorisation matrix: every API route × every role × own / other-advisor / other-organisation
// resources, the expected status computed from ROLE_PERMISSIONS (not written by hand per cell).
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLE_PERMISSIONS, scopeOf, type Permission } from '@/lib/server/auth/permissions';
import { ROLES, type Role } from '@/lib/shared/domain';
import { params } from './support/fixtures';
import { ROUTES, routeParams, type GuardedRoute, handlerOf, type HttpMethod } from './support/route-table';
import { callerOf, makeWorld, REACHES, resourceFor, type Reach, type World } from './support/world';

const METHODS: HttpMethod[] = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'];
const root = path.resolve(__dirname, '../..');

/** Every app/api/**\/route.ts on disk, relative to the repo. */
function routeFiles(): string[] {
  return (readdirSync(path.join(root, 'app/api'), { recursive: true }) as string[])
    .filter((f) => f.endsWith('route.ts'))
    .map((f) => `app/api/${f.split(path.sep).join('/')}`)
    .sort();
}

/** What the permission table says a role gets on a resource of that reach. */
export function allowed(role: Role, permissions: readonly Permission[], reach: Reach | 'none'): boolean {
  return permissions.every((permission) => {
    const scope = scopeOf(role, permission);
    if (!scope) return false;
    if (scope === 'self' || reach === 'none' || reach === 'own') return true;
    return reach === 'other-advisor' && scope === 'organisation';
  });
}

const guarded = ROUTES.filter((r): r is GuardedRoute => !('public' in r));
let cells = 0;

describe('the route table covers every route file and method', () => {
  it('every route file on disk has an entry for each method it exports, and every entry exists', async () => {
    const files = routeFiles();
    expect(files.length).toBeGreaterThan(20);
    const onDisk: string[] = [];
    for (const file of files) {
      const entry = ROUTES.find((r) => r.file === file);
      expect(entry, `${file} has no entry in tests/integration/support/route-table.ts`).toBeDefined();
      if (entry && 'public' in entry && file.includes('nextauth')) {
        onDisk.push(`GET ${file}`, `POST ${file}`);
        continue;
      }
      const g = guarded.find((r) => r.file === file);
      const mod: Record<string, unknown> = g ? await g.load() : await import(/* @vite-ignore */ path.join(root, file));
      for (const method of METHODS) if (typeof mod[method] === 'function') onDisk.push(`${method} ${file}`);
    }
    expect(ROUTES.map((r) => `${r.method} ${r.file}`).sort()).toEqual(onDisk.sort());
  });

  it('every permission in the table guards at least one route', () => {
    const used = new Set(guarded.flatMap((r) => r.permissions));
    expect(Object.keys(ROLE_PERMISSIONS).filter((p) => !used.has(p as Permission))).toEqual([]);
  });
});

for (const route of guarded) {
  describe(`${route.method} ${route.file}`, () => {
    let world: World;
    let mod: object;
    beforeAll(async () => {
      world = await makeWorld(route.target, 'matrix');
      mod = await route.load();
    });

    const call = async (role: Role | undefined, reach: Reach) => {
      const handler = handlerOf(mod, route.method);
      const resource = resourceFor(world, route.target, reach);
      const req = await route.build(role ? callerOf(world.org, role) : undefined, resource);
      const res = await handler(req, params(routeParams(route.file, req.nextUrl)));
      return { res, status: route.effectiveStatus ? await route.effectiveStatus(res.clone()) : res.status };
    };

    it('without a session is 401 with a message', async () => {
      const { res } = await call(undefined, 'own');
      expect(res.status).toBe(401);
      expect((await res.json()).error.message).toMatch(/sign in/i);
      cells += 1;
    });

    for (const role of ROLES) {
      const reaches = route.target === 'none' ? (['own'] as const) : route.target === 'person' ? (['own', 'other-org'] as const) : REACHES;
      for (const reach of reaches) {
        const ok = allowed(role, route.permissions, route.target === 'none' ? 'none' : reach);
        // A role without the permission is stopped at the door (403); a record out of the caller's
        // reach answers as if it did not exist (404: its existence is not given away); a foreign id
        // in a body is a field error.
        const outOfReach = !ok && allowed(role, route.permissions, 'own');
        const inBody = outOfReach ? route.refusedInBody : undefined;
        const expected = ok ? route.ok : (inBody?.status ?? (outOfReach ? 404 : 403));
        it(`${role} on ${route.target === 'none' ? 'the collection' : `a ${route.target} (${reach})`} is ${expected}`, async () => {
          const { res, status } = await call(role, reach);
          const body = res.headers.get('content-type')?.includes('json') ? await res.clone().json() : null;
          expect(status, JSON.stringify(body)).toBe(expected);
          if (!ok) expect(body?.error?.message ?? JSON.stringify(body)).toMatch(inBody?.message ?? (outOfReach ? /no such/i : /access|refused|not allowed/i));
          cells += 1;
        });
      }
    }
  });
}

afterAll(() => {
  console.log(
    `[matrix] ${cells} cells checked over ${guarded.length} guarded route methods × ${ROLES.length} roles (+ ${ROUTES.length - guarded.length} public)`,
  );
});
