// Every API route file and method, with the permissions that guard it and how to call it with a
// valid request: the authorisation matrix and the bad-input fuzz both walk this table, and a route
// file with no entry here fails the matrix.
import { createHash, randomUUID } from 'node:crypto';
import { NextRequest } from 'next/server';
import type { Permission } from '@/lib/server/auth/permissions';
import { User } from '@/lib/server/db';
import { request, sessionCookie, type TestUser } from './fixtures';
import { putOp } from './sync';

/** A planned date `n` days from today (planned dates must lie within two years, past ones confirmed). */
export const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** The module's handler for the method (route modules type their params each their own way). */
export function handlerOf(mod: object, method: HttpMethod): Handler {
  const handler: unknown = (mod as Record<string, unknown>)[method];
  if (typeof handler !== 'function') throw new Error(`no ${method} handler`);
  return handler as Handler;
}

/** What a route acts on: its `[id]` param (or, for sync push, the visit its op names). */
export type Target = 'visit' | 'farm' | 'person' | 'photo' | 'none';

/** The resource a cell points at, with what a valid body needs to know about it. */
export interface Resource {
  id: string;
  visitId: string;
  farmId: string;
  advisorId: string | null;
  ownerId: string | null;
  photoBytes?: Buffer;
}

export interface GuardedRoute {
  file: string;
  method: HttpMethod;
  load: () => Promise<object>;
  /** Every permission the request needs; the route's own first, then any the data layer checks. */
  permissions: readonly Permission[];
  target: Target;
  /** The status an allowed caller gets with a valid request. */
  ok: number;
  /** A valid request as `user` against `resource` (its path, query and body). */
  build: (user: TestUser | undefined, resource: Resource | undefined) => Promise<NextRequest>;
  /** A resource named in the body (not the path) is refused as a field error: the status and message. */
  refusedInBody?: { status: number; message: RegExp };
  /** For routes that answer 200 with per-item outcomes (sync push): the status the item got. */
  effectiveStatus?: (res: Response) => Promise<number>;
}

export interface PublicRoute {
  file: string;
  method: HttpMethod;
  public: string;
}

export type RouteEntry = GuardedRoute | PublicRoute;

// As a browser sends them: the Origin of the page and the Host it addressed.
const origin = { origin: 'http://127.0.0.1:3100', host: '127.0.0.1:3100' };
const json = (method: HttpMethod, body: unknown) => ({ method, body, headers: origin });

/** A raw-bytes PUT as the phone sends a photo. */
export async function rawPut(path: string, user: TestUser | undefined, bytes: Buffer): Promise<NextRequest> {
  const headers: Record<string, string> = { 'content-type': 'application/octet-stream', ...origin };
  if (user) headers.cookie = await sessionCookie(user);
  return new NextRequest(new URL(path, 'http://127.0.0.1:3100'), { method: 'PUT', body: new Uint8Array(bytes), headers });
}

export const sha256 = (data: Buffer) => createHash('sha256').update(data).digest('hex');

/**
 * A new account like the caller's (organisation, role, whether it is switched on, its stored session
 * version), for routes that end the caller's sessions: the cell's outcome is the same, and the
 * caller's own sessions live on for the cells after it.
 */
async function throwawayLike(user: TestUser): Promise<TestUser> {
  const stored = await User.findByPk(user.id, { rejectOnEmpty: true });
  const id = randomUUID();
  const email = `throwaway-${id.slice(0, 8)}@fixtures.test`;
  await User.create({
    id,
    organisationId: user.organisationId,
    email,
    name: `${user.name} (copy)`,
    role: user.role,
    passwordHash: null,
    units: 'metric',
    phone: null,
    lastSignInAt: null,
    active: stored.active,
    sessionVersion: stored.sessionVersion,
  });
  return { ...user, id, email };
}

const need = (r: Resource | undefined): Resource => {
  if (!r) throw new Error('this route needs a resource');
  return r;
};

const farmBody = (r: Resource) => ({ name: 'Matrix farm', area: 'test', ownerId: r.ownerId, lat: 52.4, lon: -3.6, notes: '' });

