// Bench: the office at scale. Seeds 20,000 visits (2,000 farms) in a fresh organisation straight into
// MariaDB, then, over HTTP on loopback as its coordinator with 10 requests at once: the visits table's
// first page, a filtered page and the CSV export of 5,000 rows (p50/p99, median of 3 runs). Every query
// the list, the export, the follow-up board and the district map run (each sort and each filter) is
// EXPLAINed; a real scan of a big table fails the bench (see `scans` for how that is decided). Beside
// them, the bare framework at the same concurrency: the empty floor app's route handler.
// Run with npm run bench (it serves the app and sets BENCH_APP_URL).
import * as mariadb from 'mariadb';
import { makeOrganisation } from '../integration/support/fixtures';
import { clientAt, clientFor, pool } from './support/http';
import { EXPORT_ROWS, FARMS, seedOffice, VISITS } from './support/office-seed';
import { budget, type Budget, median, quantile, round } from './support/budgets';
import { floorApp, report } from './support/report';
import { closeSequelize, getSequelize } from '@/lib/server/db';
import { districtSites } from '@/lib/server/data/district-map';
import { districtAreas, visitCountsByAdvisor } from '@/lib/server/data/follow-up';
import { visitsCsv } from '@/lib/server/data/visit-export';
import { listVisits } from '@/lib/server/data/visits';
import type { SessionUser } from '@/lib/shared/domain';
import { VISIT_SORTS, visitFilters, type VisitListQuery } from '@/lib/shared/schemas/list-query';

const CONCURRENCY = 10;
const RUNS = 3;

type Conn = mariadb.Connection;

/** Every distinct SQL the list, export, follow-up board and map run for each sort and filter, captured from Sequelize. */
async function capturedQueries(user: SessionUser, advisorId: string): Promise<string[]> {
  // Sequelize reads options.logging on every query; its type does not declare options.
  const sequelize = getSequelize() as unknown as { options: { logging: unknown } };
  const seen = new Set<string>();
  const previous = sequelize.options.logging;
  sequelize.options.logging = (sql: string) => { seen.add(sql.replace(/^Executing \([^)]*\): /, '')); };
  try {
    const queries: Partial<VisitListQuery>[] = [
      ...VISIT_SORTS.flatMap((sort) => [{ sort, dir: 'asc' as const }, { sort, dir: 'desc' as const }]),
      { status: 'scheduled' }, { advisor: advisorId }, { advisor: 'none' }, { plannedFrom: '2025-06-01', plannedTo: '2025-09-30' },
      { verdict: 'go' }, { verdict: 'none' }, { area: 'Carrow' }, { q: 'Holding 01' }, { overdue: true },
      { status: 'scheduled', advisor: advisorId, area: 'Carrow', sort: 'farm' },
    ];
    for (const q of queries) await listVisits(user, { page: 3, pageSize: 25, ...q });
    const filters = visitFilters.parse({ advisor: advisorId });
    let lines = 0;
    for await (const chunk of visitsCsv(user, filters)) lines += chunk.split('\r\n').length - 1;
    if (lines !== EXPORT_ROWS + 1) throw new Error(`export gave ${lines} lines, expected ${EXPORT_ROWS + 1}`);
    await visitCountsByAdvisor(user);
    await districtAreas(user);
    await districtSites(user);
  } finally {
    sequelize.options.logging = previous;
  }
  return [...seen].filter((sql) => /^\s*SELECT/i.test(sql));
}

// A step reads the whole table (type ALL) or a whole index (type index) of more than this many rows
// (the optimizer's estimate). Below it the table is a lookup (a few pages): the optimizer rightly scans
// it rather than use an index, e.g. the bench's handful of screenings or users.
const BIG_TABLE_ROWS = 1000;

/** EXPLAIN of each query; the steps that scan a big table whole (type ALL or index over BIG_TABLE_ROWS rows). */
async function scans(conn: Conn, queries: string[]) {
  const bad: { table: string; type: string; rows: number; sql: string }[] = [];
  for (const sql of queries) {
    const plan = (await conn.query(`EXPLAIN ${sql}`)) as { table: string; type: string; rows: number | bigint | null }[];
    for (const step of plan) {
      const rows = Number(step.rows ?? 0);
      if ((step.type === 'ALL' || step.type === 'index') && rows > BIG_TABLE_ROWS) {
        bad.push({ table: step.table, type: step.type, rows, sql: sql.replace(/^SELECT .*? FROM /s, 'SELECT … FROM ').slice(0, 600) });
      }
    }
  }
  return bad;
}

