// Migrations on a database holding the demo data. For each migration, newest first: restore the
// demo database (at the newest schema) from a dump, revert down to and including that migration,
// run every migration up again, and revert once more. What "loses nothing" means here:
// - reverting keeps every row of every table it keeps, and a table whose definition the reverted
//   migrations did not change keeps its exact contents (CHECKSUM TABLE);
// - migrating up again gives every table back its definition and its rows (same counts; same
//   checksum where the definition is untouched); only the tables the reverted migrations created
//   come back empty — dropping them is what reverting means, and the test reports those rows;
// - up then down again is exact: the reverted state is the same, table by table, checksum by checksum.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize } from '@/lib/server/db/connection';
import { createMigrator } from '@/lib/server/db/migrator';
// @ts-expect-error – plain JS module shared with the bootstrap scripts
import { dumpDatabase, emptyDatabase, loadDump } from '../../scripts/lib/backup.mjs';
import { dbNamed, demoDatabase, fingerprint, siblingName, type TablePrint } from './support/demo-database';
import { MIGRATIONS } from '@/migrations';

const name = siblingName('migrate_data');
const dir = mkdtempSync(path.join(tmpdir(), 'fallbook-migrate-'));
const dump = path.join(dir, 'demo.sql');
const META = ['schema_migrations'];
const sequelize = createSequelize({ DB_NAME: name });
let head: Map<string, TablePrint>;
const report = { steps: 0, tablesKept: 0, rowsKept: 0, rowsDroppedWithTheirTables: 0 };

beforeAll(async () => {
  await demoDatabase(name);
  await dumpDatabase(dbNamed(name), dump);
  head = await fingerprint(name, META);
}, 120_000);

afterAll(async () => {
  await sequelize.close();
  rmSync(dir, { recursive: true, force: true });
  console.log(
    `[migrations with data] ${report.steps} migrations reverted and re-applied on the demo data: ` +
      `${report.tablesKept} table states kept with ${report.rowsKept} rows; ${report.rowsDroppedWithTheirTables} rows dropped with the tables their migrations created`,
  );
});

const names = MIGRATIONS.map((m) => m.name).reverse();

/**
 * Same contents: equal CHECKSUM TABLE; for a sequence (the revision counter), a next value that
 * never went back — running migrations may draw from it, and revisions must only ever grow.
 */
function sameContents(now: TablePrint | undefined, then: TablePrint): boolean {
  if (!now) return false;
  if (then.next !== undefined) return (now.next ?? -1) >= then.next;
  return now.checksum === then.checksum;
}

/** The reverted state again: same tables, definitions and rows, same contents as above. */
function expectSameState(now: Map<string, TablePrint>, then: Map<string, TablePrint>) {
  expect([...now.keys()]).toEqual([...then.keys()]);
  for (const [table, print] of then) {
    expect(now.get(table)?.create, table).toBe(print.create);
    expect(now.get(table)?.rows, table).toBe(print.rows);
    expect(sameContents(now.get(table), print), `${table} contents`).toBe(true);
  }
}

describe('migrations down and up on the demo data', () => {
  it('the demo database is at the newest schema and has rows', () => {
    expect(names.length).toBeGreaterThanOrEqual(9);
    expect([...head.values()].some((t) => t.rows > 0)).toBe(true);
  });

  for (const migration of names) {
    it(`revert to before ${migration}, migrate up, revert again: nothing kept is lost`, async () => {
      const db = dbNamed(name);
      await emptyDatabase(db);
      await loadDump(db, dump);
      expect(await fingerprint(name, META)).toEqual(head);
      const migrator = createMigrator(sequelize);

      await migrator.down({ to: migration });
      const reverted = await fingerprint(name, META);
      for (const [table, print] of reverted) {
        const before = head.get(table);
        if (!before) continue; // a table the newer migrations dropped or renamed, back as it was
        expect(print.rows, `${table} rows after reverting ${migration}`).toBe(before.rows);
        if (print.create === before.create) expect(sameContents(print, before), `${table} contents after reverting ${migration}`).toBe(true);
        report.tablesKept += 1;
        report.rowsKept += print.rows;
      }

      await migrator.up();
      const again = await fingerprint(name, META);
      expect([...again.keys()]).toEqual([...head.keys()]);
      for (const [table, print] of head) {
        const now = again.get(table);
        expect(now?.create, `${table} definition after migrating up again`).toBe(print.create);
        const kept = reverted.get(table);
        if (!kept) {
          report.rowsDroppedWithTheirTables += print.rows;
          continue;
        }
        expect(now?.rows, `${table} rows after migrating up again`).toBe(print.rows);
        if (kept.create === print.create) expect(sameContents(now, print), `${table} contents after migrating up again`).toBe(true);
      }

      await migrator.down({ to: migration });
      expectSameState(await fingerprint(name, META), reverted);
      report.steps += 1;
    }, 120_000);
  }
});
