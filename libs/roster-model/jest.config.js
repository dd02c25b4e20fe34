module.exports = {
  ...require('../../jest.preset.js'),
  displayName: 'roster-model',
  rootDir: __dirname,
  testMatch: ['<rootDir>/src/**/*.spec.ts'],
  testTimeout: 180000,
};
