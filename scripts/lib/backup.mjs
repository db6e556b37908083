// Dump and restore one database with Debian's mariadb-dump / mariadb clients (npm run db:backup,
// npm run db:restore). The password goes through MYSQL_PWD, never the command line (ps shows it).
import { spawn } from 'node:child_process';
import { createReadStream, createWriteStream, mkdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { createGunzip, createGzip } from 'node:zlib';
import { root } from './env.mjs';

const safeName = (name) => name.replace(/[^A-Za-z0-9_]/g, '');

function connectionArgs(db) {
  return [`--host=${db.host}`, `--port=${db.port}`, '--protocol=tcp', `--user=${db.user}`, '--default-character-set=utf8mb4'];
}

const clientEnv = (db) => ({ ...process.env, MYSQL_PWD: db.password });

/** The default backup file: .data/backups/<database>-<UTC timestamp>.sql.gz */
export function defaultBackupFile(db, now = new Date()) {
  const stamp = now
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z');
  return path.join(root, '.data', 'backups', `${safeName(db.name)}-${stamp}.sql.gz`);
}

/** Waits for a child process; rejects with its stderr when it fails. */
function finished(child, what) {
  let stderr = '';
  child.stderr.on('data', (chunk) => {
    stderr += chunk;
  });
  return new Promise((resolve, reject) => {
    child.on('error', reject);
    child.on('close', (code) => (code === 0 ? resolve() : reject(new Error(`${what} exited with ${code}: ${stderr.trim()}`))));
  });
}

/**
 * Dumps the database to `file` (gzip when it ends in .gz). One consistent snapshot without locking
 * the app out (--single-transaction: every table is InnoDB), with routines, triggers and events.
 */
export async function dumpDatabase(db, file) {
  mkdirSync(path.dirname(file), { recursive: true });
  const child = spawn(
    'mariadb-dump',
    [
      ...connectionArgs(db),
      '--single-transaction',
      '--routines',
      '--triggers',
      '--events',
      '--hex-blob',
      '--skip-dump-date',
      '--add-drop-table',
      '--net-buffer-length=1048576',
      safeName(db.name),
    ],
    { env: clientEnv(db), stdio: ['ignore', 'pipe', 'pipe'] },
  );
  const done = finished(child, 'mariadb-dump');
  const out = createWriteStream(file, { mode: 0o600 });
  try {
    await Promise.all([file.endsWith('.gz') ? pipeline(child.stdout, createGzip(), out) : pipeline(child.stdout, out), done]);
  } catch (error) {
    rmSync(file, { force: true });
    throw error;
  }
  return file;
}

/** The tables (and views) in the database. */
export async function listTables(db) {
  const mariadb = await import('mariadb');
  const conn = await mariadb.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password, database: safeName(db.name) });
  try {
    const rows = await conn.query('SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY 1');
    return rows.map((r) => r.t);
  } finally {
    await conn.end();
  }
}

/** Drops every table and view, so a restore leaves exactly what the dump holds. */
export async function emptyDatabase(db) {
  const mariadb = await import('mariadb');
  const conn = await mariadb.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password, database: safeName(db.name) });
  try {
    const rows = await conn.query('SELECT table_name AS t, table_type AS k FROM information_schema.tables WHERE table_schema = DATABASE()');
    await conn.query('SET FOREIGN_KEY_CHECKS = 0');
    for (const { t, k } of rows) await conn.query(`DROP ${k === 'VIEW' ? 'VIEW' : 'TABLE'} IF EXISTS \`${t.replace(/`/g, '``')}\``);
    await conn.query('SET FOREIGN_KEY_CHECKS = 1');
  } finally {
    await conn.end();
  }
}

/** Loads a dump made by dumpDatabase (plain or .gz) into the database. */
export async function loadDump(db, file) {
  const child = spawn('mariadb', [...connectionArgs(db), '--binary-mode', safeName(db.name)], {
    env: clientEnv(db),
    stdio: ['pipe', 'ignore', 'pipe'],
  });
  const done = finished(child, 'mariadb');
  const input = createReadStream(file);
  await Promise.all([file.endsWith('.gz') ? pipeline(input, createGunzip(), child.stdin) : pipeline(input, child.stdin), done]);
}
