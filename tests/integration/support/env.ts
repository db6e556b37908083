// Integration tests run on the test profile (its own MariaDB port and database), never the demo's.
// @ts-expect-error – plain JS module shared with the bootstrap scripts
import { loadEnv } from '../../../scripts/lib/env.mjs';

if (process.env.DB_NAME !== 'fallbook_test') loadEnv('test');

const host = process.env.DB_HOST ?? '';
if (!['127.0.0.1', 'localhost', '::1'].includes(host)) {
  throw new Error(`Integration tests only run against a loopback database, not "${host}".`);
}
