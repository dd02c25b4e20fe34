import type Database from 'better-sqlite3';
import { type DataSourceOptions } from 'typeorm';
import { ENTITIES } from './entities';
import { MIGRATIONS } from './migrations';

/**
 * TypeORM on better-sqlite3: one file, WAL journal, foreign keys and secure delete on, schema by
 * migrations only (run at start; `synchronize` is never used, the tests run the same migrations).
 */
export function dataSourceOptions(databaseFile: string): DataSourceOptions {
  return {
    type: 'better-sqlite3',
    database: databaseFile,
    entities: ENTITIES,
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
