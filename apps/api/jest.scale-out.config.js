// The scale-out suite (`npm run test:scale-out`): real redis-server, two API instances and solver
// worker processes from the compiled API. Separate from the API suite: it needs the build and
// takes a few minutes.
const path = require('node:path');
const preset = require('../../jest.preset.js');

module.exports = {
  ...preset,
  displayName: 'api-scale-out',
  rootDir: __dirname,
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: path.join(__dirname, 'tsconfig.spec.json') }],
  },
  testMatch: ['<rootDir>/test/scale-out/**/*.scale-out-spec.ts'],
  maxWorkers: 1,
  testTimeout: 300000,
};
