/**
 * Writes PostgreSQL's twin of a migration: starts a throwaway PostgreSQL cluster, runs the
 * PostgreSQL migrations there are, asks TypeORM's schema diff what the entities still need, and
 * writes that as migrations/postgres/<timestamp>-<name>.ts. Run from the repository root, after
 * the entities and the SQLite migration are written:
 *
 *   npx tsx --tsconfig apps/api/tsconfig.json apps/api/src/database/generate-postgres-migration.ts Demand1765627200000
 *
 * (the SQLite migration's class name), then add the class to migrations/postgres/index.ts.
 * Data moves that the SQLite migration does (UPDATE ... SET) are not part of a schema diff: copy
 * them by hand. Needs Debian's postgresql-15 and root or the postgres account.
 */
import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createDataSource, dataSourceOptions, initializeDataSource } from './data-source-options';
import { startPostgresCluster } from './postgres-cluster';

async function main(): Promise<void> {
  const name = process.argv[2];
  const match = name ? /^([A-Z][A-Za-z0-9]*?)(\d{13})$/.exec(name) : null;
  if (!match) {
    console.error(
      'Usage: generate-postgres-migration.ts <ClassName><13-digit timestamp>, e.g. Demand1765627200000',
    );
    process.exit(2);
  }
  const [, words, timestamp] = match;
  const dir = join(process.cwd(), 'apps/api/src/database/migrations/postgres');
  if (!existsSync(dir)) throw new Error(`run from the repository root (no ${dir})`);
  const file = join(dir, `${timestamp}-${words.replace(/([a-z0-9])([A-Z])/g, '$1-$2').toLowerCase()}.ts`);

  const cluster = await startPostgresCluster();
  try {
    const url = await cluster.createDatabase('rotaplex_generate');
    const dataSource = await initializeDataSource(
      createDataSource(dataSourceOptions({ type: 'postgres', url })),
    );
    try {
      const sql = await dataSource.driver.createSchemaBuilder().log();
      if (sql.upQueries.length === 0) {
        console.error('The PostgreSQL migrations already match the entities: nothing to write.');
        process.exitCode = 1;
        return;
      }
      const literal = (text: string) => '`' + text.replace(/[\\`]|\$\{/g, (c) => '\\' + c) + '`';
      const line = (q: { query: string; parameters?: unknown[] }) =>
        `    await queryRunner.query(${literal(q.query)}${
          q.parameters && q.parameters.length ? `, ${JSON.stringify(q.parameters)}` : ''
        });`;
      const text = [
        `import { type MigrationInterface, type QueryRunner } from 'typeorm';`,
        ``,
        `/** PostgreSQL's twin of ${name}, written by TypeORM's schema diff (generate-postgres-migration.ts). */`,
        `export class ${name} implements MigrationInterface {`,
        `  name = '${name}';`,
        ``,
        `  public async up(queryRunner: QueryRunner): Promise<void> {`,
        ...sql.upQueries.map(line),
        `  }`,
        ``,
        `  public async down(queryRunner: QueryRunner): Promise<void> {`,
        ...[...sql.downQueries].reverse().map(line),
        `  }`,
        `}`,
        ``,
      ].join('\n');
      writeFileSync(file, text);
      console.log(
        `Wrote ${file} (${sql.upQueries.length} statements). Add ${name} to migrations/postgres/index.ts.`,
      );
    } finally {
      await dataSource.destroy();
    }
  } finally {
    cluster.stop();
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
