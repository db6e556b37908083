// The private MariaDB server: Debian's mariadbd on loopback with its own data folder.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, openSync, readFileSync, rmSync } from 'node:fs';
import { userInfo } from 'node:os';
import path from 'node:path';
import { ensureDebianPackages, fail, log } from './proc.mjs';

const pidFile = (db) => path.join(db.dataDir, 'mariadbd.pid');

function initialised(db) {
  return existsSync(path.join(db.dataDir, 'mysql', 'user.frm')) || existsSync(path.join(db.dataDir, 'mysql', 'global_priv.frm'));
}

function readPid(db) {
  try {
    const pid = Number(readFileSync(pidFile(db), 'utf8').trim());
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

async function connectAsRoot(db) {
  const mariadb = await import('mariadb');
  return mariadb.createConnection({ socketPath: db.socket, user: 'root', password: '' });
}

async function waitUntilReady(db, timeoutMs = 30_000) {
  const started = Date.now();
  let lastError;
  while (Date.now() - started < timeoutMs) {
    try {
      const conn = await connectAsRoot(db);
      await conn.end();
      return;
    } catch (error) {
      lastError = error;
      await new Promise((r) => setTimeout(r, 200));
    }
  }
  const logFile = path.join(db.dataDir, 'mariadbd.err');
  const tail = existsSync(logFile) ? readFileSync(logFile, 'utf8').split('\n').slice(-15).join('\n') : '';
  fail(`MariaDB did not become ready on ${db.socket}: ${lastError?.message}\n${tail}`);
}

/** Starts (installing and initialising if needed) the private server; returns true if it started it. */
export async function startDatabase(db) {
  ensureDebianPackages(['mariadb-server'], 'mariadbd');
  const user = userInfo().username;
  if (!initialised(db)) {
    log(`initialising a private MariaDB data folder in ${path.relative(process.cwd(), db.dataDir) || db.dataDir}…`);
    rmSync(db.dataDir, { recursive: true, force: true });
    mkdirSync(db.dataDir, { recursive: true });
    const init = spawnSync(
      'mariadb-install-db',
      ['--no-defaults', `--datadir=${db.dataDir}`, `--user=${user}`, '--auth-root-authentication-method=normal', '--skip-test-db'],
      { encoding: 'utf8' },
    );
    if (init.status !== 0) fail(`mariadb-install-db failed:\n${init.stdout}\n${init.stderr}`);
  }
  if (readPid(db)) {
    await waitUntilReady(db);
    return false;
  }
  const err = openSync(path.join(db.dataDir, 'mariadbd.err'), 'a');
  // Its own folder for on-disk temporary tables (large sorts), not the machine's shared /tmp.
  const tmp = `${db.dataDir}-tmp`;
  mkdirSync(tmp, { recursive: true });
  const child = spawn(
    'mariadbd',
    [
      '--no-defaults',
      `--datadir=${db.dataDir}`,
      `--user=${user}`,
      `--bind-address=${db.host}`,
      `--port=${db.port}`,
      `--socket=${db.socket}`,
      `--pid-file=${pidFile(db)}`,
      '--skip-name-resolve',
      '--skip-log-bin',
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      '--innodb-buffer-pool-size=256M',
      '--innodb-flush-log-at-trx-commit=2',
      '--max-connections=200',
      `--tmpdir=${tmp}`,
    ],
    { detached: true, stdio: ['ignore', err, err] },
  );
  child.unref();
  await waitUntilReady(db);
  log(`MariaDB listening on ${db.host}:${db.port}`);
  return true;
}

/** Creates the database and the app user (idempotent). `fresh` drops the database first. */
export async function ensureDatabase(db, { fresh = false } = {}) {
  const conn = await connectAsRoot(db);
  try {
    const name = db.name.replace(/[^A-Za-z0-9_]/g, '');
    if (fresh) await conn.query(`DROP DATABASE IF EXISTS \`${name}\``);
    await conn.query(`CREATE DATABASE IF NOT EXISTS \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    for (const host of ['127.0.0.1', 'localhost']) {
      await conn.query(`CREATE USER IF NOT EXISTS ?@? IDENTIFIED BY ?`, [db.user, host, db.password]);
      await conn.query(`ALTER USER ?@? IDENTIFIED BY ?`, [db.user, host, db.password]);
      await conn.query(`GRANT ALL PRIVILEGES ON \`${name}\`.* TO ?@?`, [db.user, host]);
    }
  } finally {
    await conn.end();
  }
}

/** Stops the server started from this data folder and waits for it to exit. */
export async function stopDatabase(db) {
  const pid = readPid(db);
  if (!pid) return false;
  process.kill(pid, 'SIGTERM');
  for (let i = 0; i < 150; i++) {
    try {
      process.kill(pid, 0);
      await new Promise((r) => setTimeout(r, 100));
    } catch {
      return true;
    }
  }
  process.kill(pid, 'SIGKILL');
  return true;
}
