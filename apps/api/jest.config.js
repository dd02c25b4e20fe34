// API tests: unit specs beside the code (src/**/*.spec.ts) and HTTP tests against the real app on a
// temporary SQLite file (test/**/*.e2e-spec.ts). One worker: the machine is shared and each e2e file
// starts its own app, database and mail catcher.
const path = require('node:path');
const preset = require('../../jest.preset.js');

module.exports = {
  ...preset,
  displayName: 'api',
  rootDir: __dirname,
  transform: {
    // Transpile only (tsconfig.spec.json sets isolatedModules): type errors are the typecheck target's job.
    '^.+\\.ts$': ['ts-jest', { tsconfig: path.join(__dirname, 'tsconfig.spec.json') }],
  },
  testMatch: ['<rootDir>/src/**/*.spec.ts', '<rootDir>/test/**/*.e2e-spec.ts'],
  maxWorkers: 1,
  testTimeout: 30000,
};
