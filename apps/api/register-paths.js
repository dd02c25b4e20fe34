// Makes the @rotaplex/* aliases resolve to the compiled libraries in dist/api (built by
// `tsc -p apps/api/tsconfig.app.json`, which compiles the libraries beside the API).
const path = require('node:path');
const tsconfigPaths = require('tsconfig-paths');

const distRoot = path.resolve(__dirname, '../../dist/api');

tsconfigPaths.register({
  baseUrl: distRoot,
  paths: {
    '@rotaplex/contracts': ['libs/contracts/src/index.js'],
    '@rotaplex/roster-model': ['libs/roster-model/src/index.js'],
  },
});
