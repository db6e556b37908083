// Brings up the test database when the integration tests run on their own (npm test already did).
// @ts-expect-error – plain JS modules shared with the bootstrap scripts
import { loadEnv } from '../../scripts/lib/env.mjs';
// @ts-expect-error – as above
import { ensureDatabase, startDatabase } from '../../scripts/lib/mariadb.mjs';
// @ts-expect-error – as above
import { runTs } from '../../scripts/lib/stack.mjs';

export default async function setup() {
  const db = loadEnv('test');
  await startDatabase(db);
  await ensureDatabase(db);
  // A second database for the migrations test, so reverting never touches the shared one.
  await ensureDatabase({ ...db, name: `${db.name}_migrations` }, { fresh: true });
  runTs('scripts/migrate.ts', ['up']);
}
