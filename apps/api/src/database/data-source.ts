/**
 * DataSource for the TypeORM command line, e.g. after `npx nx build api`:
 *   DATA_DIR=./data node -r ./apps/api/register-paths.js node_modules/typeorm/cli.js \
 *     -d dist/api/apps/api/src/database/data-source.js migration:show
 * It reads only DATA_DIR, so it works without the rest of the configuration.
 */
import { join, resolve } from 'node:path';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from './data-source-options';

export default new DataSource(
  dataSourceOptions(join(resolve(process.env['DATA_DIR'] || './data'), 'rotaplex.sqlite')),
);
