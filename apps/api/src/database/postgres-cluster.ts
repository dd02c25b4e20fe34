import { execFileSync } from 'node:child_process';
import { chownSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Client } from 'pg';

/** Debian's PostgreSQL 15 programs (package postgresql-15). */
export const POSTGRES_BIN = process.env['ROTAPLEX_POSTGRES_BIN'] || '/usr/lib/postgresql/15/bin';

/** A throwaway PostgreSQL cluster for tests and the migration generator; see {@link startPostgresCluster}. */
export interface PostgresCluster {
  /** Temporary directory holding the data directory and the unix socket. */
  dir: string;
  port: number;
  /** Connection URL of a database in this cluster (over the unix socket, as the `postgres` role). */
  url(database: string): string;
  /** Creates an empty database and returns its URL. */
  createDatabase(name: string): Promise<string>;
  /** Stops the server (fast shutdown) and removes the temporary directory. */
  stop(): void;
}

/** A TCP port nobody listens on right now (names the socket file; the server listens on no TCP address). */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

/**
 * Starts a PostgreSQL cluster in a new temporary directory: `initdb` as the `postgres` account
 * (PostgreSQL refuses to run as root), `pg_ctl start` with the unix socket in that directory and no
 * TCP listener, trust authentication for local connections only. Call `stop()` when done.
 */
export async function startPostgresCluster(): Promise<PostgresCluster> {
  const dir = mkdtempSync(join(tmpdir(), 'rotaplex-pg-'));
  const asPostgres = (program: string, args: string[]) => {
    const command = join(POSTGRES_BIN, program);
    if (typeof process.getuid === 'function' && process.getuid() === 0) {
      execFileSync('runuser', ['-u', 'postgres', '--', command, ...args], { stdio: 'pipe' });
    } else {
      execFileSync(command, args, { stdio: 'pipe' });
    }
  };
  if (typeof process.getuid === 'function' && process.getuid() === 0) {
    const uid = Number(execFileSync('id', ['-u', 'postgres']).toString().trim());
    const gid = Number(execFileSync('id', ['-g', 'postgres']).toString().trim());
    chownSync(dir, uid, gid);
  }
  const data = join(dir, 'data');
  const port = await freePort();
  try {
    asPostgres('initdb', [
      '-D',
      data,
      '-U',
      'postgres',
      '--auth=trust',
      '--encoding=UTF8',
      '--locale=C.UTF-8',
      '--no-sync',
    ]);
    asPostgres('pg_ctl', [
      '-D',
      data,
      '-l',
      join(dir, 'server.log'),
      '-w',
      '-t',
      '60',
      '-o',
      // fsync off: a throwaway test cluster, nothing to keep after a crash.
      `-c listen_addresses='' -c unix_socket_directories='${dir}' -p ${port} -c fsync=off -c max_connections=200`,
      'start',
    ]);
  } catch (err) {
    rmSync(dir, { recursive: true, force: true });
    const e = err as { stderr?: Buffer; message: string };
    throw new Error(`PostgreSQL test cluster did not start: ${e.stderr?.toString() || e.message}`, {
      cause: err,
    });
  }
  writeFileSync(join(dir, 'port'), String(port));
  const url = (database: string) =>
    `postgres://postgres@localhost:${port}/${encodeURIComponent(database)}?host=${encodeURIComponent(dir)}`;
  let stopped = false;
  return {
    dir,
    port,
    url,
    createDatabase: async (name: string) => {
      const client = new Client({ connectionString: url('postgres') });
      await client.connect();
      try {
        await client.query(`CREATE DATABASE "${name.replace(/"/g, '""')}"`);
      } finally {
        await client.end();
      }
      return url(name);
    },
    stop: () => {
      if (stopped) return;
      stopped = true;
      try {
        asPostgres('pg_ctl', ['-D', data, '-m', 'fast', '-w', 'stop']);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}

/** Environment variables through which a running test cluster is handed to the test processes. */
export const TEST_CLUSTER_ENV = {
  dir: 'ROTAPLEX_TEST_POSTGRES_DIR',
  port: 'ROTAPLEX_TEST_POSTGRES_PORT',
} as const;

/** Whether the API tests run on PostgreSQL (ROTAPLEX_TEST_DATABASE=postgres) instead of SQLite files. */
export function testsOnPostgres(): boolean {
  return process.env['ROTAPLEX_TEST_DATABASE'] === 'postgres';
}

let testDatabases = 0;

/**
 * A new empty database in the test cluster that jest.postgres.config.js started (its global setup
 * puts the cluster's socket directory and port in the environment).
 */
export async function createTestDatabase(): Promise<string> {
  const dir = process.env[TEST_CLUSTER_ENV.dir];
  const port = Number(process.env[TEST_CLUSTER_ENV.port]);
  if (!dir || !port) {
    throw new Error(
      'ROTAPLEX_TEST_DATABASE=postgres needs the test cluster: run the tests with ' +
        '`npx jest -c apps/api/jest.postgres.config.js ...` (or `npm run test:api:postgres`)',
    );
  }
  const url = (database: string) =>
    `postgres://postgres@localhost:${port}/${encodeURIComponent(database)}?host=${encodeURIComponent(dir)}`;
  const name = `rotaplex_test_${process.pid}_${Date.now()}_${++testDatabases}`;
  const client = new Client({ connectionString: url('postgres') });
  await client.connect();
  try {
    await client.query(`CREATE DATABASE "${name}"`);
  } finally {
    await client.end();
  }
  return url(name);
}
