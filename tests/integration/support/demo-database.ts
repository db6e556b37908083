// Databases of their own holding the demo scenario (for the backup and migration tests), and a
// table-by-table fingerprint to compare two databases exactly.
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import * as mariadb from 'mariadb';
// @ts-expect-error – plain JS module shared with the bootstrap scripts
import { dbSettings, root } from '../../../scripts/lib/env.mjs';
// @ts-expect-error – as above
import { ensureDatabase } from '../../../scripts/lib/mariadb.mjs';

export interface DbSettings {
  host: string;
  port: number;
  name: string;
  user: string;
  password: string;
  socket: string;
  dataDir: string;
}

/** The test server's settings for another database on it. */
export function dbNamed(name: string): DbSettings {
  return { ...(dbSettings() as DbSettings), name };
}

/** A sibling of the test database: `fallbook_test_<suffix>`. */
export const siblingName = (suffix: string) => `${process.env.DB_NAME ?? 'fallbook_test'}_${suffix}`;

/** Runs a node script from the repo (the backup scripts); never throws, returns its outcome. */
export function runNode(args: string[], env: Record<string, string> = {}) {
  const result = spawnSync(process.execPath, args, { cwd: root, env: { ...process.env, ...env }, encoding: 'utf8', timeout: 120_000 });
  return { status: result.status, stdout: result.stdout ?? '', stderr: result.stderr ?? '' };
}

function runTs(script: string, args: string[], dbName: string) {
  const outcome = runNode([path.join(root, 'node_modules/tsx/dist/cli.mjs'), '--conditions=react-server', script, ...args], { DB_NAME: dbName });
  if (outcome.status !== 0) throw new Error(`${script} failed: ${outcome.stderr || outcome.stdout}`);
}

/** Drops and re-creates an empty database on the test server (as root, over the socket). */
export async function freshDatabase(name: string): Promise<void> {
  await ensureDatabase(dbNamed(name), { fresh: true });
}

/** A fresh database with every migration and the demo scenario, loaded as `npm start` does. */
export async function demoDatabase(name: string): Promise<void> {
  await freshDatabase(name);
  runTs('scripts/migrate.ts', ['up'], name);
  runTs('scripts/seed.ts', [], name);
}

/** `next` is set for a SEQUENCE (its next value; a sequence has no rows to checksum). */
export interface TablePrint {
  rows: number;
  checksum: string;
  create: string;
  next?: number;
}

/** Every table's row count, CHECKSUM TABLE and definition (AUTO_INCREMENT counters left out). */
export async function fingerprint(name: string, skip: readonly string[] = []): Promise<Map<string, TablePrint>> {
  const db = dbNamed(name);
  const conn = await mariadb.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password, database: name, bigIntAsNumber: true });
  try {
    const tables = (
      (await conn.query('SELECT table_name AS t, table_type AS k FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY 1')) as {
        t: string;
        k: string;
      }[]
    ).filter((r) => !skip.includes(r.t));
    const out = new Map<string, TablePrint>();
    for (const { t, k } of tables) {
      if (k === 'SEQUENCE') {
        const [seq] = (await conn.query(`SELECT next_not_cached_value AS n FROM \`${t}\``)) as { n: number }[];
        const [create] = (await conn.query(`SHOW CREATE SEQUENCE \`${t}\``)) as Record<string, string>[];
        out.set(t, { rows: 1, checksum: 'sequence', create: create?.['Create Table'] ?? '', next: Number(seq?.n) });
        continue;
      }
      const [count] = (await conn.query(`SELECT COUNT(*) AS n FROM \`${t}\``)) as { n: number }[];
      const [sum] = (await conn.query(`CHECKSUM TABLE \`${t}\``)) as { Checksum: number | string | null }[];
      const [create] = (await conn.query(`SHOW CREATE TABLE \`${t}\``)) as Record<string, string>[];
      out.set(t, {
        rows: Number(count?.n ?? -1),
        checksum: String(sum?.Checksum ?? 'none'),
        create: (create?.['Create Table'] ?? '').replace(/ AUTO_INCREMENT=\d+/, ''),
      });
    }
    return out;
  } finally {
    await conn.end();
  }
}

/** Total rows over the fingerprint's tables. */
export const totalRows = (print: Map<string, TablePrint>) => [...print.values()].reduce((sum, t) => sum + t.rows, 0);
