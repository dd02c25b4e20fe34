/**
 * Real processes for the scale-out tests and the queue benchmark: Debian's redis-server on a free
 * port (no systemd, nothing written to disk), API instances and solver workers started from the
 * compiled API (`npx nx run api:build`), each with its own port, data directory and mail catcher.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

export const REPO_ROOT = resolve(__dirname, '../../../..');
/** Compiled API and libraries (ROTAPLEX_API_DIST overrides dist/api). */
export const API_DIST = resolve(process.env.ROTAPLEX_API_DIST ?? join(REPO_ROOT, 'dist/api'));
const REDIS_SERVER = process.env.REDIS_SERVER ?? '/usr/bin/redis-server';

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

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export interface Proc {
  name: string;
  child: ChildProcess;
  log: string[];
  /** Resolves with the exit code (or signal) once the process has ended. */
  exited: Promise<number | string>;
}

function start(name: string, command: string, args: string[], env: Record<string, string>): Proc {
  const child = spawn(command, args, {
    cwd: REPO_ROOT,
    // NODE_PATH: a build outside the repository (ROTAPLEX_API_DIST) still finds the packages.
    env: { ...process.env, NODE_PATH: join(REPO_ROOT, 'node_modules'), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const log: string[] = [];
  const keep = (chunk: Buffer) => {
    log.push(...chunk.toString().split('\n').filter(Boolean));
    if (log.length > 400) log.splice(0, log.length - 400);
    if (process.env.ROTAPLEX_CLUSTER_LOG) process.stderr.write(`[${name}] ${chunk.toString()}`);
  };
  child.stdout?.on('data', keep);
  child.stderr?.on('data', keep);
  const exited = new Promise<number | string>((ok) =>
    child.once('exit', (code, signal) => ok(code ?? signal ?? -1)),
  );
  return { name, child, log, exited };
}

export async function stop(proc: Proc, signal: NodeJS.Signals = 'SIGTERM', graceMs = 15_000): Promise<void> {
  if (proc.child.exitCode !== null || proc.child.signalCode !== null) return;
  proc.child.kill(signal);
  const timer = setTimeout(() => proc.child.kill('SIGKILL'), graceMs);
  await proc.exited;
  clearTimeout(timer);
}

export interface RedisServer {
  url: string;
  port: number;
  proc: Proc;
  stop: () => Promise<void>;
}

/** redis-server on a free loopback port, in memory only; stopped with SHUTDOWN NOSAVE semantics (SIGTERM). */
export async function startRedis(): Promise<RedisServer> {
  if (!existsSync(REDIS_SERVER))
    throw new Error(`${REDIS_SERVER} is missing: apt-get install -y redis-server (.ci/run does it)`);
  const port = await freePort();
  const proc = start(
    'redis',
    REDIS_SERVER,
    [
      '--port',
      String(port),
      '--bind',
      '127.0.0.1',
      '--save',
      '',
      '--appendonly',
      'no',
      '--daemonize',
      'no',
      '--dir',
      tmpdir(),
    ],
    {},
  );
  for (let i = 0; i < 100; i++) {
    if (proc.log.some((l) => /Ready to accept connections/.test(l))) break;
    if (proc.child.exitCode !== null) throw new Error(`redis-server stopped:\n${proc.log.join('\n')}`);
    await sleep(100);
  }
  return { url: `redis://127.0.0.1:${port}`, port, proc, stop: () => stop(proc) };
}

/** Runs a file of the compiled API with the @rotaplex/* aliases pointing at the compiled libraries. */
function nodeArgs(file: string): string[] {
  const bootstrap = `
    require(${JSON.stringify(join(REPO_ROOT, 'node_modules/tsconfig-paths'))}).register({
      baseUrl: ${JSON.stringify(API_DIST)},
      paths: {
        '@rotaplex/contracts': ['libs/contracts/src/index.js'],
        '@rotaplex/roster-model': ['libs/roster-model/src/index.js'],
      },
    });
    const m = require(${JSON.stringify(join(API_DIST, file))});
    if (typeof m.main === 'function') m.main();
  `;
  return ['-e', bootstrap];
}

export function assertBuilt(): void {
  const main = join(API_DIST, 'apps/api/src/main.js');
  if (!existsSync(main)) throw new Error(`${main} is missing: run npx nx run api:build first`);
}

export interface ApiInstance extends Proc {
  baseUrl: string;
  dataDir: string;
}

export interface ApiOptions {
  redisUrl: string;
  prefix: string;
  /** Data directory (the JWT secret file; the SQLite file unless DATABASE_URL is given in env). */
  dataDir: string;
  env?: Record<string, string>;
}

/** One API instance (`node apps/api/start.js` in production mode) on a free port; resolves once healthy. */
export async function startApi(name: string, options: ApiOptions): Promise<ApiInstance> {
  const port = await freePort();
  const mailPort = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const proc = start(name, process.execPath, nodeArgs('apps/api/src/main.js'), {
    NODE_ENV: 'production',
    PORT: String(port),
    PUBLIC_URL: 'http://rotaplex.test',
    DATA_DIR: options.dataDir,
    MAIL_CATCHER_PORT: String(mailPort),
    JWT_SECRET: 'scale-out-suite-secret-not-for-production-use-0123456789',
    SEED_DEMO: 'true',
    ARGON2_TIME_COST: '1',
    ARGON2_MEMORY_KIB: '1024',
    REDIS_URL: options.redisUrl,
    REDIS_PREFIX: options.prefix,
    ...options.env,
  });
  const deadline = Date.now() + 120_000;
  for (;;) {
    if (proc.child.exitCode !== null)
      throw new Error(`${name} stopped before it was healthy:\n${proc.log.join('\n')}`);
    try {
      const res = await fetch(`${baseUrl}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`${name} not healthy in 120 s:\n${proc.log.join('\n')}`);
    await sleep(250);
  }
  return { ...proc, baseUrl, dataDir: options.dataDir };
}

/** One solver worker process (`npm run worker`); resolves once it is taking jobs. */
export async function startWorker(
  name: string,
  redisUrl: string,
  prefix: string,
  env: Record<string, string> = {},
): Promise<Proc> {
  const proc = start(name, process.execPath, nodeArgs('apps/api/src/solve-worker/main.js'), {
    REDIS_URL: redisUrl,
    REDIS_PREFIX: prefix,
    ...env,
  });
  const deadline = Date.now() + 60_000;
  while (!proc.log.some((l) => l.includes('ready as'))) {
    if (proc.child.exitCode !== null) throw new Error(`${name} stopped:\n${proc.log.join('\n')}`);
    if (Date.now() > deadline) throw new Error(`${name} not ready in 60 s:\n${proc.log.join('\n')}`);
    await sleep(100);
  }
  return proc;
}

export function tempDataDir(): { dir: string; remove: () => void } {
  const dir = mkdtempSync(join(tmpdir(), 'rotaplex-scale-out-'));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}
