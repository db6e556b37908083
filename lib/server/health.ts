import 'server-only';
import { QueryTypes } from 'sequelize';
import { getSequelize } from './db/connection';

/** Database round trip plus the applied migrations; never throws. */
export async function checkHealth() {
  const started = Date.now();
  try {
    const sequelize = getSequelize();
    const [row] = await sequelize.query<{ version: string }>('SELECT VERSION() AS version', { type: QueryTypes.SELECT });
    const migrations = await sequelize.query<{ name: string }>('SELECT name FROM schema_migrations ORDER BY name', {
      type: QueryTypes.SELECT,
    });
    return {
      ok: true,
      database: { ok: true, version: row?.version ?? 'unknown', latencyMs: Date.now() - started },
      migrations: migrations.map((m) => m.name),
    };
  } catch (error) {
    console.error('[fallbook] health check failed', error);
    return { ok: false, database: { ok: false, error: 'The database did not answer.' }, migrations: [] };
  }
}
