import { vi } from 'vitest';
import { FieldDatabase, setFieldDbForTests } from '@/lib/client/db';
import type { OpResult, PullResponse, SyncOp } from '@/lib/shared/schemas/sync';

let n = 0;
/** A fresh phone database per test. */
export function freshDb(): FieldDatabase {
  const db = new FieldDatabase(`test-${Date.now()}-${n++}`);
  setFieldDbForTests(db);
  return db;
}

export const VISIT = '11111111-1111-4111-8111-111111111111';

export function emptyPull(cursor = 0): PullResponse {
  return {
    cursor,
    hasMore: false,
    visibleVisitIds: [VISIT],
    farms: [],
    visits: [],
    records: { waterSource: [], flowMeasurement: [], fallReading: [], point: [], photo: [], demandLine: [], pipeRun: [] },
    settings: { unitsDefault: 'metric', designFractionOfLowest: 0.5, demandFigures: {} },
  };
}

/** A fake server: records pushes, answers with `decide` per op, serves pull pages. */
export function fakeServer(decide: (op: SyncOp, seen: number) => OpResult['status'] = () => 'applied') {
  const pushed: SyncOp[][] = [];
  const seen = new Map<string, number>();
  let rev = 100;
  let failNext: number | null = null;
  let poison: { when: (op: SyncOp) => boolean; status: number } | null = null;
  const fetchMock = vi.fn(async (url: string, init?: RequestInit) => {
    if (failNext !== null) {
      const status = failNext;
      failNext = null;
      if (status === 0) throw new TypeError('Failed to fetch');
      return new Response(JSON.stringify({ error: { message: `status ${status}` } }), { status });
    }
    if (url.startsWith('/api/sync/push')) {
      const { ops } = JSON.parse(String(init?.body)) as { ops: SyncOp[] };
      pushed.push(ops);
      if (poison && ops.some(poison.when)) {
        return new Response(JSON.stringify({ error: { message: 'Something went wrong on the server.' } }), { status: poison.status });
      }
      const results: OpResult[] = ops.map((op) => {
        const count = (seen.get(op.opId) ?? 0) + 1;
        seen.set(op.opId, count);
        const status = count > 1 ? 'replayed' : decide(op, count);
        return status === 'conflict'
          ? { opId: op.opId, status, rev: null, conflict: { fields: Object.keys(op.changes ?? {}), server: { note: 'theirs' } } }
          : status === 'rejected'
            ? { opId: op.opId, status, rev: null, error: { code: 403, message: 'Not your visit.' } }
            : { opId: op.opId, status, rev: ++rev };
      });
      return Response.json({ results });
    }
    if (url.startsWith('/api/sync/pull')) return Response.json(emptyPull(rev));
    if (url.startsWith('/api/photos/')) return new Response(null, { status: 200 });
    return new Response('not found', { status: 404 });
  });
  vi.stubGlobal('fetch', fetchMock);
  return {
    pushed,
    fetchMock,
    /** The next request fails: 0 = network error, else that HTTP status. */
    failNextWith(status: number) {
      failNext = status;
    },
    /** Every batch holding an op that matches fails whole with that status (as a server-side fault would). */
    failBatchesContaining(when: (op: SyncOp) => boolean, status: number) {
      poison = { when, status };
    },
  };
}
