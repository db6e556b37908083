// npm run db:backup / db:restore round-trip the demo data exactly: every table's rows, CHECKSUM
// TABLE and definition are the same in a fresh database restored from the dump.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import * as mariadb from 'mariadb';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dbNamed, demoDatabase, fingerprint, freshDatabase, runNode, siblingName, totalRows, type TablePrint } from './support/demo-database';

const source = siblingName('backup_demo');
const target = siblingName('backup_restored');
const dir = mkdtempSync(path.join(tmpdir(), 'fallbook-backup-'));
const file = path.join(dir, 'demo.sql.gz');
let demo: Map<string, TablePrint>;

const backup = (...args: string[]) => runNode(['scripts/db-backup.mjs', '--test', ...args]);
const restore = (...args: string[]) => runNode(['scripts/db-restore.mjs', '--test', ...args]);

beforeAll(async () => {
  await demoDatabase(source);
  await freshDatabase(target);
  demo = await fingerprint(source);
}, 120_000);

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('db:backup and db:restore', () => {
  it('the demo database has data in its tables to round-trip', () => {
    expect(demo.size).toBeGreaterThan(15);
    expect(demo.get('users')?.rows).toBeGreaterThanOrEqual(6);
    expect(demo.get('visits')?.rows).toBeGreaterThan(0);
    expect(demo.get('screenings')?.rows).toBeGreaterThan(0);
  });

  it('backs up to a gzip file and restores into a fresh database: every table identical', async () => {
    const dumped = backup('--database', source, file);
    expect(dumped.status, dumped.stderr).toBe(0);
    expect(dumped.stdout).toMatch(new RegExp(`backed up ${demo.size} tables`));
    expect(readFileSync(file).subarray(0, 2)).toEqual(Buffer.from([0x1f, 0x8b]));

    const restored = restore('--database', target, file);
    expect(restored.status, restored.stderr).toBe(0);
    const copy = await fingerprint(target);
    expect([...copy.keys()]).toEqual([...demo.keys()]);
    for (const [table, print] of demo) expect(copy.get(table), table).toEqual(print);
    console.log(`[backup] ${demo.size} tables, ${totalRows(demo)} rows round-tripped with identical CHECKSUM TABLE`);
  });

  it('refuses to restore over a database that holds tables, and changes nothing', async () => {
    const db = dbNamed(target);
    const conn = await mariadb.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password, database: target });
    try {
      await conn.query("UPDATE organisations SET name = 'Changed after the backup'");
    } finally {
      await conn.end();
    }
    const changed = await fingerprint(target);
    const refused = restore('--database', target, file);
    expect(refused.status).not.toBe(0);
    expect(refused.stderr).toMatch(/not empty.*--force/s);
    expect(await fingerprint(target)).toEqual(changed);

    const forced = restore('--database', target, file, '--force');
    expect(forced.status, forced.stderr).toBe(0);
    expect(await fingerprint(target)).toEqual(demo);
  });

  it('without a file argument: backup writes .data/backups/<database>-<timestamp>.sql.gz; restore says what it needs', () => {
    const dumped = backup('--database', source);
    expect(dumped.status, dumped.stderr).toBe(0);
    const match = new RegExp(`(\\.data/backups/${source}-\\d{8}T\\d{6}Z\\.sql\\.gz)`).exec(dumped.stdout);
    expect(match, dumped.stdout).not.toBeNull();
    const written = path.resolve(match?.[1] ?? 'missing');
    expect(existsSync(written)).toBe(true);
    rmSync(written);

    const usage = restore('--database', target);
    expect(usage.status).not.toBe(0);
    expect(usage.stderr).toMatch(/usage: npm run db:restore -- <backup file>/);
    const missing = restore('--database', target, path.join(dir, 'no-such-file.sql.gz'));
    expect(missing.status).not.toBe(0);
    expect(missing.stderr).toMatch(/no such backup file/);
  });
});
