// Brings up everything the app needs, in order: packages, MariaDB, schema, demo data, mail, build.
import path from 'node:path';
import { dbSettings, fakeTilesPort, root, usesFakeTiles } from './env.mjs';
import { startFakeTiles } from './fake-tiles.mjs';
import { startMailServer } from './mail-server.mjs';
import { ensureDatabase, startDatabase } from './mariadb.mjs';
import { log, nodeBin, run } from './proc.mjs';

/** Runs a TypeScript script under tsx with the server-only condition (scripts/migrate.ts, seed.ts). */
export function runTs(script, args = []) {
  run(process.execPath, [nodeBin('tsx/dist/cli.mjs'), '--conditions=react-server', script, ...args]);
}

export async function bringUpServices({ freshDatabase = false } = {}) {
  const db = dbSettings();
  const startedDb = await startDatabase(db);
  await ensureDatabase(db, { fresh: freshDatabase });
  runTs('scripts/migrate.ts', ['up']);
  if (process.env.SEED_DEMO !== '0') runTs('scripts/seed.ts');
  const mail = await startMailServer({
    smtpPort: Number(process.env.SMTP_PORT || 1025),
    inboxPort: Number(process.env.MAIL_INBOX_PORT || 1080),
    dir: path.resolve(root, process.env.MAIL_DIR || '.data/mail'),
  });
  log(`fake SMTP on 127.0.0.1:${process.env.SMTP_PORT}; caught mail at http://127.0.0.1:${process.env.MAIL_INBOX_PORT}/`);
  const tiles = await startTiles();
  return { db, startedDb, mail, tiles };
}

/** The fake tile server when the map uses it; { close } either way. */
async function startTiles() {
  const none = { close: async () => {} };
  if (!usesFakeTiles()) return none;
  try {
    const tiles = await startFakeTiles({ port: fakeTilesPort() });
    log(`fake map tiles on http://127.0.0.1:${tiles.port}/{z}/{x}/{y}.png`);
    return tiles;
  } catch (error) {
    // Another checkout's (or an earlier run's) fake already answers there: the tiles are the same.
    if (error?.code === 'EADDRINUSE') {
      log(`fake map tiles: port ${fakeTilesPort()} is taken; using what answers there`);
      return none;
    }
    throw error;
  }
}
