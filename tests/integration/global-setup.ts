// Brings up the test database and mail catcher when the integration tests run on their own
// (npm test already did; then both calls find them running).
import path from 'node:path';
// @ts-expect-error – plain JS modules shared with the bootstrap scripts
import { loadEnv, root } from '../../scripts/lib/env.mjs';
// @ts-expect-error – as above
import { startMailServer } from '../../scripts/lib/mail-server.mjs';
// @ts-expect-error – as above
import { startFakeS3 } from '../../scripts/lib/fake-s3.mjs';
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

  let mail: { close(): Promise<void> } | undefined;
  try {
    mail = await startMailServer({
      smtpPort: Number(process.env.SMTP_PORT),
      inboxPort: Number(process.env.MAIL_INBOX_PORT),
      dir: path.resolve(root, process.env.MAIL_DIR ?? '.data/mail-test'),
    });
  } catch {
    // npm test's catcher is already listening on these ports.
  }
  // The fake S3 server for the S3 driver's tests (the default driver stays the local folder).
  const s3: { close(): Promise<void> } = await startFakeS3({ port: Number(process.env.S3_PORT), bucket: process.env.S3_BUCKET });
  return async () => {
    await s3.close();
    await mail?.close();
  };
}
