import { type NestExpressApplication } from '@nestjs/platform-express';
import { API_PREFIX, REFRESH_COOKIE, type TokenResponse } from '@rotaplex/contracts';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { createApp } from '../../src/app';
import { type AppConfig, loadConfig, resolveJwtSecret } from '../../src/config/app-config';
import { createTestDatabase, testsOnPostgres } from '../../src/database/postgres-cluster';
import { DEMO_PASSWORD } from '../../src/demo/demo-data';

export interface TestApp {
  app: NestExpressApplication;
  config: AppConfig;
  dataDir: string;
  dataSource: DataSource;
  /** supertest agent bound to the app (no cookies kept). */
  http: () => ReturnType<typeof request>;
  /** Signs in and returns the token response and the raw refresh cookie value. */
  login: (
    email: string,
    password?: string,
  ) => Promise<{ body: TokenResponse; token: string; refreshCookie: string }>;
  close: () => Promise<void>;
}

/** Full path of an API route ("/users" → "/api/users"). */
export const api = (path: string) => `${API_PREFIX}${path}`;

/**
 * The real application on a fresh SQLite file in a temporary DATA_DIR, migrations run, demo data
 * seeded, the mail catcher on a random loopback port. Argon2 cost is lowered for speed only.
 * With ROTAPLEX_TEST_DATABASE=postgres (jest.postgres.config.js) the data goes to a fresh database
 * in the run's PostgreSQL cluster instead; restarting on the same DATA_DIR reopens that database.
 */
export async function startTestApp(
  env: Record<string, string> = {},
  reuseDataDir?: string,
): Promise<TestApp> {
  const dataDir = reuseDataDir ?? mkdtempSync(join(tmpdir(), 'rotaplex-api-test-'));
  const database = testsOnPostgres() ? { DATABASE_URL: await testDatabaseUrl(dataDir) } : {};
  const config = resolveJwtSecret(
    loadConfig({
      NODE_ENV: 'test',
      DATA_DIR: dataDir,
      PUBLIC_URL: 'http://rotaplex.test',
      MAIL_CATCHER_PORT: '0',
      SEED_DEMO: 'true',
      ARGON2_TIME_COST: '1',
      ARGON2_MEMORY_KIB: '1024',
      WEB_DIST_DIR: join(dataDir, 'no-web-app'),
      ...database,
      ...env,
    }),
  );
  const app = await createApp(config, { logger: false });
  const server = app.getHttpServer();
  const http = () => request(server);
  const login = async (email: string, password = DEMO_PASSWORD) => {
    const res = await http().post(api('/auth/login')).send({ email, password });
    if (res.status !== 200)
      throw new Error(`login ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return {
      body: res.body as TokenResponse,
      token: (res.body as TokenResponse).accessToken,
      refreshCookie: refreshCookieOf(res),
    };
  };
  return {
    app,
    config,
    dataDir,
    dataSource: app.get(DataSource),
    http,
    login,
    close: async () => {
      await app.close();
      if (!reuseDataDir) rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Test databases by DATA_DIR: created on a DATA_DIR's first start, the same one on a restart. */
const testDatabases = new Map<string, string>();

async function testDatabaseUrl(dataDir: string): Promise<string> {
  const known = testDatabases.get(dataDir);
  if (known) return known;
  const url = await createTestDatabase();
  testDatabases.set(dataDir, url);
  return url;
}

/** The refresh token value from a response's Set-Cookie header ('' when absent or cleared). */
export function refreshCookieOf(res: { headers: Record<string, unknown> }): string {
  const raw = res.headers['set-cookie'];
  const cookies = Array.isArray(raw) ? (raw as string[]) : typeof raw === 'string' ? [raw] : [];
  const found = cookies.find((c) => c.startsWith(`${REFRESH_COOKIE}=`));
  return found ? decodeURIComponent(found.slice(REFRESH_COOKIE.length + 1).split(';')[0]) : '';
}

export function setCookieHeader(res: { headers: Record<string, unknown> }): string {
  const raw = res.headers['set-cookie'];
  return (
    (Array.isArray(raw) ? (raw as string[]) : [String(raw ?? '')]).find((c) =>
      c.startsWith(`${REFRESH_COOKIE}=`),
    ) ?? ''
  );
}

export const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
