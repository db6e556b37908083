// node scripts/db-restore.mjs <file> [--force] [--test] [--database NAME] – npm run db:restore:
// loads a dump made by db:backup into the app's database. Refuses a database that holds tables
// unless --force, which first drops every table so the result is exactly the backup.
// Stop the app first: a restore under a running app mixes old and new rows.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { emptyDatabase, listTables, loadDump } from './lib/backup.mjs';
import { loadEnv } from './lib/env.mjs';
import { ensureDatabase, startDatabase } from './lib/mariadb.mjs';
import { fail, log } from './lib/proc.mjs';

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: { force: { type: 'boolean', default: false }, test: { type: 'boolean', default: false }, database: { type: 'string' } },
});
const file = positionals[0];
if (!file) fail('usage: npm run db:restore -- <backup file> [--force]   (files are in .data/backups/)');
const full = path.resolve(file);
if (!existsSync(full)) fail(`no such backup file: ${full}`);

const db = loadEnv(values.test ? 'test' : 'local');
if (values.database) db.name = values.database;

try {
  await startDatabase(db);
  await ensureDatabase(db);
  const present = await listTables(db);
  if (present.length && !values.force) {
    fail(
      `database ${db.name} is not empty (${present.length} tables); nothing was changed. ` +
        'Restoring replaces everything in it: run again with --force to do so (take a backup first).',
    );
  }
  const started = Date.now();
  if (present.length) await emptyDatabase(db);
  await loadDump(db, full);
  const tables = await listTables(db);
  log(`restored ${tables.length} tables into ${db.name} from ${path.relative(process.cwd(), full)} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
} catch (error) {
  fail(`restore failed: ${error.message}`);
}
