// Solver worker entry (`npm run worker`, REDIS_URL set): run the compiled worker from dist/api.
// Build first with `npx nx run api:build` (npm run worker does it for you).
const fs = require('node:fs');
const path = require('node:path');

const main = path.resolve(__dirname, '../../dist/api/apps/api/src/solve-worker/main.js');
if (!fs.existsSync(main)) {
  console.error(`Rotaplex solver worker is not built (${main} is missing). Run: npx nx run api:build`);
  process.exit(1);
}
require('./register-paths');
require(main).main();
