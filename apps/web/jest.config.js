// Unit tests of the web app's pure functions (no DOM: jsdom is not installed). Node environment.
const path = require('node:path');
const preset = require('../../jest.preset.js');

module.exports = {
  ...preset,
  displayName: 'web',
  rootDir: __dirname,
  testMatch: ['<rootDir>/src/**/*.spec.ts'],
  moduleNameMapper: { ...preset.moduleNameMapper, '^@/(.*)$': '<rootDir>/src/$1' },
  transform: {
    '^.+\\.tsx?$': [
      'ts-jest',
      { tsconfig: path.join(__dirname, 'tsconfig.spec.json'), isolatedModules: false },
    ],
  },
};
