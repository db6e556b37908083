// Bench: sync throughput on loopback. (1) 1,000 new-point ops pushed over HTTP to the served app in
// batches of 200, against the same rows (points, sync_ops, audit_log) inserted straight with the mariadb
// connector in batches of 200: ops/s of both and the ratio, median of 11 runs (each run measures both);
// beside them the floor's echo of the same batches (what the framework alone takes to receive them).
// (2) 50 devices at once, each pushing 50 ops and pulling, for a bounded number of rounds: p50/p99;
// beside it the bare framework under the same load (the empty floor app's sync-shaped route handler),
// the app's lightest route (the same 50 devices each asking GET /api/me at once), the CPU the app,
// MariaDB and this script use during the load (which of them is the bottleneck), and what the
// framework alone costs a request by kind of endpoint (how much of the floor is the framework).
// Run with npm run bench (it serves the app and sets BENCH_APP_URL).
import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import * as mariadb from 'mariadb';
import { makeOrganisation, type TestUser } from '../integration/support/fixtures';
import { putOp } from '../integration/support/sync';
import { clientAt, clientFor, pool } from './support/http';
import { cpuSeconds, processesNamed, processTree } from './support/proc';
import { median, pairedExtra, quantile, round, syncBudgets, type SyncFigures } from './support/budgets';
import { floorApp, report } from './support/report';
import { closeSequelize } from '@/lib/server/db';

const OPS = 1000;
const BATCH = 200;
// Interleaved runs of the app's load and the floor's (floor, app, app, floor…): each budget reads the
// median over the pairs.
const RUNS = 5;
const DEVICES = 50;
const DEVICE_OPS = 50;
const ROUNDS = 2;
const LOAD_DEADLINE_MS = 120_000;
const SETTLE_MS = 1500;
// The route/raw pairs are short (about a tenth of a second each): more of them give a steadier median.
const RATIO_RUNS = 11;
// Runs of each kind of endpoint in the framework's share (alternating order).
const FRAMEWORK_RUNS = 3;

const pointOps = (visitId: string, n: number) => Array.from({ length: n }, (_, i) => putOp('point', randomUUID(), {
  visitId, role: 'station', label: `Station ${i}`, lat: 52.4 + i / 1e5, lon: -3.6, accuracyM: 4,
  altitudeM: 230 + i / 100, altitudeAccuracyM: 6, chainageM: i, capturedAt: '2026-08-01T10:00:00Z',
}));

/** 1,000 ops through POST /api/sync/push over HTTP; ops/s. */
async function routeRun(user: TestUser, visitId: string): Promise<number> {
  const client = await clientFor(user);
  const ops = pointOps(visitId, OPS);
  const t0 = performance.now();
  for (let i = 0; i < OPS; i += BATCH) {
    const res = await client.post('/api/sync/push', { ops: ops.slice(i, i + BATCH) });
    const results = JSON.parse(res.body).results as { status: string }[] | undefined;
    if (res.status !== 200 || results?.some((r) => r.status !== 'applied')) throw new Error(`push answered ${res.status}: ${res.body.slice(0, 300)}`);
  }
  return (OPS / (performance.now() - t0)) * 1000;
}

