// Stateless app servers: a second `next start` beside Playwright's, on the same database and photo
// store; a phone syncing alternately (and twice at once) through both loses and doubles nothing.
import { createHash, randomUUID } from 'node:crypto';
import { expect, request as httpRequest, test, type APIRequestContext } from '@playwright/test';
import sharp from 'sharp';
import { query } from './support/db';
import { OwnServer } from './support/own-server';
import { demoSession } from './support/session';

const portA = Number(process.env.PORT || 3100);
const portB = portA + 1000;
let serverB: OwnServer | undefined;
let a: APIRequestContext;
let b: APIRequestContext;
let visitId = '';

test.beforeAll(async () => {
  test.setTimeout(90_000);
  serverB = new OwnServer(portB);
  await serverB.start();
  const ines = await demoSession('ines@wenlow-water.test');
  const headers = { cookie: ines.cookie };
  a = await httpRequest.newContext({ baseURL: `http://127.0.0.1:${portA}`, extraHTTPHeaders: headers });
  b = await httpRequest.newContext({ baseURL: `http://127.0.0.1:${portB}`, extraHTTPHeaders: headers });
  const [visit] = await query<{ id: string }>(
    "SELECT id FROM visits WHERE advisor_id = ? AND deleted_at IS NULL AND status IN ('scheduled', 'surveyed') ORDER BY planned_on LIMIT 1",
    [ines.user.id],
  );
  visitId = visit?.id ?? '';
});

test.afterAll(async () => {
  await a?.dispose();
  await b?.dispose();
  await serverB?.stop();
});

type Pull = { cursor: number; hasMore: boolean; records: { point: { id: string }[] } };

async function pullAll(api: APIRequestContext, cursor: number) {
  const ids: string[] = [];
  for (let guard = 0; guard < 100; guard++) {
    const res = await api.get(`/api/sync/pull?cursor=${cursor}&limit=50`);
    expect(res.status()).toBe(200);
    const page = (await res.json()) as Pull;
    ids.push(...page.records.point.map((p) => p.id));
    cursor = page.cursor;
    if (!page.hasMore) return { ids, cursor };
  }
  throw new Error('pull never finished');
}

function pointOps(n: number) {
  return Array.from({ length: n }, (_, i) => ({
    opId: randomUUID(),
    entity: 'point',
    entityId: randomUUID(),
    action: 'put',
    baseRev: null,
    madeAt: new Date().toISOString(),
    changes: {
      visitId,
      role: 'station',
      label: `Station ${i + 1}`,
      lat: 52.41 + i / 10_000,
      lon: -3.61,
      accuracyM: 5,
      altitudeM: 230 - i,
      altitudeAccuracyM: 8,
      chainageM: i * 10,
      capturedAt: new Date().toISOString(),
    },
  }));
}

async function push(api: APIRequestContext, ops: unknown[]) {
  const res = await api.post('/api/sync/push', { data: { ops } });
  expect(res.status(), await res.text()).toBe(200);
  return ((await res.json()).results as { status: string }[]).map((r) => r.status);
}

test('a phone syncing through two app servers in turn loses and doubles nothing', async () => {
  test.setTimeout(60_000);
  expect(visitId).not.toBe('');
  let { cursor } = await pullAll(a, 0);
  const pushed: string[] = [];
  const received: string[] = [];
  for (let round = 0; round < 6; round++) {
    const [first, second] = round % 2 === 0 ? [a, b] : [b, a];
    const ops = pointOps(5);
    pushed.push(...ops.map((op) => op.entityId));
    expect(await push(first, ops)).toEqual(Array(5).fill('applied'));
    // The answer was lost on the way: the phone sends the same batch again, through the other server.
    expect(await push(second, ops)).toEqual(Array(5).fill('replayed'));
    const pulled = await pullAll(second, cursor);
    received.push(...pulled.ids);
    cursor = pulled.cursor;
  }
  // Two batches at the same moment, one through each server (two phones of one advisor).
  const [x, y] = [pointOps(10), pointOps(10)];
  pushed.push(...x.map((op) => op.entityId), ...y.map((op) => op.entityId));
  const both = await Promise.all([push(a, x), push(b, y)]);
  expect(both.flat()).toEqual(Array(20).fill('applied'));
  received.push(...(await pullAll(b, cursor)).ids);

  expect(received.filter((id) => pushed.includes(id)).sort()).toEqual([...pushed].sort());
  expect(new Set(received).size).toBe(received.length);
  const rows = await query<{ n: number }>(`SELECT COUNT(*) AS n FROM points WHERE id IN (${pushed.map(() => '?').join(',')})`, pushed);
  expect(Number(rows[0]?.n)).toBe(pushed.length);
  const revs = await query<{ n: number; d: number }>(
    `SELECT COUNT(*) AS n, COUNT(DISTINCT rev) AS d FROM points WHERE id IN (${pushed.map(() => '?').join(',')})`,
    pushed,
  );
  expect(Number(revs[0]?.d)).toBe(Number(revs[0]?.n));
});

test('a photo uploaded through one server is served by the other, byte for byte', async () => {
  const data = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#5a7d8f' } })
    .jpeg()
    .toBuffer();
  const sha256 = createHash('sha256').update(data).digest('hex');
  const id = randomUUID();
  expect(
    await push(b, [
      {
        opId: randomUUID(),
        entity: 'photo',
        entityId: id,
        action: 'put',
        baseRev: null,
        madeAt: new Date().toISOString(),
        changes: {
          visitId,
          pointId: null,
          caption: 'Weir from the bank',
          mime: 'image/jpeg',
          bytes: data.length,
          sha256,
          width: null,
          height: null,
          lat: null,
          lon: null,
          takenAt: null,
        },
      },
    ]),
  ).toEqual(['applied']);
  const put = await a.put(`/api/photos/${id}`, { data, headers: { 'content-type': 'application/octet-stream' } });
  expect(put.status()).toBe(200);
  const got = await b.get(`/api/photos/${id}`);
  expect(got.status()).toBe(200);
  expect(
    createHash('sha256')
      .update(await got.body())
      .digest('hex'),
  ).toBe(sha256);
});
