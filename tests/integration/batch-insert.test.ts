// The bulk writer of the push (models/batch-insert.ts): values it binds as text to keep one bulk
// statement still read back as the models read them.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { batchInsert, getSequelize, Point, txConnection } from '@/lib/server/db';
import { makeOrganisation } from './support/fixtures';

const executes = async (transaction: Parameters<typeof txConnection>[0]) => {
  const [row] = await txConnection(transaction).query<{ Value: string }[]>("SHOW SESSION STATUS LIKE 'Com_stmt_execute'");
  return Number(row?.Value);
};

describe('batchInsert', () => {
  it('writes whole and fractional numbers of one column in a single bulk statement, each read back exactly', async () => {
    const o = await makeOrganisation('bulk-doubles');
    // Whole and fractional numbers alternate; the connector would start a new statement at each change.
    const altitudes = [230, 230.01, 0.1 + 0.2, -5, 1e-7, 123456789.123, 231, 52.400001, 1e21, 0];
    const now = new Date();
    const rows = altitudes.map((altitudeM, i) => ({
      id: randomUUID(),
      visitId: o.visit.id,
      role: 'station',
      label: `S${i}`,
      altitudeM,
      chainageM: i % 2 === 0 ? i : i + 0.5,
      rev: 0,
      createdAt: now,
      updatedAt: now,
    }));
    const statements = await getSequelize().transaction(async (transaction) => {
      const before = await executes(transaction);
      await batchInsert(Point, rows, transaction);
      return (await executes(transaction)) - before;
    });
    expect(statements).toBe(1);
    const stored = await Point.findAll({ where: { id: rows.map((r) => r.id) } });
    const byId = new Map(stored.map((p) => [p.id, p]));
    for (const row of rows) {
      expect(byId.get(row.id)?.altitudeM).toBe(row.altitudeM);
      expect(byId.get(row.id)?.chainageM).toBe(row.chainageM);
    }
  });
});
