// node scripts/db-backup.mjs [file] [--test] [--database NAME] – npm run db:backup: dumps the app's
// database (one consistent snapshot, the app may keep running) to a file, by default
// .data/backups/<database>-<UTC timestamp>.sql.gz. Starts the private MariaDB if it is not running.
import path from 'node:path';
import { parseArgs } from 'node:util';
import { defaultBackupFile, dumpDatabase, listTables } from './lib/backup.mjs';
import { loadEnv } from './lib/env.mjs';
import { startDatabase } from './lib/mariadb.mjs';
import { fail, log } from './lib/proc.mjs';

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: { test: { type: 'boolean', default: false }, database: { type: 'string' } },
});
const db = loadEnv(values.test ? 'test' : 'local');
if (values.database) db.name = values.database;

try {
  await startDatabase(db);
  const tables = await listTables(db);
  if (!tables.length) fail(`database ${db.name} has no tables: nothing to back up`);
  const file = path.resolve(positionals[0] ?? defaultBackupFile(db));
  const started = Date.now();
  await dumpDatabase(db, file);
  log(`backed up ${tables.length} tables of ${db.name} to ${path.relative(process.cwd(), file)} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  log(`restore with: npm run db:restore -- ${path.relative(process.cwd(), file)}`);
} catch (error) {
  fail(`backup failed: ${error.message}`);
}
