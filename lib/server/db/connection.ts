import 'server-only';
import { existsSync } from 'node:fs';
import * as mariadb from 'mariadb';
import { Sequelize, type Options } from 'sequelize';
import { initModels } from '@/models';
import { dbEnv } from '../env';
import { readsGoToWriter } from './read-routing';

// One Sequelize instance per process, cached on globalThis to survive dev reloads.
const globalForDb = globalThis as unknown as { fallbookSequelize?: Sequelize };

type DbEnv = ReturnType<typeof dbEnv>;

/** `host:port, host:port` → Sequelize read targets (port defaults to the writer's). */
export function parseReadHosts(list: string, defaultPort: number): { host: string; port: number }[] {
  return list
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean)
    .map((entry) => {
      const match = /^(\[[^\]]+\]|[^:]+)(?::(\d+))?$/.exec(entry);
      if (!match?.[1]) throw new Error(`DB_READ_HOSTS: cannot read "${entry}" (expected host or host:port)`);
      return { host: match[1].replace(/^\[|\]$/g, ''), port: match[2] ? Number(match[2]) : defaultPort };
    });
}

/** Replication settings when DB_READ_HOSTS names replicas; none (one server, as always) otherwise. */
function replication(env: DbEnv): Pick<Options, 'replication'> {
  const reads = parseReadHosts(env.DB_READ_HOSTS, env.DB_PORT);
  if (reads.length === 0) return {};
  const account = { username: env.DB_USER, password: env.DB_PASSWORD };
  return { replication: { write: { host: env.DB_HOST, port: env.DB_PORT, ...account }, read: reads.map((r) => ({ ...r, ...account })) } };
}

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '::1']);

/** The writer's Unix socket when the server runs on this machine and has one (DB_SOCKET). */
export function localSocket(env: Pick<DbEnv, 'DB_SOCKET' | 'DB_HOST' | 'DB_READ_HOSTS'>): { socketPath?: string } {
  if (!env.DB_SOCKET || !LOOPBACK.has(env.DB_HOST) || env.DB_READ_HOSTS.trim() || !existsSync(env.DB_SOCKET)) return {};
  return { socketPath: env.DB_SOCKET };
}

/** A Sequelize instance for DB_* (with overrides); with read hosts, SELECTs go to the replicas. */
export function createSequelize(overrides: Partial<DbEnv> = {}) {
  const env = { ...dbEnv(), ...overrides };
  const sequelize = new Sequelize(env.DB_NAME, env.DB_USER, env.DB_PASSWORD, {
    dialect: 'mariadb',
    dialectModule: mariadb,
    host: env.DB_HOST,
    port: env.DB_PORT,
    ...replication(env),
    logging: false,
    pool: { max: env.DB_POOL_MAX, min: 0, idle: 10_000 },
    // Keep instants in UTC regardless of the server's zone.
    timezone: '+00:00',
    dialectOptions: {
      ...localSocket(env),
      bigIntAsNumber: true,
      decimalAsNumber: true,
      insertIdAsNumber: true,
      // Every transaction reads what others committed before each statement (the sync push relies
      // on it: DEVELOPERS.md, "The push writes in bulk"); set once per connection, not per transaction.
      initSql: 'SET SESSION TRANSACTION ISOLATION LEVEL READ COMMITTED',
    },
    define: { underscored: true },
  });
  if (env.DB_READ_HOSTS.trim()) routeReadsAfterWrites(sequelize, env.DB_READ_AFTER_WRITE_SECONDS);
  return sequelize;
}

/**
 * Sequelize picks the pool per query (`useMaster`), but has no hook before it does: wrap the one
 * place it asks for a connection so reads that must see one's own writes get the primary.
 */
function routeReadsAfterWrites(sequelize: Sequelize, windowSeconds: number) {
  const manager = (sequelize as unknown as { connectionManager: { getConnection(options?: { useMaster?: boolean }): Promise<unknown> } }).connectionManager;
  const getConnection = manager.getConnection.bind(manager);
  manager.getConnection = async (options = {}) =>
    getConnection(!options.useMaster && (await readsGoToWriter(windowSeconds)) ? { ...options, useMaster: true } : options);
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
