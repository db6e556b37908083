// Environment for the bootstrap scripts: .env (made from .env.example) or the test profile.
import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { tmpdir } from 'node:os';
import path from 'node:path';

export const root = path.resolve(new URL('../..', import.meta.url).pathname);

/** Values `npm test` uses, so tests never touch the demo database or ports. */
export const testProfile = {
  NODE_ENV: 'production',
  PORT: '3100',
  HOST: '127.0.0.1',
  NEXTAUTH_URL: 'http://127.0.0.1:3100',
  NEXTAUTH_SECRET: 'test-secret-not-for-production-0123456789',
  DB_HOST: '127.0.0.1',
  DB_PORT: '3308',
  DB_NAME: 'fallbook_test',
  DB_USER: 'fallbook_test',
  DB_PASSWORD: 'fallbook-test',
  DB_DATA_DIR: '.data/mariadb-test',
  DB_SOCKET: '',
  SMTP_HOST: '127.0.0.1',
  SMTP_PORT: '1026',
  SMTP_USER: '',
  SMTP_PASSWORD: '',
  MAIL_FROM: 'Fallbook <no-reply@fallbook.test>',
  MAIL_DIR: '.data/mail-test',
  MAIL_INBOX_PORT: '1081',
  PHOTO_DIR: '.data/photos-test',
  STORAGE_DRIVER: 'local',
  // The fake S3 server the integration tests start (scripts/lib/fake-s3.mjs); the S3 tests use it.
  S3_PORT: '4600',
  S3_ENDPOINT: 'http://127.0.0.1:4600',
  S3_BUCKET: 'fallbook-test',
  S3_REGION: 'us-east-1',
  S3_ACCESS_KEY_ID: 'S3RVER',
  S3_SECRET_ACCESS_KEY: 'S3RVER',
  S3_FORCE_PATH_STYLE: '1',
  S3_PREFIX: '',
  DB_READ_HOSTS: '',
  AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
  SEED_DEMO: '1',
  // The fake tile server (scripts/lib/fake-tiles.mjs) draws the map unless NEXT_PUBLIC_TILE_URL is set.
  FAKE_TILES_PORT: '4700',
  // Compiled into the test build: the field pages expose the app's save/sync modules to the e2e fault tests.
  NEXT_PUBLIC_FALLBOOK_TEST_HOOKS: '1',
};

/** Creates .env from .env.example with a fresh secret when it is missing. */
export function ensureEnvFile() {
  const envPath = path.join(root, '.env');
  if (existsSync(envPath)) return false;
  const example = readFileSync(path.join(root, '.env.example'), 'utf8');
  const secret = randomBytes(32).toString('base64url');
  writeFileSync(envPath, example.replace(/^NEXTAUTH_SECRET=.*$/m, `NEXTAUTH_SECRET=${secret}`));
  return true;
}

/** Loads .env (or the test profile) into process.env; explicit environment wins. */
export function loadEnv(profile = 'local') {
  if (profile === 'test') {
    // FALLBOOK_PORT_OFFSET lets several checkouts (git worktrees) run their tests side by side.
    const offset = Number(process.env.FALLBOOK_PORT_OFFSET || 0);
    for (const [key, value] of Object.entries(testProfile)) process.env[key] = value;
    for (const key of ['PORT', 'DB_PORT', 'SMTP_PORT', 'MAIL_INBOX_PORT', 'S3_PORT', 'FAKE_TILES_PORT']) {
      process.env[key] = String(Number(testProfile[key]) + offset);
    }
    process.env.NEXTAUTH_URL = `http://127.0.0.1:${process.env.PORT}`;
    process.env.S3_ENDPOINT = `http://127.0.0.1:${process.env.S3_PORT}`;
  } else {
    const envPath = path.join(root, '.env');
    if (existsSync(envPath)) process.loadEnvFile(envPath);
  }
  process.env.NEXT_TELEMETRY_DISABLED = '1';
  defaultToFakeTiles();
  return dbSettings();
}

/** The fake tile server's port (FAKE_TILES_PORT, 3090 by default). */
export const fakeTilesPort = () => Number(process.env.FAKE_TILES_PORT || 3090);

/**
 * With no NEXT_PUBLIC_TILE_URL the map draws from the local fake tile server (started with the
 * other services); `none` means no tiles at all. Set here, before the build reads it: the value is
 * compiled into the pages and the service worker, and the build stamp includes it.
 */
function defaultToFakeTiles() {
  const env = process.env;
  if (env.NEXT_PUBLIC_TILE_URL === 'none') {
    env.NEXT_PUBLIC_TILE_URL = '';
    return;
  }
  if (env.NEXT_PUBLIC_TILE_URL) return;
  env.NEXT_PUBLIC_TILE_URL = `http://127.0.0.1:${fakeTilesPort()}/{z}/{x}/{y}.png`;
  env.NEXT_PUBLIC_TILE_ATTRIBUTION ||= 'Demo tiles: not a real map';
}

/** Whether the tile template is the local fake's, so the stack must start it. */
export const usesFakeTiles = () => process.env.NEXT_PUBLIC_TILE_URL === `http://127.0.0.1:${fakeTilesPort()}/{z}/{x}/{y}.png`;

/** Database settings read from process.env, with the socket path derived when empty. */
export function dbSettings() {
  const env = process.env;
  const port = Number(env.DB_PORT || 3307);
  const dataDir = path.resolve(root, env.DB_DATA_DIR || '.data/mariadb');
  // Unix socket paths are limited to ~100 characters: keep it short, unique per data folder.
  const hash = createHash('sha1').update(dataDir).digest('hex').slice(0, 10);
  const socket = env.DB_SOCKET || path.join(tmpdir(), `fallbook-${hash}-${port}.sock`);
  if (!env.DB_SOCKET) env.DB_SOCKET = socket;
  return {
    host: env.DB_HOST || '127.0.0.1',
    port,
    name: env.DB_NAME || 'fallbook',
    user: env.DB_USER || 'fallbook',
    password: env.DB_PASSWORD || '',
    dataDir,
    socket,
  };
}
