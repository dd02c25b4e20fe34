import type Database from 'better-sqlite3';
import { join } from 'node:path';
import { DataSource, type DataSourceOptions, type QueryRunner } from 'typeorm';
import { MIGRATIONS } from './migrations';
import { POSTGRES_MIGRATIONS } from './migrations/postgres';

/**
 * Every entity file of the API by its name (`*.entity.ts`, `*.entities.ts`; `.js` once built), for
 * the data sources opened outside Nest: the TypeORM command line (data-source.ts), the PostgreSQL
 * migration writer and the schema tests. The application itself loads the entities its modules
 * register (`TypeOrmModule.forFeature` with `autoLoadEntities`, app.module.ts), so this folder
 * imports no module; test/entity-registration.e2e-spec.ts checks that both lists and the
 * migrations' tables are the same.
 */
export const ENTITY_FILES = join(__dirname, '..', '**', '*.{entity,entities}.{ts,js}');

/** Where the data lives: the SQLite file (the default) or a PostgreSQL database (DATABASE_URL). */
export type DatabaseTarget = { type: 'sqlite'; file: string } | { type: 'postgres'; url: string };

/** The target a configuration names: PostgreSQL when DATABASE_URL is set, else the SQLite file. */
export function databaseTarget(config: {
  databaseFile: string;
  databaseUrl?: string | null;
}): DatabaseTarget {
  return config.databaseUrl
    ? { type: 'postgres', url: config.databaseUrl }
    : { type: 'sqlite', file: config.databaseFile };
}

/**
 * TypeORM options, schema by migrations only (`synchronize` is never used; the tests run the same
 * migrations).
 *
 * SQLite (a string is a SQLite file): better-sqlite3, WAL journal, foreign keys and secure delete
 * on, migrations run by `initialize()`.
 *
 * PostgreSQL: node-postgres with a pool of connections, the migrations in ./migrations/postgres,
 * run by {@link initializeDataSource} under an advisory lock so that several API instances
 * starting at once run them once. Open it with {@link createDataSource}.
 */
export function dataSourceOptions(target: DatabaseTarget | string): DataSourceOptions {
  const t: DatabaseTarget = typeof target === 'string' ? { type: 'sqlite', file: target } : target;
  if (t.type === 'postgres') {
    return {
      type: 'postgres',
      url: t.url,
      entities: [ENTITY_FILES],
      migrations: POSTGRES_MIGRATIONS,
      migrationsRun: false,
      migrationsTransactionMode: 'each',
      synchronize: false,
      // uuid primary keys default to gen_random_uuid(), built into PostgreSQL since 13: no extension.
      uuidExtension: 'pgcrypto',
      installExtensions: false,
      // Pool size per process; several API instances share the server's max_connections (100).
      // Sessions in UTC: date-time text without a zone (SQLite's format, which some queries
      // compare with) then means UTC there too.
      extra: { max: 10, options: '-c TimeZone=UTC' },
    };
  }
  return {
    type: 'better-sqlite3',
    database: t.file,
    entities: [ENTITY_FILES],
    migrations: MIGRATIONS,
    migrationsRun: true,
    migrationsTransactionMode: 'each',
    synchronize: false,
    enableWAL: true,
    prepareDatabase: (db: Database.Database) => {
      db.pragma('foreign_keys = ON');
      // Deleted and overwritten content is zeroed, not left in free space of the file.
      db.pragma('secure_delete = ON');
      db.pragma('busy_timeout = 5000');
    },
  };
}

export function isPostgres(dataSource: DataSource): boolean {
  return dataSource.options.type === 'postgres';
}

/**
 * A DataSource for the options. On PostgreSQL two differences from SQLite are bridged here:
 *
 * - The entities declare date-times as `datetime`, SQLite's name; PostgreSQL has no such type, so
 *   the driver maps it to `timestamp with time zone` (an instant, as on SQLite, where TypeORM
 *   writes UTC text). Everything else the entities use (varchar, text, integer, real, boolean,
 *   simple-json as text, uuid) exists on both.
 * - Hand-written SQL (`em.query(sql, params)`) uses `?` placeholders, SQLite's; PostgreSQL numbers
 *   them ($1, $2, ...). A query with parameters and no `$1` has its `?` outside quotes numbered.
 *   TypeORM's own queries already use $n. Identifiers in hand-written SQL must be quoted
 *   ("unitId"): PostgreSQL folds unquoted names to lower case.
 */
export function createDataSource(options: DataSourceOptions): DataSource {
  const dataSource = new DataSource(options);
  if (options.type === 'postgres') {
    const driver = dataSource.driver as unknown as {
      normalizeType: (column: { type?: unknown }) => string;
      createQueryRunner: (mode?: string) => QueryRunner;
    };
    const normalizeType = driver.normalizeType.bind(driver);
    driver.normalizeType = (column) =>
      column.type === 'datetime' ? 'timestamp with time zone' : normalizeType(column);
    const createQueryRunner = driver.createQueryRunner.bind(driver);
    driver.createQueryRunner = (mode?: string) => {
      const runner = createQueryRunner(mode);
      const query = runner.query.bind(runner) as (
        sql: string,
        params?: unknown[],
        ...rest: unknown[]
      ) => unknown;
      (runner as { query: typeof query }).query = (sql, params, ...rest) =>
        query(params?.length && !/\$1\b/.test(sql) ? numberPlaceholders(sql) : sql, params, ...rest);
      return runner;
    };
  }
  return dataSource;
}

/** `?` placeholders outside quoted text and names, numbered for PostgreSQL: `a = ? AND b = ?` → `a = $1 AND b = $2`. */
export function numberPlaceholders(sql: string): string {
  let n = 0;
  let quote: string | null = null;
  let out = '';
  for (const ch of sql) {
    if (quote !== null) {
      if (ch === quote) quote = null;
    } else if (ch === "'" || ch === '"') {
      quote = ch;
    } else if (ch === '?') {
      out += `$${++n}`;
      continue;
    }
    out += ch;
  }
  return out;
}

/** Any 64-bit number: the key of the advisory lock held while migrations run on PostgreSQL. */
const MIGRATION_LOCK_KEY = 7_261_904_283;

/**
 * Connects and brings the schema up to date. SQLite runs its migrations in `initialize()`; on
 * PostgreSQL they run here, one instance at a time (the others wait on the lock, then find nothing
 * to do).
 */
export async function initializeDataSource(dataSource: DataSource): Promise<DataSource> {
  await dataSource.initialize();
  if (!isPostgres(dataSource)) return dataSource;
  const runner = dataSource.createQueryRunner();
  try {
    await runner.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    try {
      await dataSource.runMigrations({ transaction: 'each' });
    } finally {
      await runner.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]);
    }
  } catch (err) {
    await runner.release();
    await dataSource.destroy();
    throw err;
  }
  await runner.release();
  return dataSource;
}
