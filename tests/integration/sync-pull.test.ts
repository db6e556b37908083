import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { Visit, getSequelize, observeStatements } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';
import { pull, pullAll, pulledIds, push, putOp, readingOps } from './support/sync';

async function reassign(visitId: string, advisorId: string) {
  await getSequelize().transaction(async (transaction) => {
    const visit = await Visit.findByPk(visitId, { transaction, rejectOnEmpty: true });
    await visit.update({ advisorId }, { transaction });
  });
}

describe('pull', () => {
  it("returns the caller's visits, farms, records and settings, and nothing of another advisor's visit", async () => {
    const o = await makeOrganisation('pull-scope');
    const mine = readingOps(o.visit.id, o.farm.id);
    const theirs = readingOps(o.otherVisit.id, o.otherFarm.id);
    await push(o.advisor, { ops: mine.ops });
    await push(o.otherAdvisor, { ops: theirs.ops });

    const page = await pull(o.advisor);
    expect(page.visibleVisitIds).toEqual([o.visit.id]);
    expect(page.visits.map((v) => v.id)).toEqual([o.visit.id]);
    expect(page.farms.map((f) => f.id)).toEqual([o.farm.id]);
    expect(page.farms[0]?.ownerName).toBe(o.farmer.name);
    const ids = pulledIds(page);
    for (const id of Object.values(mine.ids)) expect(ids.some((x) => x.endsWith(id))).toBe(true);
    for (const id of Object.values(theirs.ids)) expect(ids.some((x) => x.endsWith(id))).toBe(false);
    expect(page.settings).toMatchObject({ unitsDefault: 'metric', designFractionOfLowest: 0.5 });
    const revs = page.records.point.map((r) => r.rev);
    expect(revs.every((rev) => rev <= page.cursor)).toBe(true);
  });

  it('a newly assigned visit arrives whole: its farm, demand lines and every record, whatever their revisions', async () => {
    const o = await makeOrganisation('pull-assign');
    const theirs = readingOps(o.otherVisit.id, o.otherFarm.id);
    await push(o.otherAdvisor, { ops: theirs.ops });
    const before = await pull(o.advisor);
    expect(before.visibleVisitIds).not.toContain(o.otherVisit.id);

    await reassign(o.otherVisit.id, o.advisor.id);
    const after = await pull(o.advisor, before.cursor);
    expect(after.visibleVisitIds.sort()).toEqual([o.visit.id, o.otherVisit.id].sort());
    expect(after.visits.map((v) => v.id)).toEqual([o.otherVisit.id]);
    expect(after.farms.map((f) => f.id)).toEqual([o.otherFarm.id]);
    const ids = pulledIds(after);
    for (const [name, id] of Object.entries(theirs.ids))
      expect(
        ids.some((x) => x.endsWith(id)),
        name,
      ).toBe(true);

    // ...and the advisor it was taken from is told to drop it.
    expect((await pull(o.otherAdvisor, 0)).visibleVisitIds).not.toContain(o.otherVisit.id);
  });

  it('paging with a small limit returns every record exactly once, in revision order', async () => {
    const o = await makeOrganisation('pull-pages');
    await push(o.advisor, { ops: readingOps(o.visit.id, o.farm.id).ops });
    await push(o.advisor, {
      ops: Array.from({ length: 7 }, (_, i) =>
        putOp('point', randomUUID(), {
          visitId: o.visit.id,
          role: 'station',
          label: `Station ${i}`,
          lat: null,
          lon: null,
          accuracyM: null,
          altitudeM: null,
          altitudeAccuracyM: null,
          chainageM: i * 20,
          capturedAt: null,
        }),
      ),
    });
    const whole = pulledIds(await pull(o.advisor, 0, 2000));
    const { pages } = await pullAll(o.advisor, 0, 3);
    expect(pages.length).toBeGreaterThan(5);
    const paged = pages.flatMap(pulledIds);
    expect(new Set(paged).size).toBe(paged.length);
    expect(paged.sort()).toEqual(whole.sort());
    for (const [i, page] of pages.entries()) {
      const prev = i === 0 ? 0 : (pages[i - 1]?.cursor ?? 0);
      expect(page.cursor).toBeGreaterThanOrEqual(prev);
    }
    expect(pages.at(-1)?.hasMore).toBe(false);
  });

  it('a row committed after the pull read the revision counter waits for the next pull, so the cursor never passes it', async () => {
    const o = await makeOrganisation('pull-top');
    await push(o.advisor, { ops: readingOps(o.visit.id, o.farm.id).ops });
    const before = await pull(o.advisor, 0);
    const sequelize = getSequelize();
    const [[counter]] = (await sequelize.query('SELECT value FROM rev_counter WHERE id = 1')) as [{ value: number }[], unknown];
    // A point whose transaction holds revisions above the counter's committed value: as the pull
    // sees a push that commits between two of its reads.
    const late = randomUUID();
    const rev = Number(counter?.value) + 1_000_000;
    await sequelize.query(
      `INSERT INTO points (id, visit_id, role, label, rev, created_by_id, created_at, updated_at) VALUES (?, ?, 'station', 'Late', ?, ?, NOW(3), NOW(3))`,
      { replacements: [late, o.visit.id, rev, o.advisor.id] },
    );
    const during = await pull(o.advisor, before.cursor);
    expect(during.records.point.map((p) => p.id)).not.toContain(late);
    expect(during.cursor).toBeLessThan(rev);
    // Its transaction commits (the counter reaches its revision): the next pull brings it.
    await sequelize.query('UPDATE rev_counter SET value = ? WHERE id = 1 AND value < ?', { replacements: [rev, rev] });
    const after = await pull(o.advisor, during.cursor);
    expect(after.records.point.map((p) => p.id)).toContain(late);
    expect(after.cursor).toBe(rev);
  });

  it("a coordinator pulls the organisation's booked and walked visits", async () => {
    const o = await makeOrganisation('pull-office');
    const page = await pull(o.coordinator);
    expect(page.visibleVisitIds.sort()).toEqual([o.visit.id, o.otherVisit.id].sort());
  });

  it('answers 422 for a bad cursor, 403 for a farmer', async () => {
    const o = await makeOrganisation('pull-bad');
    const { GET } = await import('@/app/api/sync/pull/route');
    const { request, params } = await import('./support/fixtures');
    expect((await GET(await request('/api/sync/pull?cursor=-1', o.advisor), params({}))).status).toBe(422);
    expect((await GET(await request('/api/sync/pull?limit=5000', o.advisor), params({}))).status).toBe(422);
    expect((await GET(await request('/api/sync/pull', o.farmer), params({}))).status).toBe(403);
  });

  it('every query a push and a pull run has an index to use (EXPLAIN)', async () => {
    const o = await makeOrganisation('pull-explain');
    const sequelize = getSequelize();
    const statements: { sql: string; values?: unknown[] }[] = [];
    const options = (sequelize as unknown as { options: { logging: unknown } }).options;
    const logging = options.logging;
    options.logging = (sql: string) => {
      statements.push({ sql: sql.replace(/^Executing \([^)]*\): /, '') });
    };
    // The push and the pull also send statements straight on their transaction's connection.
    const stop = observeStatements((sql, values) => {
      statements.push({ sql, values });
    });
    try {
      const { ops } = readingOps(o.visit.id, o.farm.id);
      await push(o.advisor, { ops });
      await pull(o.advisor, 0);
      await pull(o.advisor, 1);
    } finally {
      options.logging = logging;
      stop();
    }
    const tables = /\b(visits|farms|demand_lines|water_sources|flow_measurements|fall_readings|points|photos|pipe_runs|sync_ops)\b/;
    const selects = [
      ...new Map(
        statements
          .filter(({ sql }) => /^SELECT/i.test(sql) && tables.test(sql) && !/LAST_INSERT_ID/.test(sql))
          .map((s) => [`${s.sql} ${JSON.stringify(s.values ?? [])}`, s]),
      ).values(),
    ];
    expect(selects.length).toBeGreaterThan(10);
    for (const { sql, values } of selects) {
      const plan = await sequelize.query<{ table: string; type: string; possible_keys: string | null }>(`EXPLAIN ${sql}`, {
        type: QueryTypes.SELECT,
        replacements: values,
      });
      for (const step of plan) {
        if (!tables.test(step.table ?? '') && !/^[A-Z]/.test(step.table ?? '')) continue;
        expect(step.possible_keys, `${sql}\n${JSON.stringify(step)}`).not.toBeNull();
      }
    }
  });
});

describe('a large batch', () => {
  // Speed is measured by tests/bench/sync.bench.ts (npm run bench), not here: shared CI machines
  // make any time bound flaky. This checks a full batch applies whole and pulls back whole.
  it('200 ops pushed in one batch are all applied, each with its own revision', async () => {
    const o = await makeOrganisation('push-speed');
    const ops = Array.from({ length: 200 }, (_, i) =>
      putOp('point', randomUUID(), {
        visitId: o.visit.id,
        role: 'station',
        label: `Station ${i}`,
        lat: 52.4 + i / 1e4,
        lon: -3.6,
        accuracyM: 4,
        altitudeM: 230 + i / 10,
        altitudeAccuracyM: 6,
        chainageM: i * 5,
        capturedAt: '2026-08-01T10:00:00Z',
      }),
    );
    const { results } = await push(o.advisor, { ops });
    expect(results.filter((r) => r.status === 'applied')).toHaveLength(200);
    expect(new Set(results.map((r) => r.rev)).size).toBe(200);
  });
});
