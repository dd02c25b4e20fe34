import { availableParallelism } from 'node:os';
import { ConfigValidationError } from '../config/app-config';

/**
 * Settings for running on several processes through Redis. Without REDIS_URL every field but
 * `redisUrl` is ignored and the API runs solves in its own worker pool, as it always has.
 * Read from the environment by the API (createApp) and by the solver worker (`npm run worker`).
 */
export class ScaleOutConfig {
  /** redis:// or rediss:// URL (REDIS_URL); null: one process, in-process solver pool. */
  readonly redisUrl!: string | null;
  /** Prefix of every Redis key and channel (REDIS_PREFIX, default "rotaplex"). */
  readonly prefix!: string;
  /**
   * Milliseconds a solver worker's lock on its job lasts without renewal (SOLVE_LOCK_MS, default
   * 30000). A worker that dies is noticed after about this long; its job is retried once on another
   * worker, and fails with a clear message if that one dies too.
   */
  readonly solveLockMs!: number;
  /** Solves one worker process runs at once (WORKER_CONCURRENCY, default: the cores). */
  readonly workerConcurrency!: number;
  /** Solver threads of one worker process (WORKER_THREADS, default: WORKER_CONCURRENCY). */
  readonly workerThreads!: number;
}

type Env = Record<string, string | undefined>;

export function loadScaleOutConfig(env: Env = process.env): ScaleOutConfig {
  const problems: string[] = [];
  const read = (name: string): string | undefined => {
    const v = env[name];
    return v === undefined || v.trim() === '' ? undefined : v.trim();
  };
  const int = (name: string, fallback: number, min: number, max: number): number => {
    const raw = read(name);
    if (raw === undefined) return fallback;
    if (!/^\d+$/.test(raw) || Number(raw) < min || Number(raw) > max) {
      problems.push(`${name} must be a whole number from ${min} to ${max} (got "${raw}")`);
      return fallback;
    }
    return Number(raw);
  };
  const redisUrl = read('REDIS_URL') ?? null;
  if (redisUrl !== null) {
    const ok = (() => {
      try {
        return ['redis:', 'rediss:'].includes(new URL(redisUrl).protocol);
      } catch {
        return false;
      }
    })();
    // The URL may carry a password: never echo it.
    if (!ok) problems.push('REDIS_URL must be a redis:// or rediss:// URL, e.g. redis://localhost:6379');
  }
  const prefix = read('REDIS_PREFIX') ?? 'rotaplex';
  if (!/^[A-Za-z0-9_.-]{1,40}$/.test(prefix)) {
    problems.push(
      `REDIS_PREFIX must be 1 to 40 letters, digits, dots, dashes or underscores (got "${prefix}")`,
    );
  }
  const workerConcurrency = int('WORKER_CONCURRENCY', Math.max(1, availableParallelism()), 1, 256);
  const config: ScaleOutConfig = {
    redisUrl,
    prefix,
    solveLockMs: int('SOLVE_LOCK_MS', 30_000, 1000, 600_000),
    workerConcurrency,
    workerThreads: int('WORKER_THREADS', workerConcurrency, 1, 256),
  };
  if (problems.length) throw new ConfigValidationError(problems);
  return config;
}
