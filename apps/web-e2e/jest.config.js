// Browser journeys: the production server (API + built web app on one port) driven by Debian's
// Chromium through playwright-core. One server for the whole run, started by the global setup.
const path = require('node:path');
const preset = require('../../jest.preset.js');

module.exports = {
  ...preset,
  displayName: 'web-e2e',
  rootDir: __dirname,
  testMatch: ['<rootDir>/src/**/*.e2e.ts'],
  transform: {
    '^.+\\.tsx?$': ['ts-jest', { tsconfig: path.join(__dirname, 'tsconfig.json'), isolatedModules: false }],
  },
  globalSetup: '<rootDir>/src/support/global-setup.ts',
  globalTeardown: '<rootDir>/src/support/global-teardown.ts',
  testTimeout: 90_000,
  maxWorkers: 1,
};
