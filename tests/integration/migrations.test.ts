import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { createSequelize } from '@/lib/server/db/connection';
import { createMigrator } from '@/lib/server/db/migrator';

// A database of its own (made fresh by the global set-up) so reverting never touches the shared one.
const sequelize = createSequelize({ DB_NAME: `${process.env.DB_NAME}_migrations` });
afterAll(() => sequelize.close());

async function tables(): Promise<string[]> {
  const rows = await sequelize.query<{ t: string }>(
    "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name <> 'schema_migrations' ORDER BY 1",
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.t);
}

describe('migrations', () => {
  it('run up, all the way down, and up again to the same schema', async () => {
    const migrator = createMigrator(sequelize);
    const applied = await migrator.up();
    expect(applied.length).toBeGreaterThanOrEqual(3);
    const afterUp = await tables();
    expect(afterUp).toEqual(
      expect.arrayContaining([
        'organisations',
        'users',
        'farms',
        'visits',
        'flow_measurements',
        'fall_readings',
        'points',
        'photos',
        'demand_lines',
        'screenings',
        'audit_log',
        'sync_ops',
      ]),
    );

    await migrator.down({ to: 0 });
    expect(await tables()).toEqual([]);

    await migrator.up();
    expect(await tables()).toEqual(afterUp);
  });

  it('every table that lists by visit has an index starting with visit_id', async () => {
    const rows = await sequelize.query<{ t: string }>(
      `SELECT DISTINCT table_name AS t FROM information_schema.statistics
       WHERE table_schema = DATABASE() AND column_name = 'visit_id' AND seq_in_index = 1`,
      { type: QueryTypes.SELECT },
    );
    expect(rows.map((r) => r.t)).toEqual(expect.arrayContaining(['flow_measurements', 'fall_readings', 'points', 'photos', 'screenings', 'audit_log']));
  });
});
