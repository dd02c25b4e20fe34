/**
 * JavaScript weight per screen: starts the built product, opens screens in Debian's Chromium and
 * records every JavaScript file the page fetched, then prints raw and gzip sizes (zlib at its
 * default level, as a web server or proxy would compress them). Target (issue 4): the sign-in
 * page loads at most 300 KB of compressed JavaScript, and the planning board and calendar come in
 * their own chunks.
 *
 *   npm run bench:bundle
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { openBrowser, signIn } from '../src/support/browser';
import { REPO_ROOT } from '../src/support/server';
import { api, draftPeriods, signInApi, startServer, stopServer, table } from './product';

const KB = 1024;

/** The JavaScript files a step makes the page fetch (paths under dist/web). */
async function scriptsFetched(page: Page, step: () => Promise<void>): Promise<string[]> {
  const seen = new Set<string>();
  const onResponse = (response: { url(): string; request(): { resourceType(): string } }) => {
    const url = new URL(response.url());
    if (url.pathname.endsWith('.js')) seen.add(url.pathname);
  };
  page.on('response', onResponse);
  await step();
  await page.waitForLoadState('networkidle');
  page.off('response', onResponse);
  return [...seen];
}

function sizes(paths: string[]): { raw: number; gzip: number } {
  let raw = 0;
  let gzip = 0;
  for (const p of paths) {
    const bytes = readFileSync(join(REPO_ROOT, 'dist/web', p));
    raw += bytes.length;
    gzip += gzipSync(bytes).length;
  }
  return { raw, gzip };
}

async function main(): Promise<void> {
  const server = await startServer();
  process.env.ROTAPLEX_E2E_BASE_URL = server.baseUrl;
  const browser = await openBrowser();
  try {
    const { page } = browser;
    const manager = await signInApi(server.baseUrl, 'manager@example.com');
    const [period] = await draftPeriods(manager);
    void api;
    const steps: [string, () => Promise<void>][] = [
      ['sign-in page', async () => void (await page.goto('/sign-in'))],
      ['after sign-in (home)', () => signIn(page, 'manager@example.com')],
      [
        'planning board',
        async () => {
          await page.goto(`/planning/periods/${period.id}/board`);
          await page.getByRole('table', { name: 'Planning board' }).waitFor();
        },
      ],
      [
        'calendar view',
        async () => {
          await page.goto(`/planning/periods/${period.id}/board?view=calendar`);
          await page
            .locator('.fc')
            .first()
            .waitFor({ timeout: 10_000 })
            .catch(() => undefined);
        },
      ],
      [
        'reports',
        async () => {
          await page.goto(`/planning/periods/${period.id}/reports`);
          await page
            .locator('svg.recharts-surface')
            .first()
            .waitFor({ timeout: 20_000 })
            .catch(() => undefined);
        },
      ],
      [
        'my roster (staff)',
        async () => {
          await page.context().clearCookies();
          await page.goto('/sign-in');
          await signIn(page, 'staff@example.com');
          await page.goto('/my-roster');
          await page
            .locator('.fc')
            .first()
            .waitFor({ timeout: 10_000 })
            .catch(() => undefined);
        },
      ],
    ];
    const rows: (string | number)[][] = [];
    let signInFiles: Set<string> | null = null;
    for (const [name, step] of steps) {
      const files = await scriptsFetched(page, step);
      signInFiles ??= new Set(files);
      const own = files.filter((f) => !signInFiles!.has(f));
      const all = sizes(files);
      const extra = sizes(own);
      rows.push([
        name,
        files.length,
        (all.raw / KB).toFixed(1),
        (all.gzip / KB).toFixed(1),
        (extra.gzip / KB).toFixed(1),
        own
          .map((f) => f.replace(/^\/assets\//, '').replace(/-[\w-]{8}\.js$/, ''))
          .sort()
          .join(' '),
      ]);
    }
    console.log(
      '\nJavaScript a page loads when opened directly (gzip: zlib default level), and what it loads beyond the sign-in page\n',
    );
    console.log(
      table(['page', 'files', 'raw KB', 'gzip KB', 'beyond sign-in gzip KB', 'chunks beyond sign-in'], rows),
    );
  } finally {
    await browser.close();
    await stopServer(server);
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