/** The rows the route writes for those ops, inserted straight in batches of 200 (one transaction each); ops/s. */
async function rawRun(conn: mariadb.Connection, user: TestUser, visitId: string): Promise<number> {
  const ops = pointOps(visitId, OPS);
  const now = new Date();
  const t0 = performance.now();
  for (let i = 0; i < OPS; i += BATCH) {
    const slice = ops.slice(i, i + BATCH);
    await conn.beginTransaction();
    // A block of revisions from the counter row, as the model hook takes them one at a time.
    await conn.query('UPDATE rev_counter SET value = LAST_INSERT_ID(value + ?) WHERE id = 1', [slice.length]);
    const top = Number(((await conn.query('SELECT LAST_INSERT_ID() AS top')) as { top: bigint }[])[0]?.top);
    await conn.batch(
      'INSERT INTO points (id, visit_id, role, label, lat, lon, accuracy_m, altitude_m, altitude_accuracy_m, chainage_m, captured_at, rev, created_by_id, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)',
      slice.map((op, k) => {
        const c = op.changes as Record<string, unknown>;
        // DOUBLE columns bound as text, as the app's bulk writer does, so each table is one bulk
        // statement here too (a whole number among fractions would start another).
        const d = (x: unknown) => String(x);
        return [op.entityId, visitId, c.role, c.label, d(c.lat), d(c.lon), d(c.accuracyM), d(c.altitudeM), d(c.altitudeAccuracyM), d(c.chainageM), new Date(String(c.capturedAt)), top - slice.length + 1 + k, user.id, now, now];
      }),
    );
    await conn.batch('INSERT INTO audit_log (organisation_id, actor_id, entity, entity_id, visit_id, action, changes, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
      slice.map((op) => [user.organisationId, user.id, 'point', op.entityId, visitId, 'created', JSON.stringify(op.changes), now]));
    await conn.batch('INSERT INTO sync_ops (op_id, user_id, entity, entity_id, outcome, created_at) VALUES (?, ?, ?, ?, ?, ?)',
      slice.map((op) => [op.opId, user.id, 'point', op.entityId, JSON.stringify({ opId: op.opId, status: 'applied', rev: 1 }), now]));
    await conn.commit();
  }
  return (OPS / (performance.now() - t0)) * 1000;
}

/**
 * The same 1,000 ops posted in batches of 200 to the floor's echo (the framework reading each batch
 * and answering an outcome per op, no work of the app's); ops/s.
 */
async function echoRun(echo: Echo): Promise<number> {
  const floor = clientAt(echo.url);
  const ops = pointOps(randomUUID(), OPS);
  const t0 = performance.now();
  for (let i = 0; i < OPS; i += BATCH) {
    const res = await floor.post('', { ops: ops.slice(i, i + BATCH) });
    if (res.status !== 200) throw new Error(`the floor's echo answered ${res.status}`);
  }
  return (OPS / (performance.now() - t0)) * 1000;
}

type Device = { user: TestUser; visitId: string; cursor: number };

/**
 * 50 devices, each pushing 50 new ops then pulling from its cursor, ROUNDS times, all at once. A
 * device keeps its cursor from run to run, as a phone does: it pulls what changed since its last
 * sync (its own ops and its colleague's), never the whole history again.
 */
async function loadRun(devices: Device[]) {
  const clients = await Promise.all(devices.map(async (d) => Object.assign(d, { client: await clientFor(d.user) })));
  const pushes: number[] = [];
  const pulls: number[] = [];
  let errors = 0;
  // Who uses the machine's CPU during the load: the app, MariaDB and this script.
  const app = processTree(Number(process.env.BENCH_APP_PID));
  // This checkout's MariaDB, by its port: other checkouts may run theirs on the same machine.
  const db = processesNamed('mariadbd', `--port=${process.env.DB_PORT}`);
  const cpu0 = { app: cpuSeconds(app), db: cpuSeconds(db), load: process.cpuUsage() };
  const t0 = performance.now();
  await pool(clients.length, clients.length, LOAD_DEADLINE_MS, async (i) => {
    const device = clients[i];
    if (!device) return;
    for (let round = 0; round < ROUNDS; round++) {
      const pushed = await device.client.post('/api/sync/push', { ops: pointOps(device.visitId, DEVICE_OPS) });
      const ok = pushed.status === 200 && (JSON.parse(pushed.body).results as { status: string }[]).every((r) => r.status === 'applied');
      if (ok) pushes.push(pushed.ms); else errors++;
      const pulled = await device.client.get(`/api/sync/pull?cursor=${device.cursor}&limit=500`);
      if (pulled.status === 200) {
        pulls.push(pulled.ms);
        device.cursor = JSON.parse(pulled.body).cursor as number;
      } else errors++;
    }
  });
  const wallMs = performance.now() - t0;
  const loadCpu = process.cpuUsage(cpu0.load);
  const cpu = { app: cpuSeconds(app) - cpu0.app, db: cpuSeconds(db) - cpu0.db, load: (loadCpu.user + loadCpu.system) / 1e6 };
  return { pushes, pulls, errors, wallMs, cpu, expected: clients.length * ROUNDS * 2 };
}

