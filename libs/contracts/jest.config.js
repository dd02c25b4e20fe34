module.exports = {
  ...require('../../jest.preset.js'),
  displayName: 'contracts',
  rootDir: __dirname,
  testMatch: ['<rootDir>/src/**/*.spec.ts'],
};
