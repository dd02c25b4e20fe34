import { Injectable, Module, type OnModuleDestroy } from '@nestjs/common';
import type Database from 'better-sqlite3';
import { DataSource, type EntityManager } from 'typeorm';
import { AppConfig } from '../config/app-config';
import { createDataSource, databaseTarget } from './data-source-options';

/**
 * A second, read-only SQLite connection to the database file, for reads that must not wait for
 * the writers. The main connection runs one transaction at a time and holds every other query
 * until it ends (serialised-transactions.ts); this one is outside that queue. In WAL mode a reader
 * sees the last committed state and never the open transaction's writes, and it never blocks a
 * writer. Use it for reads that write nothing; a read that then decides to write re-reads inside
 * its transaction on the main connection.
 *
 * On PostgreSQL readers never wait for writers anyway (MVCC); this is then a small second pool
 * whose sessions are read-only (`default_transaction_read_only`), so the same rule holds: it sees
 * committed data only and cannot write.
 */
@Injectable()
export class ReadConnection implements OnModuleDestroy {
  constructor(private readonly dataSource: DataSource) {}

  /**
   * Opens the connection once the main one has created and migrated the file, with the entities
   * the main one has (those the modules registered).
   */
  static async open(config: AppConfig, main: DataSource): Promise<ReadConnection> {
    const target = databaseTarget(config);
    const entities = main.options.entities;
    if (target.type === 'postgres') {
      const pg = createDataSource({
        type: 'postgres',
        url: target.url,
        entities,
        migrationsRun: false,
        synchronize: false,
        extra: { max: 4, options: '-c default_transaction_read_only=on -c TimeZone=UTC' },
      });
      await pg.initialize();
      return new ReadConnection(pg);
    }
    const dataSource = new DataSource({
      type: 'better-sqlite3',
      database: config.databaseFile,
      readonly: true,
      fileMustExist: true,
      entities,
      migrationsRun: false,
      synchronize: false,
      // The file is in WAL mode already (set by the main connection; it persists in the file).
      enableWAL: false,
      prepareDatabase: (db: Database.Database) => {
        db.pragma('busy_timeout = 5000');
      },
    });
    await dataSource.initialize();
    return new ReadConnection(dataSource);
  }

  get manager(): EntityManager {
    return this.dataSource.manager;
  }

  async onModuleDestroy(): Promise<void> {
    if (this.dataSource.isInitialized) await this.dataSource.destroy();
  }
}

/** Provides the {@link ReadConnection}; import it where a read must not queue behind writers. */
@Module({
  providers: [
    {
      provide: ReadConnection,
      // Depends on the main DataSource so the file exists and is migrated first.
      inject: [AppConfig, DataSource],
      useFactory: (config: AppConfig, main: DataSource) => ReadConnection.open(config, main),
    },
  ],
  exports: [ReadConnection],
})
export class ReadConnectionModule {}
