import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type DataSource } from 'typeorm';
import { createDataSource, dataSourceOptions, isPostgres } from '../src/database/data-source-options';
import { ReadConnection } from '../src/database/read-connection';
import { startTestApp, type TestApp } from './support/test-app';

const tablesOf = (ds: DataSource): string[] =>
  ds.entityMetadatas.map((m) => m.tableName).sort((a, b) => a.localeCompare(b));

async function databaseTables(ds: DataSource): Promise<string[]> {
  const rows = (await ds.query(
    isPostgres(ds)
      ? `SELECT table_name AS name FROM information_schema.tables WHERE table_schema = 'public'`
      : `SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'`,
  )) as { name: string }[];
  return rows
    .map((r) => r.name)
    .filter((name) => name !== 'migrations')
    .sort((a, b) => a.localeCompare(b));
}

/**
 * Each module registers the entities it owns (TypeOrmModule.forFeature, autoLoadEntities); the
 * data sources outside Nest load every entity file instead (database/data-source-options.ts). An
 * entity no module registers, or one without a migration, makes these differ.
 */
describe('entities registered by their modules', () => {
  let t: TestApp;
  let dir: string;
  let standalone: DataSource;
  beforeAll(async () => {
    t = await startTestApp();
    dir = mkdtempSync(join(tmpdir(), 'rotaplex-entities-'));
    standalone = createDataSource(dataSourceOptions(join(dir, 'db.sqlite')));
    await standalone.initialize(); // runs the SQLite migrations
  });
  afterAll(async () => {
    await standalone?.destroy();
    await t?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('loads in the app, from the modules alone, the entities of every entity file', () => {
    expect(tablesOf(standalone).length).toBeGreaterThan(20);
    expect(tablesOf(t.dataSource)).toEqual(tablesOf(standalone));
  });

  it('has the migrations create exactly the tables of the registered entities, with nothing left to change', async () => {
    expect(await databaseTables(t.dataSource)).toEqual(tablesOf(t.dataSource));
    expect(await databaseTables(standalone)).toEqual(tablesOf(standalone));
    // TypeORM's own schema diff (what `migration:generate` would write) is empty for the app's entities.
    const pending = await t.dataSource.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });

  it('gives the read-only connection the same entities as the main one', () => {
    const read = t.app.get(ReadConnection);
    expect(tablesOf(read.manager.connection)).toEqual(tablesOf(t.dataSource));
  });
});