async function main() {
  const conn = await mariadb.createConnection({
    host: process.env.DB_HOST, port: Number(process.env.DB_PORT), user: process.env.DB_USER,
    password: process.env.DB_PASSWORD, database: process.env.DB_NAME,
  });
  try {
    const org = await makeOrganisation('bench-office');
    const t0 = performance.now();
    await seedOffice(conn, org);
    const seedS = round((performance.now() - t0) / 1000);
    const coordinator: SessionUser = { ...org.coordinator, units: 'metric' };
    const queries = await capturedQueries(coordinator, org.advisor.id);
    const bad = await scans(conn, queries);
    for (const b of bad) console.log(`full scan (${b.type}, ~${b.rows} rows) of ${b.table}: ${b.sql}`);

    const client = await clientFor(org.coordinator);
    const cases = [
      { name: 'visits: first page', path: '/api/visits', count: 200 },
      { name: 'visits: filtered page', path: `/api/visits?status=scheduled&area=Carrow&sort=farm&dir=asc&page=2`, count: 200 },
      { name: `visits: CSV export of ${EXPORT_ROWS} rows`, path: `/api/visits/export.csv?advisor=${org.advisor.id}`, count: 20 },
    ];
    // Warm each route once, checking it answers what it should.
    for (const c of cases) {
      const res = await client.get(c.path);
      if (res.status !== 200) throw new Error(`${c.path} answered ${res.status}: ${res.body.slice(0, 200)}`);
      if (c.path.includes('export') && res.body.trim().split('\n').length !== EXPORT_ROWS + 1) throw new Error('export row count differs');
    }
    const rows: Record<string, unknown>[] = [];
    const budgets: Budget[] = [];
    for (const c of cases) {
      const p50s: number[] = [];
      const p99s: number[] = [];
      let errors = 0;
      for (let run = 0; run < RUNS; run++) {
        const samples = await pool(c.count, CONCURRENCY, 120_000, () => client.get(c.path));
        errors += samples.filter((s) => s.status !== 200).length;
        const ms = samples.map((s) => s.ms);
        p50s.push(quantile(ms, 0.5));
        p99s.push(quantile(ms, 0.99));
      }
      const p99 = round(median(p99s));
      rows.push({ name: c.name, concurrency: CONCURRENCY, requests: c.count, p50Ms: round(median(p50s)), p99Ms: p99, errors });
      const limit = c.path.includes('export') ? 5000 : 250;
      budgets.push(budget(`${c.name}: p99 at ${CONCURRENCY} at once`, p99, '<=', limit, 'ms'));
      budgets.push(budget(`${c.name}: errors`, errors, '==', 0));
    }
    // The bare framework under the same 10 at once: what any request costs here before the app's work.
    const floor = clientAt(floorApp().url);
    await floor.get('/api/echo');
    const bare: number[][] = [];
    for (let run = 0; run < RUNS; run++) bare.push((await pool(200, CONCURRENCY, 120_000, () => floor.get('/api/echo'))).map((s) => s.ms));
    rows.push({ name: 'bare framework: an empty route handler of the floor app', concurrency: CONCURRENCY, requests: 200,
      p50Ms: round(median(bare.map((ms) => quantile(ms, 0.5)))), p99Ms: round(median(bare.map((ms) => quantile(ms, 0.99)))) });
    rows.push({ name: `seeded ${VISITS} visits, ${FARMS} farms`, seconds: seedS });
    rows.push({ name: 'list, export, follow-up and map queries EXPLAINed', queries: queries.length, fullScans: bad.length });
    budgets.push(budget(`query steps scanning a table of over ${BIG_TABLE_ROWS} rows whole`, bad.length, '==', 0));
    report('office', rows, budgets, { scans: bad });
  } finally {
    await conn.end();
    await closeSequelize();
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
