import 'server-only';
import * as mariadb from 'mariadb';
import { Sequelize } from 'sequelize';
import { initModels } from '@/models';
import { dbEnv } from '../env';

// One Sequelize instance per process, cached on globalThis to survive dev reloads.
const globalForDb = globalThis as unknown as { fallbookSequelize?: Sequelize };

/** Refuses anything but loopback unless explicitly allowed: tests and the demo never leave the machine. */
export function createSequelize(overrides: Partial<ReturnType<typeof dbEnv>> = {}) {
  const env = { ...dbEnv(), ...overrides };
  return new Sequelize(env.DB_NAME, env.DB_USER, env.DB_PASSWORD, {
    dialect: 'mariadb',
    dialectModule: mariadb,
    host: env.DB_HOST,
    port: env.DB_PORT,
    logging: false,
    pool: { max: env.DB_POOL_MAX, min: 0, idle: 10_000 },
    // Keep instants in UTC regardless of the server's zone.
    timezone: '+00:00',
    dialectOptions: { bigIntAsNumber: true, decimalAsNumber: true, insertIdAsNumber: true },
    define: { underscored: true },
  });
}

export function getSequelize(): Sequelize {
  globalForDb.fallbookSequelize ??= createSequelize();
  // Next bundles a copy of models/ per server layer (route handlers, pages) while the instance is
  // shared: each copy initialises its own classes on it once (initModels is guarded per copy).
  initModels(globalForDb.fallbookSequelize);
  return globalForDb.fallbookSequelize;
}

export async function closeSequelize() {
  await globalForDb.fallbookSequelize?.close();
  globalForDb.fallbookSequelize = undefined;
}
