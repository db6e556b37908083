// Bad input, property-based (fast-check, seeded): every route handler's params, query and body with
// malformed, oversized, wrong-typed and hostile values. Every case is invalid by the route's own
// schema; each must get a 4xx with a clear message, never a 500, and leave the database unchanged.
// FUZZ_RUNS (cases per property, default 120) and FUZZ_SEED change the run; `npm run test:soak` runs long.
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { NextRequest } from 'next/server';
import type { z } from 'zod';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { POST as acceptInvitation } from '@/app/api/invitations/[token]/accept/route';
import { scopeOf } from '@/lib/server/auth/permissions';
import { ROLES } from '@/lib/shared/domain';
import {
  farmSchema,
  bulkAssignSchema,
  invitationSchema,
  personUpdateSchema,
  settingsSchema,
  visitAssignSchema,
  visitCreateSchema,
  visitStatusSchema,
  visitJumpSchema,
  acceptInvitationSchema,
} from '@/lib/shared/schemas/office';
import { idParam, pageQuery, visitFilters, visitListQuery } from '@/lib/shared/schemas/list-query';
import { answerBody, decisionBody, farmNeedsBody, paperQuery, questionBody, sendSheetBody } from '@/lib/shared/schemas/sheet';
import { pullQuerySchema, pushRequestSchema } from '@/lib/shared/schemas/sync';
import { commissioningInputSchema } from '@/lib/shared/schemas/commissioning';
import { params } from './support/fixtures';
import {
  DELETE,
  PROTOTYPE_KEYS,
  databaseFingerprint,
  extremeDate,
  extremeInteger,
  hostileRawBody,
  hostileString,
  hostileValue,
  loneSurrogateString,
  pathsOf,
  withAt,
} from './support/hostile';
import { ROUTES, handlerOf, routeParams, type GuardedRoute } from './support/route-table';
import { callerOf, makeWorld, resourceFor, type World } from './support/world';

const RUNS = Number(process.env.FUZZ_RUNS ?? 120);
const SEED = Number(process.env.FUZZ_SEED ?? 20260607);

// The schema each route checks its body and query with: the oracle that says a case is invalid.
type Schemas = { body?: z.ZodType; query?: z.ZodType };
const SCHEMAS: Record<string, Schemas> = {
  'GET app/api/me/route.ts': {},
  'POST app/api/me/sessions/route.ts': {},
  'GET app/api/farms/route.ts': { query: pageQuery },
  'POST app/api/farms/route.ts': { body: farmSchema },
  'GET app/api/farms/[id]/route.ts': {},
  'PATCH app/api/farms/[id]/route.ts': { body: farmSchema },
  'GET app/api/farms/[id]/demand/route.ts': {},
  'PUT app/api/farms/[id]/demand/route.ts': { body: farmNeedsBody },
  'GET app/api/organisation/settings/route.ts': {},
  'PUT app/api/organisation/settings/route.ts': { body: settingsSchema },
  'GET app/api/people/route.ts': { query: pageQuery },
  'PATCH app/api/people/[id]/route.ts': { body: personUpdateSchema },
  'POST app/api/people/invitations/route.ts': { body: invitationSchema },
  'GET app/api/photos/[id]/route.ts': {},
  'PUT app/api/photos/[id]/route.ts': {},
  'GET app/api/photos/[id]/thumbnail/route.ts': {},
  'GET app/api/sync/pull/route.ts': { query: pullQuerySchema },
  'POST app/api/sync/push/route.ts': { body: pushRequestSchema },
  'GET app/api/visits/route.ts': { query: visitListQuery },
  'POST app/api/visits/route.ts': { body: visitCreateSchema },
  'POST app/api/visits/assignments/route.ts': { body: bulkAssignSchema },
  'GET app/api/visits/export.csv/route.ts': { query: visitFilters },
  'GET app/api/visits/deleted/route.ts': {},
  'POST app/api/visits/[id]/restore/route.ts': {},
  'GET app/api/visits/[id]/route.ts': {},
  'PATCH app/api/visits/[id]/route.ts': { body: visitStatusSchema },
  'PUT app/api/visits/[id]/assignment/route.ts': { body: visitAssignSchema },
  'GET app/api/visits/[id]/audit/route.ts': {},
  'GET app/api/visits/[id]/sheet/route.ts': {},
  'GET app/api/visits/[id]/sheet/pdf/route.ts': { query: paperQuery },
  'POST app/api/visits/[id]/sheet/send/route.ts': { body: sendSheetBody },
  'POST app/api/visits/[id]/sheet/send/preview/route.ts': { body: sendSheetBody },
  'GET app/api/visits/[id]/sheet/sends/route.ts': {},
  'POST app/api/visits/[id]/sheet/acknowledge/route.ts': {},
  'GET app/api/visits/[id]/sheet/questions/route.ts': {},
  'POST app/api/visits/[id]/sheet/questions/route.ts': { body: questionBody },
  'POST app/api/visits/[id]/sheet/decision/route.ts': { body: decisionBody },
  'POST app/api/visits/[id]/sheet/answers/route.ts': { body: answerBody },
  'POST app/api/visits/[id]/jump/route.ts': { body: visitJumpSchema },
  'GET app/api/questions/route.ts': {},
  'GET app/api/commissionings/route.ts': {},
  'POST app/api/visits/[id]/commissioning/route.ts': { body: commissioningInputSchema },
};