/**
 * The app's lightest route for the same 50 devices: each asks GET /api/me at once (the session
 * check and one read of the account, nothing else), twice per device like the load's two rounds.
 */
async function lightestRun(devices: { user: TestUser }[]) {
  const clients = await Promise.all(devices.map(async (d) => clientFor(d.user)));
  const times: number[] = [];
  let errors = 0;
  for (let round = 0; round < ROUNDS; round++) {
    await Promise.all(clients.map(async (client) => {
      const res = await client.get('/api/me');
      if (res.status === 200) times.push(res.ms); else errors++;
    }));
  }
  return { times, errors };
}

/** An endpoint of the floor's echo (one outcome per pushed op, an empty page of changes) and the processes serving it. */
interface Echo {
  url: string;
  pids: number[];
}

/**
 * The bare framework under the load's own shape: the empty floor app (same Next.js, same `next
 * start`) has a route handler that reads the pushed JSON and answers an outcome per op, with no
 * session, database or validation. 50 devices each post the same 50 ops to it and then ask it for
 * changes, ROUNDS times, all at once; with the CPU per request of the serving process.
 */
async function bareRun(count: number, echo: Echo) {
  const floor = clientAt(echo.url);
  const pushes: number[] = [];
  let errors = 0;
  const cpu0 = cpuSeconds(echo.pids);
  await pool(count, count, LOAD_DEADLINE_MS, async () => {
    for (let round = 0; round < ROUNDS; round++) {
      const pushed = await floor.post('', { ops: pointOps(randomUUID(), DEVICE_OPS) });
      if (pushed.status === 200 && (JSON.parse(pushed.body).results as unknown[]).length === DEVICE_OPS) pushes.push(pushed.ms); else errors++;
      if ((await floor.get('')).status !== 200) errors++;
    }
  });
  const cpuMsPerRequest = ((cpuSeconds(echo.pids) - cpu0) * 1000) / (count * ROUNDS * 2);
  return { pushes, errors, cpuMsPerRequest };
}

/** Node's own http server answering as the floor's echo (support/plain-echo.mjs), on a free port. */
async function plainEcho(): Promise<Echo & { stop: () => void }> {
  const child = spawn(process.execPath, [fileURLToPath(new URL('./support/plain-echo.mjs', import.meta.url))], { stdio: ['ignore', 'pipe', 'inherit'] });
  const port = await new Promise<string>((resolve, reject) => {
    child.stdout.once('data', (chunk: Buffer) => resolve(chunk.toString().trim()));
    child.once('exit', (code) => reject(new Error(`the plain echo server exited (${code})`)));
  });
  return { url: `http://127.0.0.1:${port}`, pids: [child.pid as number], stop: () => child.kill() };
}

/**
 * What the framework itself costs a request under the same load, by kind of endpoint: the floor's
 * App Router route handler, a Pages Router API route of the same floor app, and Node's http server
 * with no framework. Reported, not budgeted: it shows how much of the floor is the framework.
 */
async function frameworkShare(count: number, floorAt: (path: string) => Echo) {
  const plain = await plainEcho();
  const kinds: { name: string; echo: Echo }[] = [
    { name: 'App Router route handler (the floor)', echo: floorAt('/api/echo') },
    { name: 'Pages Router API route', echo: floorAt('/api/echo-pages') },
    { name: "Node's http server, no framework", echo: plain },
  ];
  try {
    const runs = new Map(kinds.map((k) => [k.name, [] as Awaited<ReturnType<typeof bareRun>>[]]));
    for (const kind of kinds) await bareRun(count, kind.echo); // warm-up
    for (let run = 0; run < FRAMEWORK_RUNS; run++) for (const kind of run % 2 === 0 ? kinds : [...kinds].reverse()) runs.get(kind.name)?.push(await bareRun(count, kind.echo));
    return kinds.map(({ name }) => {
      const list = runs.get(name) ?? [];
      return {
        name: `framework alone, ${count} devices: ${name}`,
        p99Ms: round(median(list.map((b) => quantile(b.pushes, 0.99)))),
        errors: list.reduce((a, b) => a + b.errors, 0),
        appCpuMsPerRequest: round(median(list.map((b) => b.cpuMsPerRequest))),
      };
    });
  } finally {
    plain.stop();
  }
}

