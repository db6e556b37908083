// node scripts/db.mjs start|stop|status [--test] – the private MariaDB by hand.
import { loadEnv } from './lib/env.mjs';
import { ensureDatabase, startDatabase, stopDatabase } from './lib/mariadb.mjs';
import { log } from './lib/proc.mjs';

const [command = 'start', flag] = process.argv.slice(2);
const db = loadEnv(flag === '--test' ? 'test' : 'local');

if (command === 'start') {
  await startDatabase(db);
  await ensureDatabase(db);
  log(`database ${db.name} ready on ${db.host}:${db.port}`);
} else if (command === 'stop') {
  log((await stopDatabase(db)) ? 'MariaDB stopped' : 'MariaDB was not running');
} else {
  console.error('usage: node scripts/db.mjs start|stop [--test]');
  process.exit(2);
}