const guarded = ROUTES.filter((r): r is GuardedRoute => !('public' in r));
const tally = { cases: 0, serverErrors: 0, byKind: { params: 0, query: 0, body: 0, raw: 0 } };
let world: World;
let before: Record<string, string>;

beforeAll(async () => {
  world = await makeWorld('photo', 'fuzz');
  before = await databaseFingerprint();
});

/** The caller who may use the route on their own resource (so the input, not the role, decides). */
function callerFor(route: GuardedRoute) {
  const role = ROLES.find((r) => route.permissions.every((p) => scopeOf(r, p)));
  if (!role) throw new Error(`no role may call ${route.file}`);
  return callerOf(world.org, role);
}

/** Sends the request; asserts a 4xx with a plain message (no stack, no SQL), counts the case. */
async function expectRefused(route: GuardedRoute, req: NextRequest, kind: keyof typeof tally.byKind, note: string) {
  const res = await handlerOf(await route.load(), route.method)(req, params(routeParams(route.file, req.nextUrl)));
  tally.cases += 1;
  tally.byKind[kind] += 1;
  if (res.status >= 500) tally.serverErrors += 1;
  const text = await res.text();
  expect(res.status, `${route.method} ${route.file} ${kind} ${note.slice(0, 300)} → ${text.slice(0, 300)}`).toBeGreaterThanOrEqual(400);
  expect(res.status, `${route.method} ${route.file} ${kind} ${note.slice(0, 300)} → ${text.slice(0, 300)}`).toBeLessThan(500);
  const message = (JSON.parse(text) as { error?: { message?: unknown } }).error?.message;
  expect(typeof message === 'string' && message.length > 0 && message.length < 600, text.slice(0, 300)).toBe(true);
  // No stack frames, SQL or driver codes in what the caller reads.
  expect(message).not.toMatch(/\bat .+:\d+:\d+|SQL|sequelize|ER_[A-Z]|TypeError|RangeError/);
}

const rebuilt = (req: NextRequest, url: URL, body?: string) =>
  new NextRequest(url, { method: req.method, headers: req.headers, body: req.method === 'GET' ? undefined : body });

