// Direct reads of the test MariaDB from end-to-end tests (to check what really arrived).
import * as mariadb from 'mariadb';

function connect() {
  return mariadb.createConnection({
    host: process.env.DB_HOST ?? '127.0.0.1',
    port: Number(process.env.DB_PORT ?? 3308),
    user: process.env.DB_USER ?? 'fallbook_test',
    password: process.env.DB_PASSWORD ?? 'fallbook-test',
    database: process.env.DB_NAME ?? 'fallbook_test',
    bigIntAsNumber: true,
    decimalAsNumber: true,
  });
}

export async function query<T>(sql: string, params: unknown[] = []): Promise<T[]> {
  const conn = await connect();
  try {
    return (await conn.query(sql, params)) as T[];
  } finally {
    await conn.end();
  }
}

/**
 * Whether another transaction holds the revision counter's row lock right now (a sync push is
 * writing records): a NOWAIT locking read fails instead of waiting. Needs no PROCESS privilege.
 */
/**
 * Holds an uncommitted sync_ops row under the given op id: a push carrying that op waits on it at
 * its last insert, after it took the revision lock, so the test can act while the push's
 * transaction is certainly open. `release` rolls the row back.
 */
export async function holdSyncOp(opId: string, userId: string): Promise<{ release(): Promise<void> }> {
  const conn = await connect();
  await conn.beginTransaction();
  await conn.query("INSERT INTO sync_ops (op_id, user_id, entity, entity_id, outcome, created_at) VALUES (?, ?, 'point', ?, '{}', NOW(3))", [
    opId,
    userId,
    opId,
  ]);
  return {
    async release() {
      await conn.rollback().catch(() => undefined);
      await conn.end();
    },
  };
}

export async function revisionLockHeld(): Promise<boolean> {
  const conn = await connect();
  try {
    await conn.beginTransaction();
    await conn.query('SELECT value FROM rev_counter WHERE id = 1 FOR UPDATE NOWAIT');
    return false;
  } catch (error) {
    if ([1205, 3572].includes((error as { errno?: number }).errno ?? 0)) return true;
    throw error;
  } finally {
    await conn.rollback().catch(() => undefined);
    await conn.end();
  }
}