export const ROUTES: RouteEntry[] = [
  { file: 'app/api/auth/[...nextauth]/route.ts', method: 'GET', public: 'next-auth itself (sign-in is covered by sign-in-limit and the sign-in e2e)' },
  { file: 'app/api/auth/[...nextauth]/route.ts', method: 'POST', public: 'next-auth itself (sign-in is covered by sign-in-limit and the sign-in e2e)' },
  { file: 'app/api/health/route.ts', method: 'GET', public: 'liveness probe, says nothing about anyone' },
  { file: 'app/api/invitations/[token]/accept/route.ts', method: 'POST', public: 'the one-time link is the credential' },
  {
    file: 'app/api/me/route.ts',
    method: 'GET',
    load: () => import('@/app/api/me/route'),
    permissions: ['profile:read'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/me', u),
  },
  {
    // Ends the caller's sessions: called as a throwaway account of the same role, so later cells keep theirs.
    file: 'app/api/me/sessions/route.ts',
    method: 'POST',
    load: () => import('@/app/api/me/sessions/route'),
    permissions: ['profile:read'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/me/sessions', u && (await throwawayLike(u)), json('POST', {})),
  },
  {
    file: 'app/api/farms/route.ts',
    method: 'GET',
    load: () => import('@/app/api/farms/route'),
    permissions: ['farm:read'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/farms?page=1&pageSize=10', u),
  },
  {
    file: 'app/api/farms/route.ts',
    method: 'POST',
    load: () => import('@/app/api/farms/route'),
    permissions: ['farm:edit'],
    target: 'none',
    ok: 201,
    build: async (u) => request('/api/farms', u, json('POST', { name: 'New farm', area: 'x', ownerId: null, lat: null, lon: null, notes: '' })),
  },
  {
    file: 'app/api/farms/[id]/route.ts',
    method: 'GET',
    load: () => import('@/app/api/farms/[id]/route'),
    permissions: ['farm:edit'],
    target: 'farm',
    ok: 200,
    build: async (u, r) => request(`/api/farms/${need(r).id}`, u),
  },
  {
    file: 'app/api/farms/[id]/route.ts',
    method: 'PATCH',
    load: () => import('@/app/api/farms/[id]/route'),
    permissions: ['farm:edit'],
    target: 'farm',
    ok: 200,
    build: async (u, r) => request(`/api/farms/${need(r).id}`, u, json('PATCH', farmBody(need(r)))),
  },
  {
    file: 'app/api/farms/[id]/demand/route.ts',
    method: 'GET',
    load: () => import('@/app/api/farms/[id]/demand/route'),
    permissions: ['farm:read'],
    target: 'farm',
    ok: 200,
    build: async (u, r) => request(`/api/farms/${need(r).id}/demand`, u),
  },
  {
    file: 'app/api/farms/[id]/demand/route.ts',
    method: 'PUT',
    load: () => import('@/app/api/farms/[id]/demand/route'),
    permissions: ['demand:edit'],
    target: 'farm',
    ok: 200,
    build: async (u, r) =>
      request(
        `/api/farms/${need(r).id}/demand`,
        u,
        json('PUT', { people: 3, animals: [{ kind: 'goat', count: 12 }], gardenArea: 0, gardenUnit: 'm2', tankSite: 'by the barn' }),
      ),
  },
  {
    file: 'app/api/organisation/settings/route.ts',
    method: 'GET',
    load: () => import('@/app/api/organisation/settings/route'),
    permissions: ['organisation:settings'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/organisation/settings', u),
  },
  {
    file: 'app/api/organisation/settings/route.ts',
    method: 'PUT',
    load: () => import('@/app/api/organisation/settings/route'),
    permissions: ['organisation:settings'],
    target: 'none',
    ok: 200,
    build: async (u) =>
      request('/api/organisation/settings', u, json('PUT', { unitsDefault: 'metric', designFractionOfLowest: 0.5, demandFigures: {}, pipePrices: [] })),
  },
  {
    file: 'app/api/commissionings/route.ts',
    method: 'GET',
    load: () => import('@/app/api/commissionings/route'),
    permissions: ['commissioning:read'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/commissionings', u),
  },
  {
    file: 'app/api/visits/[id]/commissioning/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/commissioning/route'),
    permissions: ['visit:commission'],
    target: 'visit',
    ok: 201,
    build: async (u, r) =>
      request(`/api/visits/${need(r).visitId}/commissioning`, u, json('POST', { driveLpm: 60, deliveredLpm: 4, beatsPerMinute: 60, liftM: 30 })),
  },
  {
    file: 'app/api/people/route.ts',
    method: 'GET',
    load: () => import('@/app/api/people/route'),
    permissions: ['people:read'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/people', u),
  },
  {
    file: 'app/api/people/[id]/route.ts',
    method: 'PATCH',
    load: () => import('@/app/api/people/[id]/route'),
    permissions: ['people:manage'],
    target: 'person',
    ok: 200,
    build: async (u, r) => request(`/api/people/${need(r).id}`, u, json('PATCH', { active: true })),
  },
  {
    file: 'app/api/people/invitations/route.ts',
    method: 'POST',
    load: () => import('@/app/api/people/invitations/route'),
    permissions: ['people:manage'],
    target: 'none',
    ok: 201,
    build: async (u) =>
      request(
        '/api/people/invitations',
        u,
        json('POST', { name: 'Matrix invitee', email: `invitee-${randomUUID().slice(0, 8)}@fixtures.test`, role: 'farmer' }),
      ),
  },
  {
    file: 'app/api/photos/[id]/route.ts',
    method: 'GET',
    load: () => import('@/app/api/photos/[id]/route'),
    permissions: ['visit:read', 'photo:original'],
    target: 'photo',
    ok: 200,
    build: async (u, r) => request(`/api/photos/${need(r).id}`, u),
  },
  {
    file: 'app/api/photos/[id]/route.ts',
    method: 'PUT',
    load: () => import('@/app/api/photos/[id]/route'),
    permissions: ['visit:capture'],
    target: 'photo',
    ok: 200,
    build: async (u, r) => rawPut(`/api/photos/${need(r).id}`, u, need(r).photoBytes ?? Buffer.alloc(0)),
  },
  {
    file: 'app/api/photos/[id]/thumbnail/route.ts',
    method: 'GET',
    load: () => import('@/app/api/photos/[id]/thumbnail/route'),
    permissions: ['visit:read'],
    target: 'photo',
    ok: 200,
    build: async (u, r) => request(`/api/photos/${need(r).id}/thumbnail`, u),
  },
  {
    file: 'app/api/sync/pull/route.ts',
    method: 'GET',
    load: () => import('@/app/api/sync/pull/route'),
    permissions: ['sync:use'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/sync/pull?cursor=0&limit=50', u),
  },
  {
    file: 'app/api/sync/push/route.ts',
    method: 'POST',
    load: () => import('@/app/api/sync/push/route'),
    permissions: ['sync:use', 'visit:capture'],
    target: 'visit',
    ok: 200,
    build: async (u, r) =>
      request(
        '/api/sync/push',
        u,
        json('POST', { ops: [putOp('waterSource', randomUUID(), { visitId: need(r).visitId, name: 'Matrix spring', kind: 'spring', notes: '' })] }),
      ),
    // The envelope is 200 once the caller may sync; each op is allowed or refused on its own.
    effectiveStatus: async (res) => {
      if (res.status !== 200) return res.status;
      const { results } = (await res.json()) as { results: { status: string; error?: { code: number } }[] };
      return results[0]?.error?.code ?? (results[0]?.status === 'applied' ? 200 : 500);
    },
  },
  {
    file: 'app/api/visits/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/route'),
    permissions: ['visit:read'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/visits', u),
  },
  {
    file: 'app/api/visits/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/route'),
    permissions: ['visit:plan'],
    target: 'farm',
    ok: 201,
    refusedInBody: { status: 422, message: /farm of your organisation/ },
    build: async (u, r) =>
      request('/api/visits', u, json('POST', { farmId: need(r).farmId, advisorId: null, plannedOn: inDays(30), confirmDuplicate: true, notes: '' })),
  },
  {
    file: 'app/api/visits/assignments/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/assignments/route'),
    permissions: ['visit:plan'],
    target: 'visit',
    ok: 200,
    refusedInBody: { status: 422, message: /advisor of your organisation/ },
    build: async (u, r) =>
      request(
        '/api/visits/assignments',
        u,
        json('POST', { visitIds: [need(r).visitId], advisorId: need(r).advisorId, plannedOn: inDays(31), confirmUnsynced: true }),
      ),
  },
  {
    file: 'app/api/visits/export.csv/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/export.csv/route'),
    permissions: ['visit:export'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/visits/export.csv', u),
  },
  {
    file: 'app/api/visits/deleted/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/deleted/route'),
    permissions: ['visit:plan'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/visits/deleted', u),
  },
  {
    file: 'app/api/visits/[id]/restore/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/restore/route'),
    permissions: ['visit:plan'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/restore`, u, json('POST', {})),
  },
  {
    file: 'app/api/visits/[id]/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/[id]/route'),
    permissions: ['visit:read'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}`, u),
  },
  {
    file: 'app/api/visits/[id]/route.ts',
    method: 'PATCH',
    load: () => import('@/app/api/visits/[id]/route'),
    permissions: ['visit:plan'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}`, u, json('PATCH', { status: 'cancelled' })),
  },
  {
    file: 'app/api/visits/[id]/assignment/route.ts',
    method: 'PUT',
    load: () => import('@/app/api/visits/[id]/assignment/route'),
    permissions: ['visit:plan'],
    target: 'visit',
    ok: 200,
    build: async (u, r) =>
      request(`/api/visits/${need(r).visitId}/assignment`, u, json('PUT', { advisorId: need(r).advisorId, plannedOn: inDays(32), confirmUnsynced: true })),
  },
  {
    file: 'app/api/visits/[id]/audit/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/[id]/audit/route'),
    permissions: ['visit:audit'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/audit`, u),
  },
  {
    file: 'app/api/visits/[id]/sheet/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/[id]/sheet/route'),
    permissions: ['sheet:read'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet`, u),
  },
  {
    file: 'app/api/visits/[id]/sheet/pdf/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/[id]/sheet/pdf/route'),
    permissions: ['sheet:read'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet/pdf?paper=a4`, u),
  },
  {
    file: 'app/api/visits/[id]/sheet/send/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/sheet/send/route'),
    permissions: ['sheet:send'],
    target: 'visit',
    ok: 201,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet/send`, u, json('POST', { paper: 'a4' })),
  },
  {
    file: 'app/api/visits/[id]/sheet/send/preview/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/sheet/send/preview/route'),
    permissions: ['sheet:send'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet/send/preview`, u, json('POST', { note: 'See you on Tuesday.' })),
  },
  {
    file: 'app/api/visits/[id]/sheet/sends/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/[id]/sheet/sends/route'),
    permissions: ['sheet:send'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet/sends`, u),
  },
  {
    file: 'app/api/visits/[id]/sheet/acknowledge/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/sheet/acknowledge/route'),
    permissions: ['sheet:acknowledge'],
    target: 'visit',
    ok: 201,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet/acknowledge`, u, json('POST', {})),
  },
  {
    file: 'app/api/visits/[id]/sheet/questions/route.ts',
    method: 'GET',
    load: () => import('@/app/api/visits/[id]/sheet/questions/route'),
    permissions: ['sheet:read'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet/questions`, u),
  },
  {
    file: 'app/api/visits/[id]/sheet/questions/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/sheet/questions/route'),
    permissions: ['sheet:acknowledge'],
    target: 'visit',
    ok: 201,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet/questions`, u, json('POST', { text: 'How deep is the intake?' })),
  },
  {
    file: 'app/api/visits/[id]/sheet/decision/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/sheet/decision/route'),
    permissions: ['sheet:decide'],
    target: 'visit',
    ok: 201,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/sheet/decision`, u, json('POST', { decision: 'go-ahead', reason: '' })),
  },
  {
    file: 'app/api/visits/[id]/sheet/answers/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/sheet/answers/route'),
    permissions: ['sheet:answer'],
    target: 'visit',
    ok: 201,
    build: async (u, r) => {
      const question = await askedQuestion(need(r));
      return request(`/api/visits/${need(r).visitId}/sheet/answers`, u, json('POST', { questionId: question, text: 'About a metre below the pool.' }));
    },
  },
  {
    file: 'app/api/visits/[id]/jump/route.ts',
    method: 'POST',
    load: () => import('@/app/api/visits/[id]/jump/route'),
    permissions: ['visit:jump', 'visit:plan'],
    target: 'visit',
    ok: 200,
    build: async (u, r) => request(`/api/visits/${need(r).visitId}/jump`, u, json('POST', { status: 'installed', reason: 'Installed on paper last spring.' })),
  },
  {
    file: 'app/api/questions/route.ts',
    method: 'GET',
    load: () => import('@/app/api/questions/route'),
    permissions: ['sheet:answer'],
    target: 'none',
    ok: 200,
    build: async (u) => request('/api/questions', u),
  },
];

/** The farmer's question the world put on the resource's visit (the answers route needs one to answer). */
async function askedQuestion(r: Resource): Promise<string> {
  const { SheetResponse } = await import('@/lib/server/db');
  const question = await SheetResponse.findOne({ where: { visitId: r.visitId, kind: 'question' }, attributes: ['id'] });
  return question?.id ?? randomUUID();
}

/** The `[id]`-style params of a route, taken from the request path against the file's folders. */
export function routeParams(file: string, url: URL): Record<string, string> {
  const folders = file
    .replace(/^app/, '')
    .replace(/\/route\.ts$/, '')
    .split('/');
  const parts = url.pathname.split('/');
  const out: Record<string, string> = {};
  folders.forEach((folder, i) => {
    const m = /^\[(\w+)\]$/.exec(folder);
    if (m?.[1]) out[m[1]] = decodeURIComponent(parts[i] ?? '');
  });
  return out;
}
