// Direct reads of the test MariaDB from end-to-end tests (to check what really arrived).
import * as mariadb from 'mariadb';

export async function query<T>(sql: string, params: unknown[] = []): Promise<T[]> {
  const conn = await mariadb.createConnection({
    host: process.env.DB_HOST ?? '127.0.0.1', port: Number(process.env.DB_PORT ?? 3308),
    user: process.env.DB_USER ?? 'fallbook_test', password: process.env.DB_PASSWORD ?? 'fallbook-test',
    database: process.env.DB_NAME ?? 'fallbook_test', bigIntAsNumber: true, decimalAsNumber: true,
  });
  try {
    return (await conn.query(sql, params)) as T[];
  } finally {
    await conn.end();
  }
}
