import 'server-only';
import { QueryTypes } from 'sequelize';
import { getSequelize } from './db/connection';

/** Database round trip; with `details` (coordinators only) the server version and applied migrations. Never throws. */
export async function checkHealth(details = false) {
  const started = Date.now();
  try {
    const sequelize = getSequelize();
    const [row] = await sequelize.query<{ version: string }>('SELECT VERSION() AS version', { type: QueryTypes.SELECT });
    const latencyMs = Date.now() - started;
    if (!details) return { ok: true, database: { ok: true, latencyMs } };
    const migrations = await sequelize.query<{ name: string }>('SELECT name FROM schema_migrations ORDER BY name', {
      type: QueryTypes.SELECT,
    });
    return { ok: true, database: { ok: true, version: row?.version ?? 'unknown', latencyMs }, migrations: migrations.map((m) => m.name) };
  } catch (error) {
    console.error('[fallbook] health check failed', error);
    return { ok: false, database: { ok: false, error: 'The database did not answer.' } };
  }
}
