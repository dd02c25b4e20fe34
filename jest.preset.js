// Shared jest settings: ts-jest on CommonJS, path aliases from tsconfig.base.json.
const path = require('node:path');

const root = __dirname;

module.exports = {
  testEnvironment: 'node',
  transform: {
    '^.+\\.tsx?$': ['ts-jest', { tsconfig: path.join(root, 'tsconfig.base.json'), isolatedModules: false }],
  },
  moduleFileExtensions: ['ts', 'tsx', 'js', 'json'],
  moduleNameMapper: {
    '^@rotaplex/contracts$': path.join(root, 'libs/contracts/src/index.ts'),
    '^@rotaplex/roster-model$': path.join(root, 'libs/roster-model/src/index.ts'),
  },
};
