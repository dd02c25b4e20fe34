// Production entry (`npm start`, browser tests): run the compiled API from dist/api.
// Build first with `npx nx run api:build` (npm start does it for you).
const fs = require('node:fs');
const path = require('node:path');

const main = path.resolve(__dirname, '../../dist/api/apps/api/src/main.js');
if (!fs.existsSync(main)) {
  console.error(`Rotaplex API is not built (${main} is missing). Run: npx nx run api:build`);
  process.exit(1);
}
require('./register-paths');
require(main);
