import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { HealthResponse } from '@rotaplex/contracts';

// Jest loads the global setup outside its module mapper, so only types come from contracts here;
// the path is API_PREFIX + API_ROUTES.health.
const HEALTH_PATH = '/api/health';

export const REPO_ROOT = resolve(__dirname, '../../../..');

/** A port that was free a moment ago (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((ok, fail) => {
    const probe = createServer();
    probe.once('error', fail);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => ok(port));
    });
  });
}

export interface RunningServer {
  baseUrl: string;
  dataDir: string;
  process: ChildProcess;
  log: string[];
}

/**
 * Starts the product as `npm start` does after building: `node apps/api/start.js`, production
 * mode, demo data, a fresh data directory and its own ports. Resolves once /api/health says ok.
 */
export async function startServer(): Promise<RunningServer> {
  const port = await freePort();
  const mailPort = await freePort();
  const dataDir = mkdtempSync(join(tmpdir(), 'rotaplex-e2e-'));
  const baseUrl = `http://127.0.0.1:${port}`;
  const log: string[] = [];
  const child = spawn(process.execPath, [join(REPO_ROOT, 'apps/api/start.js')], {
    cwd: REPO_ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      PUBLIC_URL: baseUrl,
      DATA_DIR: dataDir,
      MAIL_CATCHER_PORT: String(mailPort),
      JWT_SECRET: 'browser-suite-secret-not-for-production-use-0123456789',
      SEED_DEMO: 'true',
      // The journeys sign the same demo people in several times a minute; the limit itself is
      // covered by the API's own tests.
      LOGIN_RATE_LIMIT: '100',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const keep = (chunk: Buffer) => {
    log.push(chunk.toString());
    if (log.length > 400) log.shift();
  };
  child.stdout?.on('data', keep);
  child.stderr?.on('data', keep);

  const deadline = Date.now() + 90_000;
  let exited: number | null = null;
  child.once('exit', (code) => (exited = code ?? -1));
  for (;;) {
    if (exited !== null) {
      rmSync(dataDir, { recursive: true, force: true });
      throw new Error(`The server stopped during start-up (exit ${exited}):\n${log.join('')}`);
    }
    try {
      const response = await fetch(`${baseUrl}${HEALTH_PATH}`);
      if (response.ok && ((await response.json()) as HealthResponse).status === 'ok') break;
    } catch {
      // Not listening yet.
    }
    if (Date.now() > deadline) {
      child.kill('SIGTERM');
      throw new Error(`The server did not become healthy within 90 s:\n${log.join('')}`);
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return { baseUrl, dataDir, process: child, log };
}

export async function stopServer(server: RunningServer): Promise<void> {
  const child = server.process;
  if (child.exitCode === null && child.signalCode === null) {
    const exited = new Promise<void>((r) => child.once('exit', () => r()));
    child.kill('SIGTERM');
    const timer = setTimeout(() => child.kill('SIGKILL'), 10_000);
    await exited;
    clearTimeout(timer);
  }
  rmSync(server.dataDir, { recursive: true, force: true });
}
