// Cross-site writes: every mutating route in the route table (so a new route is covered the day it
// is added), sent as a valid request by a signed-in person who may use it, but from another site —
// by Origin, by Sec-Fetch-Site, or both — is refused with 403 and changes nothing.
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { NextRequest } from 'next/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { scopeOf } from '@/lib/server/auth/permissions';
import { getSequelize } from '@/lib/server/db';
import { ROLES } from '@/lib/shared/domain';
import { params } from './support/fixtures';
import { ROUTES, handlerOf, routeParams, type GuardedRoute, type HttpMethod, type PublicRoute, type Target } from './support/route-table';
import { callerOf, makeWorld, resourceFor, type World } from './support/world';

const mutating = ROUTES.filter((r): r is GuardedRoute => !('public' in r) && r.method !== 'GET');
// Public writes check the origin themselves; next-auth's own POSTs carry its CSRF token instead.
const publicWrites = ROUTES.filter((r): r is PublicRoute => 'public' in r && r.method !== 'GET' && !r.file.includes('[...nextauth]'));
const root = path.resolve(__dirname, '../..');

/** How the request claims to come from elsewhere. */
const DISGUISES: Record<string, Record<string, string>> = {
  'Origin of another site': { origin: 'https://fallbook.evil.example' },
  'Sec-Fetch-Site: cross-site': { 'sec-fetch-site': 'cross-site' },
  'Sec-Fetch-Site: same-site (a sibling sub-domain)': { 'sec-fetch-site': 'same-site' },
  'Origin: null (a sandboxed frame)': { origin: 'null' },
  'Origin of another site, with X-Forwarded-Host made to match it': { origin: 'https://fallbook.evil.example', 'x-forwarded-host': 'fallbook.evil.example' },
  'Origin of this host over another scheme (https page → http app)': { origin: 'https://127.0.0.1:3100' },
};

/** Rows that any accepted write leaves behind (every mutation writes an audit line; sync keeps its ops). */
async function footprint(): Promise<string> {
  const rows = await getSequelize().query<{ a: number; s: number; p: number }>(
    'SELECT (SELECT COUNT(*) FROM audit_log) AS a, (SELECT COUNT(*) FROM sync_ops) AS s, (SELECT COUNT(*) FROM photos) AS p',
    { type: QueryTypes.SELECT },
  );
  return JSON.stringify(rows[0]);
}

/** The same request with the disguise's headers (and the same body). */
async function disguised(req: NextRequest, extra: Record<string, string>): Promise<NextRequest> {
  const headers = new Headers(req.headers);
  for (const [name, value] of Object.entries(extra)) headers.set(name, value);
  const body = await req.arrayBuffer();
  return new NextRequest(req.url, { method: req.method, headers, body: body.byteLength ? body : undefined });
}

const worlds = new Map<Target, World>();
let refused = 0;

/** Sends the request to the route's handler: 403 naming the cross-site refusal, and nothing stored. */
async function expectRefused(mod: object, route: { method: HttpMethod; file: string }, req: NextRequest) {
  const before = await footprint();
  const res = await handlerOf(mod, route.method)(req, params(routeParams(route.file, req.nextUrl)));
  expect(res.status).toBe(403);
  expect((await res.json()).error.message).toMatch(/cross-site/i);
  expect(await footprint()).toBe(before);
  refused += 1;
}

beforeAll(async () => {
  for (const target of new Set(mutating.map((r) => r.target))) worlds.set(target, await makeWorld(target, 'xsite'));
}, 120_000);

describe('cross-site writes are refused on every mutating route', () => {
  it('the route table has mutating routes to check', () => {
    expect(mutating.length).toBeGreaterThan(10);
  });

  for (const route of mutating) {
    // The first role the permission table lets through on its own resource.
    const role = ROLES.find((r) => route.permissions.every((p) => scopeOf(r, p)));
    for (const [name, headers] of Object.entries(DISGUISES)) {
      it(`${route.method} ${route.file} as ${role}, ${name}: 403, nothing stored`, async () => {
        expect(role, 'some role may use the route').toBeDefined();
        if (!role) return;
        const world = worlds.get(route.target);
        if (!world) throw new Error(`no world for ${route.target}`);
        const mod = await route.load();
        const req = await disguised(await route.build(callerOf(world.org, role), resourceFor(world, route.target, 'own')), headers);
        await expectRefused(mod, route, req);
      });
    }
  }
});

describe('public routes that write refuse cross-site requests too', () => {
  for (const route of publicWrites) {
    for (const [name, headers] of Object.entries(DISGUISES)) {
      it(`${route.method} ${route.file}, ${name}: 403, nothing stored`, async () => {
        // A made-up value for each [param]: the origin check comes before anything is looked up.
        const url = route.file
          .replace(/^app/, '')
          .replace(/\/route\.ts$/, '')
          .replace(/\[(\w+)\]/g, 'cross-site-$1');
        const req = new NextRequest(new URL(url, 'http://127.0.0.1:3100'), {
          method: route.method,
          body: JSON.stringify({ password: 'a-long-enough-password', name: 'Cross Site' }),
          headers: { 'content-type': 'application/json', host: '127.0.0.1:3100', ...headers },
        });
        const mod: object = await import(/* @vite-ignore */ path.join(root, route.file));
        await expectRefused(mod, route, req);
      });
    }
  }
});

describe('the check is not a blanket refusal', () => {
  it('the same request from the app itself (Origin and Sec-Fetch-Site: same-origin) gets through', async () => {
    const route = mutating[0];
    if (!route) throw new Error('no mutating route');
    const role = ROLES.find((r) => route.permissions.every((p) => scopeOf(r, p)));
    const world = worlds.get(route.target);
    if (!role || !world) throw new Error('no caller');
    const mod = await route.load();
    const req = await disguised(await route.build(callerOf(world.org, role), resourceFor(world, route.target, 'own')), { 'sec-fetch-site': 'same-origin' });
    const res = await handlerOf(mod, route.method)(req, params(routeParams(route.file, req.nextUrl)));
    const status = route.effectiveStatus ? await route.effectiveStatus(res.clone()) : res.status;
    expect(status, `${route.method} ${route.file}: ${await res.clone().text()}`).toBe(route.ok);
  });
});

afterAll(() => {
  console.log(
    `[cross-site] ${refused} refused: (${mutating.length} guarded + ${publicWrites.length} public) mutating route methods × ${Object.keys(DISGUISES).length} disguises`,
  );
});
