// A MariaDB primary and a GTID replica of it on loopback, each with its own port and data folder
// under .data/, for the read-replica tests (integration and e2e). Small buffers so both start in a second or two.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { cpSync, mkdirSync, openSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir, userInfo } from 'node:os';
import path from 'node:path';
import * as mariadb from 'mariadb';

export interface Server {
  port: number;
  socket: string;
  dataDir: string;
  child?: ChildProcess;
}
export interface ReplicaPair {
  primary: Server;
  replica: Server;
  root(server: Server): Promise<mariadb.Connection>;
  catchUp(): Promise<void>;
  stop(): Promise<void>;
}

const rootConnection = (server: Server) => mariadb.createConnection({ socketPath: server.socket, user: 'root', password: '' });

async function waitReady(server: Server, timeoutMs = 30_000) {
  const started = Date.now();
  for (;;) {
    try {
      return void (await (await rootConnection(server)).end());
    } catch (error) {
      if ((server.child?.exitCode !== null && server.child?.exitCode !== undefined) || Date.now() - started > timeoutMs) {
        const log = readFileSync(path.join(server.dataDir, 'mariadbd.err'), 'utf8').split('\n').slice(-10).join('\n');
        throw new Error(`mariadbd on ${server.port} did not start: ${(error as Error).message}\n${log}`);
      }
      await new Promise((r) => setTimeout(r, 100));
    }
  }
}

function start(server: Server, serverId: number, extra: string[]) {
  const err = openSync(path.join(server.dataDir, 'mariadbd.err'), 'a');
  server.child = spawn(
    'mariadbd',
    [
      '--no-defaults',
      `--datadir=${server.dataDir}`,
      `--user=${userInfo().username}`,
      '--bind-address=127.0.0.1',
      `--port=${server.port}`,
      `--socket=${server.socket}`,
      `--pid-file=${path.join(server.dataDir, 'mariadbd.pid')}`,
      '--skip-name-resolve',
      `--server-id=${serverId}`,
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      '--innodb-buffer-pool-size=16M',
      '--innodb-log-file-size=16M',
      '--innodb-flush-log-at-trx-commit=2',
      '--performance-schema=OFF',
      '--max-connections=50',
      ...extra,
    ],
    { stdio: ['ignore', err, err] },
  );
}

async function stopServer(server: Server) {
  const child = server.child;
  if (!child || child.exitCode !== null) return;
  const exited = new Promise((r) => child.once('exit', r));
  child.kill('SIGTERM');
  const timer = setTimeout(() => child.kill('SIGKILL'), 15_000);
  await exited;
  clearTimeout(timer);
}

/**
 * Initialises one data folder, copies it for the replica, starts the primary with a binary log and
 * the replica read-only, and points the replica at the primary (MASTER_USE_GTID=slave_pos).
 */
export async function startReplicaPair(base: string, port: number): Promise<ReplicaPair> {
  rmSync(base, { recursive: true, force: true });
  const server = (name: string, p: number): Server => ({ port: p, dataDir: path.join(base, name), socket: path.join(tmpdir(), `fallbook-${name}-${p}.sock`) });
  const primary = server('primary', port);
  const replica = server('replica', port + 1);
  mkdirSync(primary.dataDir, { recursive: true });
  const init = spawnSync(
    'mariadb-install-db',
    ['--no-defaults', `--datadir=${primary.dataDir}`, `--user=${userInfo().username}`, '--auth-root-authentication-method=normal', '--skip-test-db'],
    { encoding: 'utf8' },
  );
  if (init.status !== 0) throw new Error(`mariadb-install-db failed: ${init.stderr}`);
  cpSync(primary.dataDir, replica.dataDir, { recursive: true });
  const pair: ReplicaPair = {
    primary,
    replica,
    root: rootConnection,
    async catchUp() {
      const p = await rootConnection(primary);
      const r = await rootConnection(replica);
      try {
        const [{ pos }] = await p.query('SELECT @@gtid_binlog_pos AS pos');
        const [{ waited }] = await r.query('SELECT MASTER_GTID_WAIT(?, 20) AS waited', [pos]);
        if (Number(waited) !== 0) throw new Error(`the replica did not reach ${pos} in 20 s`);
      } finally {
        await p.end();
        await r.end();
      }
    },
    async stop() {
      await Promise.all([stopServer(replica), stopServer(primary)]);
      rmSync(base, { recursive: true, force: true });
    },
  };
  try {
    start(primary, 1, ['--log-bin=primary-bin', '--binlog-format=ROW', '--sync-binlog=0']);
    start(replica, 2, ['--read-only', '--skip-log-bin', '--slave-parallel-threads=0']);
    await Promise.all([waitReady(primary), waitReady(replica)]);
    const p = await rootConnection(primary);
    await p.query("CREATE USER 'replicator'@'127.0.0.1' IDENTIFIED BY 'replicator-test'");
    await p.query("GRANT REPLICATION SLAVE ON *.* TO 'replicator'@'127.0.0.1'");
    await p.end();
    const r = await rootConnection(replica);
    await r.query(`CHANGE MASTER TO MASTER_HOST='127.0.0.1', MASTER_PORT=${primary.port}, MASTER_USER='replicator',
      MASTER_PASSWORD='replicator-test', MASTER_USE_GTID=slave_pos, MASTER_CONNECT_RETRY=1`);
    await r.query('START SLAVE');
    await r.end();
  } catch (error) {
    await pair.stop();
    throw error;
  }
  return pair;
}

/** Creates the app's database and account on the primary (they replicate to the replica). */
export async function createAppDatabase(pair: ReplicaPair, db: { name: string; user: string; password: string }): Promise<void> {
  const conn = await pair.root(pair.primary);
  try {
    await conn.query(`CREATE DATABASE \`${db.name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    for (const host of ['127.0.0.1', 'localhost']) {
      await conn.query('CREATE USER ?@? IDENTIFIED BY ?', [db.user, host, db.password]);
      await conn.query(`GRANT ALL PRIVILEGES ON \`${db.name}\`.* TO ?@?`, [db.user, host]);
    }
  } finally {
    await conn.end();
  }
}

/** Copies a database from another server into the primary (mariadb-dump | mariadb); it replicates. */
export function copyDatabaseInto(pair: ReplicaPair, from: { host: string; port: number; user: string; password: string; name: string }): void {
  const dump = spawnSync(
    'mariadb-dump',
    [
      `--host=${from.host}`,
      `--port=${from.port}`,
      `--user=${from.user}`,
      `--password=${from.password}`,
      '--single-transaction',
      '--no-tablespaces',
      '--skip-triggers',
      from.name,
    ],
    { encoding: 'utf8', maxBuffer: 512 * 1024 * 1024 },
  );
  if (dump.status !== 0) throw new Error(`mariadb-dump failed: ${dump.stderr}`);
  const load = spawnSync('mariadb', [`--socket=${pair.primary.socket}`, '--user=root', from.name], { input: dump.stdout, encoding: 'utf8' });
  if (load.status !== 0) throw new Error(`loading the dump failed: ${load.stderr}`);
}
