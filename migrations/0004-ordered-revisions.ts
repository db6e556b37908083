import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

// Revisions from a single locked counter row instead of a sequence: a writer holds the row lock
// until it commits, so revisions become visible in increasing order and a pull cursor never
// skips a row that committed late.
export async function up({ context: qi }: Ctx) {
  await qi.createTable('rev_counter', {
    id: { type: DataTypes.TINYINT, primaryKey: true, allowNull: false },
    value: { type: DataTypes.BIGINT, allowNull: false },
  });
  const [rows] = await qi.sequelize.query(`SELECT GREATEST(
    (SELECT COALESCE(MAX(rev), 0) FROM farms), (SELECT COALESCE(MAX(rev), 0) FROM visits),
    (SELECT COALESCE(MAX(rev), 0) FROM water_sources), (SELECT COALESCE(MAX(rev), 0) FROM flow_measurements),
    (SELECT COALESCE(MAX(rev), 0) FROM fall_readings), (SELECT COALESCE(MAX(rev), 0) FROM points),
    (SELECT COALESCE(MAX(rev), 0) FROM photos), (SELECT COALESCE(MAX(rev), 0) FROM pipe_runs),
    (SELECT COALESCE(MAX(rev), 0) FROM demand_lines)) AS top`);
  // Never below what the sequence already handed out: rows that held the highest revisions may be
  // gone (deleted, or their tables reverted), and a counter that went back would hand out numbers
  // below a phone's pull cursor, so the phone would never see those changes.
  const [seq] = await qi.sequelize.query(
    "SELECT COUNT(*) AS n FROM information_schema.tables WHERE table_schema = DATABASE() AND table_name = 'change_rev' AND table_type = 'SEQUENCE'",
  );
  let issued = 0;
  if (Number((seq as { n: number | string }[])[0]?.n ?? 0) > 0) {
    const [next] = await qi.sequelize.query('SELECT next_not_cached_value AS n FROM change_rev');
    issued = Number((next as { n: number | string }[])[0]?.n ?? 1) - 1;
  }
  const top = Math.max(Number((rows as { top: number | string }[])[0]?.top ?? 0), issued);
  await qi.bulkInsert('rev_counter', [{ id: 1, value: top }]);
  await qi.sequelize.query('DROP SEQUENCE IF EXISTS change_rev');
}

export async function down({ context: qi }: Ctx) {
  const [rows] = await qi.sequelize.query('SELECT value FROM rev_counter WHERE id = 1');
  const next = Number((rows as { value: number | string }[])[0]?.value ?? 0) + 1;
  await qi.sequelize.query(`CREATE SEQUENCE IF NOT EXISTS change_rev START WITH ${next} INCREMENT BY 1 CACHE 100`);
  await qi.dropTable('rev_counter');
}
