// A MariaDB primary and a GTID replica of it on loopback (their own ports and folders), with the
// app's data layer configured for both (DB_READ_HOSTS): lists come from the replica; writes, sync
// and the reads right after a person's write go to the primary; writes appear on the replica.
import path from 'node:path';
import { NextRequest } from 'next/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAppDatabase, startReplicaPair, type ReplicaPair, type Server } from '../support/replica-pair';

type Fixtures = typeof import('./support/fixtures');
type Sync = typeof import('./support/sync');
type VisitsRoute = typeof import('@/app/api/visits/route');

const saved = { DB_PORT: process.env.DB_PORT, DB_READ_HOSTS: process.env.DB_READ_HOSTS, DB_SOCKET: process.env.DB_SOCKET };
let pair: ReplicaPair;
let fixtures: Fixtures;
let sync: Sync;
let visits: VisitsRoute;
let closeSequelize: () => Promise<void>;
let org: Awaited<ReturnType<Fixtures['makeOrganisation']>>;

async function count(server: Server, sql: string, values: unknown[]) {
  const conn = await pair.root(server);
  try {
    const [row] = await conn.query(sql, values);
    return Number(row.n);
  } finally {
    await conn.end();
  }
}
const visitsOf = (server: Server, id: string) => count(server, 'SELECT COUNT(*) AS n FROM fallbook_test.visits WHERE id = ?', [id]);

async function listVisitIds(cookieExtra = '') {
  const cookie = `${await fixtures.sessionCookie(org.coordinator)}${cookieExtra}`;
  const res = await visits.GET(new NextRequest(new URL('/api/visits?pageSize=100', 'http://127.0.0.1:3100'), { headers: { cookie } }), fixtures.params({}));
  expect(res.status).toBe(200);
  return ((await res.json()).items as { id: string }[]).map((v) => v.id);
}

beforeAll(async () => {
  const root = path.resolve(__dirname, '../..');
  pair = await startReplicaPair(path.join(root, '.data', 'replica-test'), Number(process.env.DB_PORT) + 1000);
  await createAppDatabase(pair, { name: 'fallbook_test', user: process.env.DB_USER as string, password: process.env.DB_PASSWORD as string });
  // Point the app at the pair before anything opens a connection (modules load below).
  process.env.DB_PORT = String(pair.primary.port);
  // The test database's socket belongs to the other server: the pair is reached over TCP.
  process.env.DB_SOCKET = '';
  process.env.DB_READ_HOSTS = `127.0.0.1:${pair.replica.port}`;
  const connection = await import('@/lib/server/db/connection');
  const { createMigrator } = await import('@/lib/server/db/migrator');
  const migrating = connection.createSequelize({ DB_READ_HOSTS: '' });
  await createMigrator(migrating).up();
  await migrating.close();
  closeSequelize = connection.closeSequelize;
  fixtures = await import('./support/fixtures');
  sync = await import('./support/sync');
  visits = await import('@/app/api/visits/route');
  org = await fixtures.makeOrganisation('replica');
  await pair.catchUp();
}, 90_000);

afterAll(async () => {
  await closeSequelize?.();
  await pair?.stop();
  Object.assign(process.env, saved);
}, 60_000);

