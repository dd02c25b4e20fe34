import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { REPO_ROOT, startServer, type RunningServer } from './server';
import { CHROMIUM_PATH } from './browser';

declare global {
  var __ROTAPLEX_SERVER__: RunningServer | undefined;
}

export default async function globalSetup(): Promise<void> {
  if (!existsSync(CHROMIUM_PATH)) {
    throw new Error(
      `Chromium is missing at ${CHROMIUM_PATH}. Install it with: sudo apt-get install -y chromium`,
    );
  }
  for (const built of ['dist/web/index.html', 'dist/api/apps/api/src/main.js']) {
    if (!existsSync(join(REPO_ROOT, built))) {
      throw new Error(`${built} is missing. Build first: npx nx run-many -t build --projects=web,api`);
    }
  }
  const server = await startServer();
  globalThis.__ROTAPLEX_SERVER__ = server;
  // Test files run after this in the same process (runInBand) or in workers that inherit it.
  process.env.ROTAPLEX_E2E_BASE_URL = server.baseUrl;
}
