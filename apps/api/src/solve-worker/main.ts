/**
 * A solver worker process (`npm run worker`, REDIS_URL set): takes solve jobs from the BullMQ
 * queue, runs them with the roster model's pool (the same solveRoster call the API's in-process
 * pool makes: worker threads, a warm HiGHS session each, spare cores lent while nothing waits) and
 * sends progress back on a Redis channel. Run any number of them, on any machine that reaches
 * Redis; they need no database. The API that queued a job saves its result.
 */
import 'reflect-metadata';
import { SolverPool, type RosterProblem } from '@rotaplex/roster-model';
import { type Job, Worker } from 'bullmq';
import { hostname } from 'node:os';
import { ConfigValidationError } from '../config/app-config';
import { redisConnection } from '../redis/redis-connections';
import { loadScaleOutConfig, type ScaleOutConfig } from '../redis/scale-out-config';
import {
  decodeValue,
  encodeValue,
  SOLVE_QUEUE,
  type SolveControlMessage,
  type SolveEventMessage,
  type SolveJobData,
  type SolveJobResult,
  solveCancelKey,
  solveControlChannel,
  solveEventsChannel,
  SOLVER_WORKER_NAME_PREFIX,
} from '../solve-runs/solve-queue-protocol';

interface Running {
  cancel: AbortController;
  kill: AbortController;
}

function log(message: string): void {
  console.log(`${new Date().toISOString()} [solver worker ${process.pid}] ${message}`);
}

export async function runSolverWorker(config: ScaleOutConfig): Promise<() => Promise<void>> {
  const url = config.redisUrl as string;
  const prefix = config.prefix;
  const name = `${SOLVER_WORKER_NAME_PREFIX}${hostname()}-${process.pid}`;
  const commands = redisConnection(url, `${prefix}-worker`);
  const subscriber = redisConnection(url, `${prefix}-worker-sub`, true);
  const pool = new SolverPool({ size: config.workerThreads });
  const running = new Map<string, Running>();

  subscriber.on('message', (_channel: string, text: string) => {
    let message: SolveControlMessage;
    try {
      message = JSON.parse(text) as SolveControlMessage;
    } catch {
      return;
    }
    const run = running.get(message.runId);
    if (!run) return;
    log(`${message.action} ${message.runId}`);
    (message.action === 'kill' ? run.kill : run.cancel).abort();
  });
  await subscriber.subscribe(solveControlChannel(prefix));

  const publish = (message: SolveEventMessage): void => {
    commands.publish(solveEventsChannel(prefix), JSON.stringify(message)).catch(() => undefined);
  };

  const solve = async (job: Job<SolveJobData>): Promise<string> => {
    const { runId, timeLimitSeconds } = job.data;
    const entry: Running = { cancel: new AbortController(), kill: new AbortController() };
    running.set(runId, entry);
    try {
      // Cancelled before this worker took it (or before a retry): nothing to solve.
      if (await commands.exists(solveCancelKey(prefix, runId))) {
        const none: SolveJobResult = { cancelled: true, result: null, worker: name, startedAt: Date.now() };
        return encodeValue(none);
      }
      const startedAt = Date.now();
      log(`solving ${runId} (${timeLimitSeconds} s, queued ${startedAt - job.data.queuedAt} ms)`);
      publish({ runId, event: 'started', data: { startedAt, worker: name, attempt: job.attemptsStarted } });
      const problem = decodeValue<RosterProblem>(job.data.problem);
      const result = await pool.solveRoster(problem, {
        timeLimitSeconds,
        // As in the API's own pool: a thread nobody else needs helps, and is given back when a job waits.
        spareCores: true,
        signal: entry.cancel.signal,
        killSignal: entry.kill.signal,
        onProgress: (p) =>
          publish({
            runId,
            event: 'progress',
            data: { elapsedSeconds: p.elapsedSeconds, objective: p.objective, bound: p.bound, gap: p.gap },
          }),
      });
      log(`finished ${runId}: ${result.status}, objective ${result.objective}`);
      const value: SolveJobResult = {
        cancelled: entry.cancel.signal.aborted,
        result,
        worker: name,
        startedAt,
      };
      return encodeValue(value);
    } finally {
      running.delete(runId);
    }
  };

  const worker = new Worker<SolveJobData, string>(SOLVE_QUEUE, solve, {
    connection: redisConnection(url, `${prefix}-worker-queue`),
    prefix,
    name,
    concurrency: config.workerConcurrency,
    lockDuration: config.solveLockMs,
    stalledInterval: config.solveLockMs,
    // A job whose worker died goes back to the queue once; a second death fails it.
    maxStalledCount: 1,
  });
  worker.on('error', (err) => log(`error: ${err.message}`));
  worker.on('failed', (job, err) => log(`failed ${job?.id ?? '?'}: ${err.message}`));
  await worker.waitUntilReady();
  log(
    `ready as ${name}: ${config.workerConcurrency} solve(s) at once on ${config.workerThreads} thread(s), queue ${prefix}:${SOLVE_QUEUE}`,
  );

  return async () => {
    // Running solves stop and keep their rosters; the API saves them as cancelled runs.
    for (const run of running.values()) run.cancel.abort();
    await worker.close();
    await pool.close().catch(() => undefined);
    await Promise.allSettled([subscriber.quit(), commands.quit()]);
  };
}

export async function main(): Promise<void> {
  let config: ScaleOutConfig;
  try {
    config = loadScaleOutConfig(process.env);
  } catch (err) {
    if (err instanceof ConfigValidationError) {
      console.error(`Rotaplex solver worker cannot start.\n${err.message}`);
      process.exit(1);
    }
    throw err;
  }
  if (!config.redisUrl) {
    console.error('Rotaplex solver worker cannot start: set REDIS_URL (the same as the API instances).');
    process.exit(1);
  }
  const stop = await runSolverWorker(config);
  let stopping = false;
  const onSignal = (signal: string): void => {
    if (stopping) process.exit(1);
    stopping = true;
    log(`${signal}: stopping (a second signal exits at once)`);
    stop().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.on('SIGINT', () => onSignal('SIGINT'));
  process.on('SIGTERM', () => onSignal('SIGTERM'));
}

if (require.main === module) {
  main().catch((err: unknown) => {
    console.error('Rotaplex solver worker failed to start:', err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