describe('MariaDB primary + read replica', () => {
  it('the replica is read-only for the app; sync pushes land on the primary and then appear on the replica', async () => {
    const { ops, ids } = sync.readingOps(org.visit.id, org.farm.id);
    const { status, results } = await sync.push(org.advisor, { ops });
    expect(status).toBe(200);
    expect(results.every((r) => r.status === 'applied')).toBe(true);
    const sql = 'SELECT COUNT(*) AS n FROM fallbook_test.water_sources WHERE id = ?';
    expect(await count(pair.primary, sql, [ids.source])).toBe(1);
    await pair.catchUp();
    expect(await count(pair.replica, sql, [ids.source])).toBe(1);
    expect(await count(pair.replica, 'SELECT COUNT(*) AS n FROM fallbook_test.points WHERE id = ?', [ids.point])).toBe(1);
    // A write sent to the replica by mistake would fail: the app's account may not write there.
    const mariadb = await import('mariadb');
    const app = await mariadb.createConnection({
      host: '127.0.0.1',
      port: pair.replica.port,
      user: process.env.DB_USER,
      password: process.env.DB_PASSWORD,
      database: 'fallbook_test',
    });
    await expect(app.query('UPDATE visits SET notes = notes WHERE id = ?', [org.visit.id])).rejects.toThrow(/read-only/);
    await app.end();
  });

  it('lists read from the replica; the reads after a write, and sync, read from the primary', async () => {
    // Hold the replica back: it receives the primary's log but applies nothing.
    const replica = await pair.root(pair.replica);
    await replica.query('STOP SLAVE SQL_THREAD');
    try {
      const res = await visits.POST(
        await fixtures.request('/api/visits', org.coordinator, {
          method: 'POST',
          body: { farmId: org.otherFarm.id, advisorId: org.advisor.id, plannedOn: '2027-02-01', confirmDuplicate: true, notes: 'replica check' },
        }),
        fixtures.params({}),
      );
      expect(res.status).toBe(201);
      const created = (await res.json()).visit.id as string;
      const wrote = /fallbook-wrote=(\d+)/.exec(res.headers.get('set-cookie') ?? '')?.[1];
      expect(Number(wrote)).toBeGreaterThan(Date.now() - 60_000);
      expect([await visitsOf(pair.primary, created), await visitsOf(pair.replica, created)]).toEqual([1, 0]);

      // A plain list comes from the replica (it does not have the visit yet) …
      const fromReplica = await listVisitIds();
      expect(fromReplica).toContain(org.visit.id);
      expect(fromReplica).not.toContain(created);
      // … the person who just wrote reads the primary (their cookie says so) …
      expect(await listVisitIds(`; fallbook-wrote=${wrote}`)).toContain(created);
      // … an old mark no longer counts …
      expect(await listVisitIds(`; fallbook-wrote=${Date.now() - 3_600_000}`)).not.toContain(created);
      // … and the advisor's phone pulls from the primary.
      const pulled = await sync.pullAll(org.advisor);
      expect(pulled.pages.flatMap((p) => p.visits.map((v) => v.id))).toContain(created);

      await replica.query('START SLAVE SQL_THREAD');
      await pair.catchUp();
      expect(await visitsOf(pair.replica, created)).toBe(1);
      expect(await listVisitIds()).toContain(created);
    } finally {
      await replica.query('START SLAVE SQL_THREAD').catch(() => undefined);
      await replica.end();
    }
  });

  it('a phone pulling right after its push sees the push, while the replica has not applied it', async () => {
    const { cursor } = await sync.pullAll(org.advisor);
    const replica = await pair.root(pair.replica);
    await replica.query('STOP SLAVE SQL_THREAD');
    try {
      const { ops, ids } = sync.readingOps(org.visit.id, org.farm.id);
      const { status, results } = await sync.push(org.advisor, { ops });
      expect([status, results.every((r) => r.status === 'applied')]).toEqual([200, true]);
      const sql = 'SELECT COUNT(*) AS n FROM fallbook_test.points WHERE id = ?';
      expect([await count(pair.primary, sql, [ids.point]), await count(pair.replica, sql, [ids.point])]).toEqual([1, 0]);
      // No cookie here (a phone's pull is not a page): the sync routes read the primary by themselves.
      const pulled = (await sync.pullAll(org.advisor, cursor)).pages.flatMap(sync.pulledIds);
      expect(pulled).toEqual(expect.arrayContaining([`point:${ids.point}`, `waterSource:${ids.source}`, `fallReading:${ids.fall}`]));
    } finally {
      await replica.query('START SLAVE SQL_THREAD').catch(() => undefined);
      await replica.end();
    }
    await pair.catchUp();
  });

  it('a bad DB_READ_HOSTS entry is refused with the setting named', async () => {
    const { parseReadHosts } = await import('@/lib/server/db/connection');
    expect(parseReadHosts(' 10.0.0.5:3306, replica-2 ', 3307)).toEqual([
      { host: '10.0.0.5', port: 3306 },
      { host: 'replica-2', port: 3307 },
    ]);
    expect(() => parseReadHosts('db:port', 3307)).toThrow(/DB_READ_HOSTS/);
  });
});
