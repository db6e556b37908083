// Builders for sync ops and calls to the push / pull route handlers, shared by the sync tests.
import { randomUUID } from 'node:crypto';
import { GET as pullRoute } from '@/app/api/sync/pull/route';
import { POST as pushRoute } from '@/app/api/sync/push/route';
import { flushScreenings } from '@/lib/server/services/screening-queue';
import type { OpResult, PullResponse, SyncEntity, SyncOpInput } from '@/lib/shared/schemas/sync';
import { params, request, type TestUser } from './fixtures';

type Fields = Record<string, unknown>;

/** A put op (a create unless baseRev is given). */
export function putOp(entity: SyncEntity, entityId: string, changes: Fields, extra: Partial<SyncOpInput> = {}): SyncOpInput {
  return { opId: randomUUID(), entity, entityId, action: 'put', baseRev: null, changes, madeAt: new Date().toISOString(), ...extra } as SyncOpInput;
}

/** A delete op against the revision the phone holds. */
export function deleteOp(entity: SyncEntity, entityId: string, baseRev: number, base?: Fields): SyncOpInput {
  return { opId: randomUUID(), entity, entityId, action: 'delete', baseRev, base, madeAt: new Date().toISOString() } as SyncOpInput;
}

/** POST /api/sync/push as the user; the status and the parsed body, once the screenings it queued have run (at once). */
export async function push(user: TestUser, body: unknown) {
  const res = await pushRoute(await request('/api/sync/push', user, { method: 'POST', body }), params({}));
  const json = await res.json();
  await flushScreenings();
  return {
    status: res.status,
    results: (json.results ?? []) as OpResult[],
    error: json.error as { message: string; fieldErrors?: Record<string, string[]> } | undefined,
  };
}

/** GET /api/sync/pull as the user. */
export async function pull(user: TestUser, cursor = 0, limit = 500): Promise<PullResponse> {
  const res = await pullRoute(await request(`/api/sync/pull?cursor=${cursor}&limit=${limit}`, user), params({}));
  if (res.status !== 200) throw new Error(`pull answered ${res.status}: ${await res.text()}`);
  return res.json();
}

/** Pulls page after page until hasMore is false; every page's records, in order. */
export async function pullAll(user: TestUser, cursor = 0, limit = 500) {
  const pages: PullResponse[] = [];
  for (let guard = 0; guard < 1000; guard++) {
    const page = await pull(user, cursor, limit);
    pages.push(page);
    cursor = page.cursor;
    if (!page.hasMore) return { pages, cursor };
  }
  throw new Error('pull never finished');
}

/** Every id in a pull page, tagged with its kind. */
export function pulledIds(page: PullResponse): string[] {
  return [
    ...page.farms.map((f) => `farm:${f.id}`),
    ...page.visits.map((v) => `visit:${v.id}`),
    ...Object.entries(page.records).flatMap(([kind, rows]) => (rows as { id: string }[]).map((r) => `${kind}:${r.id}`)),
  ];
}

/** A complete set of readings for one visit (invented, like the demo's walked sites), as create ops. */
export function readingOps(visitId: string, farmId: string) {
  const ids = {
    source: randomUUID(),
    flow: randomUUID(),
    fall: randomUUID(),
    lift: randomUUID(),
    drive: randomUUID(),
    delivery: randomUUID(),
    demand: randomUUID(),
    point: randomUUID(),
  };
  const takenAt = '2026-08-01T09:30:00.000Z';
  const ops = [
    putOp('waterSource', ids.source, { visitId, name: 'Test spring', kind: 'spring', notes: '' }),
    putOp('flowMeasurement', ids.flow, {
      visitId,
      sourceId: ids.source,
      takenAt,
      notes: '',
      measurement: {
        method: 'volumetric',
        season: 'dry',
        trials: [
          { volumeL: 20, seconds: 10.4 },
          { volumeL: 20, seconds: 10.9 },
        ],
      },
    }),
    putOp('fallReading', ids.fall, {
      visitId,
      purpose: 'fall',
      seq: 0,
      takenAt,
      notes: '',
      bookedFrom: null,
      run: {
        method: 'level',
        rows: [{ backsightM: 1.842 }, { foresightM: 2.618, backsightM: 0.512 }, { foresightM: 2.309, backsightM: 0.688 }, { foresightM: 2.215 }],
      },
    }),
    putOp('fallReading', ids.lift, {
      visitId,
      purpose: 'lift',
      seq: 1,
      takenAt,
      notes: '',
      bookedFrom: 'pump',
      run: {
        method: 'clinometer',
        legs: [
          { slopeDistanceM: 60, angleBelowHorizontalDeg: -9 },
          { slopeDistanceM: 55, angleBelowHorizontalDeg: -12 },
        ],
      },
    }),
    putOp('pipeRun', ids.drive, { visitId, purpose: 'drive', lengthM: 24, diameterMm: null, material: 'galvanized-steel', pressureClass: null }),
    putOp('pipeRun', ids.delivery, { visitId, purpose: 'delivery', lengthM: 420, diameterMm: null, material: 'hdpe', pressureClass: null }),
    putOp('demandLine', ids.demand, { farmId, kind: 'beef-cow-nursing', count: 6, litresPerHeadPerDay: 62, figureSource: 'catalogue', note: '' }),
    putOp('point', ids.point, {
      visitId,
      role: 'pump',
      label: 'Ram site',
      lat: 52.419,
      lon: -3.616,
      accuracyM: 4,
      altitudeM: 232,
      altitudeAccuracyM: 6,
      chainageM: null,
      capturedAt: takenAt,
    }),
  ];
  return { ids, ops };
}
