import { Logger } from '@nestjs/common';
import { type DataSource, type DataSourceOptions } from 'typeorm';
import { narrowDataFileModes, prepareDataFiles } from './data-files';
import { createDataSource, type DatabaseTarget, initializeDataSource } from './data-source-options';
import { serialisableTransactions } from './postgres-transactions';
import { serialiseTransactions } from './serialised-transactions';

/**
 * Opens the application's database and brings its schema up to date.
 *
 * SQLite: data directory 0700 and database file 0600 before SQLite opens it (and its -wal, -shm
 * after); one transaction at a time on the one connection (serialised-transactions.ts).
 * PostgreSQL: file modes are the server's business (its data directory is 0700 and owned by the
 * postgres account); transactions run SERIALIZABLE and are retried on conflicts
 * (postgres-transactions.ts).
 */
export async function openDatabase(target: DatabaseTarget, options: DataSourceOptions): Promise<DataSource> {
  const logger = new Logger('Database');
  if (target.type === 'sqlite') prepareDataFiles(target.file).forEach((note) => logger.warn(note));
  const dataSource = createDataSource(options);
  if (target.type === 'postgres') serialisableTransactions(dataSource);
  else serialiseTransactions(dataSource);
  await initializeDataSource(dataSource);
  if (target.type === 'sqlite') narrowDataFileModes(target.file).forEach((note) => logger.warn(note));
  return dataSource;
}
