// The page right after a save reads the primary: a `next start` of the production build runs against
// a MariaDB primary + GTID replica pair (a copy of the test database) with DB_READ_HOSTS set. With the
// replica held back (STOP SLAVE SQL_THREAD), a coordinator plans a visit through the API; the visit's
// office page (a server component) shows it to a request carrying the fallbook-wrote cookie the save
// set, and is a 404 to one without it (read from the replica, which has not applied the write yet).
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { expect, test } from '@playwright/test';
import { copyDatabaseInto, createAppDatabase, startReplicaPair, type ReplicaPair } from '../support/replica-pair';
import { query } from './support/db';
import { OwnServer } from './support/own-server';
import { demoSession } from './support/session';

const db = {
  host: '127.0.0.1',
  port: Number(process.env.DB_PORT),
  user: process.env.DB_USER as string,
  password: process.env.DB_PASSWORD as string,
  name: process.env.DB_NAME as string,
};
const port = Number(process.env.PORT || 3100) + 1001;
const base = `http://127.0.0.1:${port}`;
let pair: ReplicaPair | undefined;
let server: OwnServer | undefined;
let session = '';
let farmId = '';
let advisorId = '';

test.beforeAll(async () => {
  test.setTimeout(120_000);
  pair = await startReplicaPair(path.resolve('.data', 'replica-e2e'), db.port + 1002);
  await createAppDatabase(pair, db);
  copyDatabaseInto(pair, db);
  await pair.catchUp();
  const maren = await demoSession('maren@wenlow-water.test');
  session = maren.cookie;
  const [farm] = await query<{ id: string }>('SELECT id FROM farms WHERE organisation_id = ? AND deleted_at IS NULL ORDER BY name LIMIT 1', [
    maren.user.organisation_id,
  ]);
  const [advisor] = await query<{ id: string }>("SELECT id FROM users WHERE organisation_id = ? AND role = 'advisor' AND active = 1 ORDER BY email LIMIT 1", [
    maren.user.organisation_id,
  ]);
  farmId = farm?.id ?? '';
  advisorId = advisor?.id ?? '';
  server = new OwnServer(port, { DB_HOST: '127.0.0.1', DB_PORT: String(pair.primary.port), DB_READ_HOSTS: `127.0.0.1:${pair.replica.port}` });
  await server.start();
});

test.afterAll(async () => {
  await server?.stop();
  await pair?.stop();
});

/** The office page of the visit as this cookie header sees it: its status and text. */
async function visitPage(id: string, cookie: string) {
  const res = await fetch(`${base}/office/visits/${id}`, { headers: { cookie }, redirect: 'manual' });
  return { status: res.status, text: await res.text() };
}

test('the page right after a save reads the primary; without the mark it reads the held-back replica', async () => {
  test.setTimeout(60_000);
  const held = await (pair as ReplicaPair).root((pair as ReplicaPair).replica);
  await held.query('STOP SLAVE SQL_THREAD');
  try {
    const notes = `Replica check ${randomUUID().slice(0, 8)}`;
    const res = await fetch(`${base}/api/visits`, {
      method: 'POST',
      headers: { cookie: session, origin: base, 'content-type': 'application/json' },
      body: JSON.stringify({ farmId, advisorId, plannedOn: '2027-03-01', confirmDuplicate: true, notes }),
    });
    expect(res.status).toBe(201);
    const id = ((await res.json()) as { visit: { id: string } }).visit.id;
    const wrote = /fallbook-wrote=(\d+)/.exec(res.headers.get('set-cookie') ?? '')?.[0];
    expect(wrote).toBeTruthy();

    // The browser sends the mark with the next page: the server component reads the primary.
    const after = await visitPage(id, `${session}; ${wrote}`);
    expect(after.status).toBe(200);
    expect(after.text).toContain(notes);
    // Without it the page reads the replica, which does not have the visit yet.
    expect((await visitPage(id, session)).status).toBe(404);

    await held.query('START SLAVE SQL_THREAD');
    await (pair as ReplicaPair).catchUp();
    const later = await visitPage(id, session);
    expect([later.status, later.text.includes(notes)]).toEqual([200, true]);
  } finally {
    await held.query('START SLAVE SQL_THREAD').catch(() => undefined);
    await held.end();
  }
});
