/**
 * DataSource for the TypeORM command line, e.g. after `npx nx build api`:
 *   DATA_DIR=./data node -r ./apps/api/register-paths.js node_modules/typeorm/cli.js \
 *     -d dist/api/apps/api/src/database/data-source.js migration:show
 * It reads only DATA_DIR and DATABASE_URL (PostgreSQL when set), so it works without the rest of
 * the configuration.
 */
import { join, resolve } from 'node:path';
import { createDataSource, databaseTarget, dataSourceOptions } from './data-source-options';

export default createDataSource(
  dataSourceOptions(
    databaseTarget({
      databaseFile: join(resolve(process.env['DATA_DIR'] || './data'), 'rotaplex.sqlite'),
      databaseUrl: process.env['DATABASE_URL'] || null,
    }),
  ),
);