describe('bad input, route by route', () => {
  it('every guarded route has its schemas listed here (a new route must join the fuzz)', () => {
    expect(guarded.map((r) => `${r.method} ${r.file}`).sort()).toEqual(Object.keys(SCHEMAS).sort());
  });

  for (const route of guarded) {
    const key = `${route.method} ${route.file}`;
    const schemas = SCHEMAS[key] ?? {};
    const hasParam = route.file.includes('[id]');
    const valid = async () => {
      const req = await route.build(callerFor(route), resourceFor(world, route.target, 'own'));
      const body: unknown =
        route.method === 'GET' || route.file.includes('photos')
          ? undefined
          : await req
              .clone()
              .json()
              .catch(() => undefined);
      return { req, body };
    };

    if (hasParam) {
      it(`${key}: hostile ids are refused`, async () => {
        const { req } = await valid();
        await fc.assert(
          fc.asyncProperty(
            fc.oneof(
              hostileString,
              fc.uuid().map((u) => u.toUpperCase() + 'x'),
            ),
            async (id) => {
              fc.pre(!idParam.safeParse({ id }).success);
              let encoded = '';
              try {
                encoded = encodeURIComponent(id);
              } catch {
                /* a lone surrogate cannot be in a URL at all */
              }
              fc.pre(encoded !== '');
              const url = new URL(req.nextUrl.pathname.replace(/[0-9a-f-]{36}/, encoded) + req.nextUrl.search, req.nextUrl.origin);
              await expectRefused(route, rebuilt(req, url, req.method === 'GET' ? undefined : await req.clone().text()), 'params', id);
            },
          ),
          { seed: SEED, numRuns: RUNS },
        );
        // An id that is well-formed but names nothing: 404, never a 500.
        const missing = new URL(req.nextUrl.pathname.replace(/[0-9a-f-]{36}/, randomUUID()), req.nextUrl.origin);
        await expectRefused(route, rebuilt(req, missing, req.method === 'GET' ? undefined : await req.clone().text()), 'params', 'unknown uuid');
      });
    }

    if (schemas.query) {
      const querySchema = schemas.query;
      it(`${key}: hostile query strings are refused`, async () => {
        const { req } = await valid();
        const keys = Object.keys((querySchema as unknown as { shape?: object }).shape ?? {}).concat([
          'page',
          'pageSize',
          'status',
          'advisor',
          'plannedFrom',
          'q',
          'sort',
          'dir',
          'cursor',
          'limit',
          'paper',
        ]);
        await fc.assert(
          fc.asyncProperty(fc.dictionary(fc.constantFrom(...keys), hostileString, { minKeys: 1, maxKeys: 3 }), async (query) => {
            fc.pre(!querySchema.safeParse(query).success);
            const url = new URL(req.nextUrl.pathname, req.nextUrl.origin);
            for (const [k, v] of Object.entries(query)) url.searchParams.set(k, v);
            await expectRefused(route, rebuilt(req, url), 'query', url.search);
          }),
          { seed: SEED, numRuns: RUNS },
        );
      });
    }

    if (schemas.body) {
      const bodySchema = schemas.body;
      it(`${key}: hostile bodies (a field replaced, removed, or the whole body) are refused`, async () => {
        const { req, body } = await valid();
        const paths = pathsOf(body);
        const mutation = fc.oneof(
          { weight: 4, arbitrary: fc.tuple(fc.constantFrom(...paths), fc.oneof(hostileValue, fc.constant(DELETE))) },
          { weight: 1, arbitrary: fc.tuple(fc.constant([] as (string | number)[]), hostileValue) },
        );
        await fc.assert(
          fc.asyncProperty(mutation, async ([path, value]) => {
            const mutated = withAt(body, path, value);
            fc.pre(!bodySchema.safeParse(mutated).success);
            await expectRefused(
              route,
              rebuilt(req, req.nextUrl, JSON.stringify(mutated) ?? ''),
              'body',
              `${path.join('.')}=${String(JSON.stringify(value)).slice(0, 200)}`,
            );
          }),
          { seed: SEED, numRuns: RUNS },
        );
      });

      it(`${key}: lone surrogates, extreme dates and integers, and prototype keys in an otherwise valid body are refused`, async () => {
        const { req, body } = await valid();
        const at = (path: (string | number)[]) => path.reduce<unknown>((v, k) => (v as Record<string | number, unknown>)[k], body);
        const paths = pathsOf(body);
        const strings = paths.filter((p) => typeof at(p) === 'string');
        const numbers = paths.filter((p) => typeof at(p) === 'number');
        const objects = [[], ...paths].filter((p) => {
          const v = at(p);
          return !!v && typeof v === 'object' && !Array.isArray(v);
        });
        type Case = { kind: string; path: (string | number)[]; value: unknown; alwaysInvalid: boolean };
        const arbitraries: fc.Arbitrary<Case>[] = [
          fc
            .tuple(fc.constantFrom(...objects), fc.constantFrom(...PROTOTYPE_KEYS), fc.oneof(fc.integer(), fc.string({ maxLength: 5 }), fc.constant({})))
            .map(([p, k, v]) => ({ kind: 'prototype key', path: [...p, k], value: v, alwaysInvalid: false })),
        ];
        if (strings.length > 0) {
          arbitraries.push(
            fc.tuple(fc.constantFrom(...strings), loneSurrogateString).map(([p, v]) => ({ kind: 'lone surrogate', path: p, value: v, alwaysInvalid: true })),
          );
          arbitraries.push(
            fc.tuple(fc.constantFrom(...strings), extremeDate).map(([p, v]) => ({ kind: 'extreme date', path: p, value: v, alwaysInvalid: false })),
          );
        }
        if (numbers.length > 0) {
          arbitraries.push(
            fc.tuple(fc.constantFrom(...numbers), extremeInteger).map(([p, v]) => ({ kind: 'extreme integer', path: p, value: v, alwaysInvalid: false })),
          );
        }
        await fc.assert(
          fc.asyncProperty(fc.oneof(...arbitraries), async ({ kind, path, value, alwaysInvalid }) => {
            const mutated = withAt(body, path, value);
            // A lone surrogate is refused at the boundary whatever the schema says; the rest by the schema
            // (a key the schema strips, or a value it allows, is a valid request and not sent here).
            if (!alwaysInvalid && bodySchema.safeParse(mutated).success) return;
            await expectRefused(
              route,
              rebuilt(req, req.nextUrl, JSON.stringify(mutated) ?? ''),
              'body',
              `${kind} ${path.join('.')}=${String(JSON.stringify(value)).slice(0, 120)}`,
            );
          }),
          { seed: SEED, numRuns: RUNS },
        );
      });

      it(`${key}: bodies that are not JSON, truncated, deeply nested or oversized are refused`, async () => {
        const { req, body } = await valid();
        const text = JSON.stringify(body);
        // Past the route's cap (8 MB for a sync push, 1 MB for the rest): valid fields or not, a 413.
        const oversize = route.file.includes('sync/push') ? 9 * 1024 * 1024 : 2 * 1024 * 1024;
        const raw = fc.oneof(
          hostileRawBody,
          fc.nat({ max: text.length - 1 }).map((n) => text.slice(0, n)),
          fc.constant(JSON.stringify({ ...(body as object), padding: 'x'.repeat(oversize) })),
        );
        await fc.assert(
          fc.asyncProperty(raw, async (rawText) => {
            let parsed: unknown = Symbol('not json');
            try {
              parsed = JSON.parse(rawText);
            } catch {
              /* not JSON: invalid */
            }
            fc.pre(!bodySchema.safeParse(parsed).success || rawText.length > oversize);
            await expectRefused(route, rebuilt(req, req.nextUrl, rawText), 'raw', rawText.slice(0, 120));
          }),
          { seed: SEED, numRuns: Math.max(10, Math.round(RUNS / 2)) },
        );
      });
    }
  }

  it('POST /api/invitations/:token/accept: hostile tokens and bodies are refused', async () => {
    await fc.assert(
      fc.asyncProperty(hostileString, hostileValue, async (token, body) => {
        fc.pre(!acceptInvitationSchema.safeParse(body).success || token.length > 0);
        let encoded = '';
        try {
          encoded = encodeURIComponent(token);
        } catch {
          /* a lone surrogate cannot be in a URL at all */
        }
        fc.pre(encoded !== '' || token === '');
        const req = new NextRequest(new URL(`/api/invitations/${encoded}/accept`, 'http://127.0.0.1:3100'), {
          method: 'POST',
          body: JSON.stringify(body) ?? '',
          headers: { 'content-type': 'application/json' },
        });
        const res = await acceptInvitation(req, params({ token }));
        tally.cases += 1;
        tally.byKind.params += 1;
        expect(res.status, await res.clone().text()).toBeGreaterThanOrEqual(400);
        expect(res.status).toBeLessThan(500);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });

  it('the database is exactly as before: row counts and CHECKSUM TABLE of every table (but the log of refused tries)', async () => {
    // Guessed invitation tokens are logged (sign_in_attempts) to slow the guesser down: that is the point.
    const withoutTries = (print: Record<string, string>) =>
      Object.fromEntries(Object.entries(print).filter(([table]) => !table.startsWith('sign_in_attempts')));
    expect(withoutTries(await databaseFingerprint())).toEqual(withoutTries(before));
  });
});

afterAll(() => {
  console.log(
    `[fuzz] ${tally.cases} bad inputs over ${guarded.length + 1} route methods (params ${tally.byKind.params}, query ${tally.byKind.query}, body ${tally.byKind.body}, raw ${tally.byKind.raw}); server errors: ${tally.serverErrors}; seed ${SEED}, ${RUNS} runs per property`,
  );
});