async function main() {
  const conn = await mariadb.createConnection({
    host: process.env.DB_HOST, port: Number(process.env.DB_PORT), user: process.env.DB_USER,
    password: process.env.DB_PASSWORD, database: process.env.DB_NAME,
  });
  try {
    const org = await makeOrganisation('bench-sync');
    const floor = floorApp();
    const floorPids = processTree(floor.pid);
    const floorAt = (path: string): Echo => ({ url: `${floor.url}${path}`, pids: floorPids });
    const floorEcho = floorAt('/api/echo');
    // Warm both sides before timing: one warm-up left the first three pairs' route runs about a
    // third slower than the rest (the server's optimizing compiler still at work).
    for (let i = 0; i < 3; i++) await routeRun(org.otherAdvisor, org.otherVisit.id);
    await rawRun(conn, org.otherAdvisor, org.otherVisit.id);
    await echoRun(floorEcho);
    const route: number[] = [];
    const raw: number[] = [];
    const ratios: number[] = [];
    const echoes: number[] = [];
    const ceilings: number[] = [];
    // Each run measures both, back to back, in alternating order: whatever the first leaves behind
    // (the server's screening a moment after the last batch, the database's own background work
    // after a burst of inserts) weighs on each side equally often.
    for (let run = 0; run < RATIO_RUNS; run++) {
      const settle = () => new Promise((resolve) => setTimeout(resolve, SETTLE_MS));
      let r: number;
      let w: number;
      if (run % 2 === 0) {
        r = await routeRun(org.advisor, org.visit.id);
        await settle();
        w = await rawRun(conn, org.advisor, org.visit.id);
      } else {
        w = await rawRun(conn, org.advisor, org.visit.id);
        await settle();
        r = await routeRun(org.advisor, org.visit.id);
      }
      await settle();
      route.push(r);
      raw.push(w);
      ratios.push(r / w);
      const e = await echoRun(floorEcho);
      echoes.push(e);
      // The most the route could reach if it did the raw inserts' work and the framework's and
      // nothing else, one after the other: the raw run's time over the sum of both times.
      ceilings.push(1 / w / (1 / w + 1 / e));
    }

    const orgs = await Promise.all(Array.from({ length: DEVICES / 2 }, (_, i) => makeOrganisation(`bench-load-${i}`)));
    const devices: Device[] = orgs.flatMap((o) => [{ user: o.advisor, visitId: o.visit.id, cursor: 0 }, { user: o.otherAdvisor, visitId: o.otherVisit.id, cursor: 0 }]);
    // Each device first catches up (as a phone does on its first sync), outside the timed runs.
    for (const device of devices) {
      const client = await clientFor(device.user);
      for (let more = true; more; ) {
        const page = JSON.parse((await client.get(`/api/sync/pull?cursor=${device.cursor}&limit=500`)).body) as { cursor: number; hasMore?: boolean };
        more = page.hasMore === true && page.cursor !== device.cursor;
        device.cursor = page.cursor;
      }
    }
    const loads: Awaited<ReturnType<typeof loadRun>>[] = [];
    const lightest: Awaited<ReturnType<typeof lightestRun>>[] = [];
    const bare: Awaited<ReturnType<typeof bareRun>>[] = [];
    await bareRun(devices.length, floorEcho); // warms the floor's route as routeRun warmed the app's
    for (let run = 0; run < RUNS; run++) {
      if (run % 2 === 0) {
        bare.push(await bareRun(devices.length, floorEcho));
        loads.push(await loadRun(devices));
      } else {
        loads.push(await loadRun(devices));
        bare.push(await bareRun(devices.length, floorEcho));
      }
      lightest.push(await lightestRun(devices));
    }
    const p = (key: 'pushes' | 'pulls', q: number) => round(median(loads.map((l) => quantile(l[key], q))));
    const share = (who: 'app' | 'db' | 'load') => round(median(loads.map((l) => l.cpu[who] / (l.wallMs / 1000))), 2);
    const errors = loads.reduce((a, l) => a + l.errors + (l.expected - l.pushes.length - l.pulls.length - l.errors), 0);

    const rows = [
      { name: `push route over HTTP, ${OPS} ops in batches of ${BATCH}`, opsPerSecond: Math.round(median(route)), runs: route.map(Math.round).join(' / ') },
      { name: `raw mariadb batch insert, same rows`, opsPerSecond: Math.round(median(raw)), runs: raw.map(Math.round).join(' / ') },
      { name: 'route / raw ratio (same run)', ratio: round(median(ratios), 3), runs: ratios.map((x) => round(x, 3)).join(' / ') },
      { name: `framework alone: the floor's echo of the same ${OPS} ops in batches of ${BATCH}`, opsPerSecond: Math.round(median(echoes)), runs: echoes.map(Math.round).join(' / ') },
      { name: 'route / raw if the route did only the raw inserts and the framework its part (raw time ÷ raw + echo time)', ratio: round(median(ceilings), 3),
        runs: ceilings.map((x) => round(x, 3)).join(' / ') },
      { name: `${DEVICES} devices: push of ${DEVICE_OPS} ops`, samples: loads.map((l) => l.pushes.length).join(' / '), p50Ms: p('pushes', 0.5), p99Ms: p('pushes', 0.99),
        runs: loads.map((l) => round(quantile(l.pushes, 0.99))).join(' / ') },
      { name: `${DEVICES} devices: pull`, samples: loads.map((l) => l.pulls.length).join(' / '), p50Ms: p('pulls', 0.5), p99Ms: p('pulls', 0.99) },
      { name: `${DEVICES} devices: errors`, errors, wallS: loads.map((l) => round(l.wallMs / 1000)).join(' / ') },
      // CPU time over wall time: 1 is one core busy throughout. The app's per request is its CPU
      // over the pushes and pulls it answered (/proc ticks: 10 ms steps).
      { name: `${DEVICES} devices: CPU during the load, cores busy: app / MariaDB / load script`,
        app: share('app'), mariadb: share('db'), loadScript: share('load'),
        appCpuMsPerRequest: round(median(loads.map((l) => (l.cpu.app * 1000) / (l.pushes.length + l.pulls.length)))) },
      { name: `bare framework: ${DEVICES} devices push ${DEVICE_OPS} ops to an empty route handler and pull`, samples: bare.map((b) => b.pushes.length).join(' / '),
        p50Ms: round(median(bare.map((b) => quantile(b.pushes, 0.5)))), p99Ms: round(median(bare.map((b) => quantile(b.pushes, 0.99)))),
        runs: bare.map((b) => round(quantile(b.pushes, 0.99))).join(' / '),
        errors: bare.reduce((a, b) => a + b.errors, 0), appCpuMsPerRequest: round(median(bare.map((b) => b.cpuMsPerRequest))) },
      // The pairs' median of the app's CPU per request less the floor's: what the app's own work costs.
      { name: `${DEVICES} devices: the app's own CPU per request (app − floor, median of the pairs)`,
        appCpuMsPerRequest: round(pairedExtra({ app: loads.map((l) => (l.cpu.app * 1000) / (l.pushes.length + l.pulls.length)), floor: bare.map((b) => b.cpuMsPerRequest) })) },
      ...(await frameworkShare(devices.length, floorAt)),
      { name: `app's lightest route: ${DEVICES} devices GET /api/me at once`, samples: lightest.map((f) => f.times.length).join(' / '),
        p50Ms: round(median(lightest.map((f) => quantile(f.times, 0.5)))), p99Ms: round(median(lightest.map((f) => quantile(f.times, 0.99)))),
        errors: lightest.reduce((a, f) => a + f.errors, 0) },
    ];
    const figures: SyncFigures = {
      pushP99Ms: { app: loads.map((l) => round(quantile(l.pushes, 0.99))), floor: bare.map((b) => round(quantile(b.pushes, 0.99))) },
      cpuMsPerRequest: { app: loads.map((l) => round((l.cpu.app * 1000) / (l.pushes.length + l.pulls.length), 2)), floor: bare.map((b) => round(b.cpuMsPerRequest, 2)) },
      pushRawRatios: ratios.map((x) => round(x, 3)),
      errors,
    };
    report('sync', rows, syncBudgets(figures), { figures });
  } finally {
    await conn.end();
    await closeSequelize();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
