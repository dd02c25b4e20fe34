// The API tests on PostgreSQL instead of SQLite files: one throwaway PostgreSQL 15 cluster for the
// run (Debian's postgresql-15, started as the postgres account in a temporary directory), one new
// database per test app. Run chosen files: npx jest -c apps/api/jest.postgres.config.js <paths>
const path = require('node:path');
const base = require('./jest.config.js');

module.exports = {
  ...base,
  displayName: 'api (PostgreSQL)',
  globalSetup: path.join(__dirname, 'test/support/postgres-global-setup.ts'),
  globalTeardown: path.join(__dirname, 'test/support/postgres-global-teardown.ts'),
};
