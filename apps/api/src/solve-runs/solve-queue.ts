import { Injectable, Logger } from '@nestjs/common';
import { type RosterProblem } from '@rotaplex/roster-model';
import { type Job, Queue, QueueEvents, Worker } from 'bullmq';
import { type Redis } from 'ioredis';
import { redisConnection, RedisConnections } from '../redis/redis-connections';
import {
  apiInstanceKey,
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
  solveOwnerKey,
  SOLVER_WORKER_NAME_PREFIX,
} from './solve-queue-protocol';

/** How a queued solve ended, as seen by the API instance that owns it. */
export type SolveJobOutcome =
  | { kind: 'completed'; value: SolveJobResult }
  | { kind: 'failed'; message: string }
  /** The job is gone from the queue (removed by a cancel before it began). */
  | { kind: 'missing' };

/** Heartbeat of an API instance: written this often, expires after three missed beats. */
const HEARTBEAT_MS = 5_000;
/** A job's state is also checked this often, in case an event from Redis was missed. */
const RECHECK_MS = 5_000;
/**
 * A run's owner key outlives a missed beat or two (refreshed every beat while the run is owned):
 * longer than the heartbeat, so a dead owner is told by its expired heartbeat, as before, while
 * its runs' owner keys still name it.
 */
const OWNER_KEY_MS = 12 * HEARTBEAT_MS;

/**
 * Who owns a run, for the other instances' sweep: `alive` (its owner's heartbeat is there),
 * `gone` (the owner key names an instance whose heartbeat has expired or was removed) or
 * `unknown` (no owner key: not queued yet, ended, or queued by an instance of an earlier version).
 */
export type RunOwnerState = 'alive' | 'gone' | 'unknown';

export interface QueueHealth {
  state: 'up' | 'down';
  waiting: number;
  active: number;
  solverWorkers: number;
}

/**
 * The API's side of the BullMQ queue of solves (REDIS_URL set): queues jobs, learns when they end
 * (queue events, with a periodic re-check), sends controls to the solver workers, forwards the
 * solve events of every worker, checks for stalled jobs (a worker that died: retried once, then
 * failed), and keeps this instance's heartbeat so others can tell its runs were orphaned.
 */
@Injectable()
export class SolveQueue {
  private readonly logger = new Logger('SolveQueue');
  readonly queue: Queue<SolveJobData>;
  private readonly queueEvents: QueueEvents;
  private readonly stalledChecker: Worker;
  private readonly prefix: string;
  private readonly ended = new Set<(runId: string, outcome: SolveJobOutcome) => void>();
  private readonly eventListeners = new Set<(message: SolveEventMessage) => void>();
  /** Runs this instance owns and waits for. */
  private readonly owned = new Set<string>();
  private readonly timers: NodeJS.Timeout[] = [];
  /** The connections made here: BullMQ leaves connections it was given open when it closes. */
  private readonly connections: Redis[] = [];
  private closed = false;

  constructor(private readonly redis: RedisConnections) {
    const config = redis.config;
    this.prefix = config.prefix;
    const url = config.redisUrl as string;
    const connect = (name: string): Redis => {
      const connection = redisConnection(url, `${config.prefix}-${name}`);
      this.connections.push(connection);
      return connection;
    };
    this.queue = new Queue<SolveJobData>(SOLVE_QUEUE, {
      connection: connect('api-queue'),
      prefix: config.prefix,
    });
    this.queueEvents = new QueueEvents(SOLVE_QUEUE, {
      connection: connect('api-queue-events'),
      prefix: config.prefix,
    });
    this.queueEvents.on('completed', ({ jobId }) => void this.check(jobId));
    this.queueEvents.on('failed', ({ jobId }) => void this.check(jobId));
    this.queueEvents.on('removed', ({ jobId }) => void this.check(jobId));
    this.queueEvents.on('stalled', ({ jobId }) => void this.check(jobId));
    this.queueEvents.on('error', (err) => this.logger.warn(`queue events: ${err.message}`));
    // A worker that takes no jobs, only moves the jobs of dead solver workers on (back to the
    // queue once, then failed), so no run waits for a worker that is gone, even with none left.
    this.stalledChecker = new Worker(
      SOLVE_QUEUE,
      () => Promise.reject(new Error('the API does not run solves')),
      {
        connection: connect('api-stalled'),
        prefix: config.prefix,
        autorun: false,
        lockDuration: config.solveLockMs,
        stalledInterval: config.solveLockMs,
        maxStalledCount: 1,
        name: `api-${redis.instanceId}`,
      },
    );
    this.stalledChecker.on('error', (err) => this.logger.warn(`stalled check: ${err.message}`));
  }

  /** Starts listening; called once by SolveRunsService at bootstrap. */
  async start(): Promise<void> {
    await this.redis.listen(solveEventsChannel(this.prefix), (text) => {
      let message: SolveEventMessage;
      try {
        message = JSON.parse(text) as SolveEventMessage;
      } catch {
        return;
      }
      for (const listener of this.eventListeners) listener(message);
    });
    await this.queueEvents.waitUntilReady();
    void this.stalledChecker.startStalledCheckTimer();
    await this.beat();
    this.timers.push(setInterval(() => void this.beat(), HEARTBEAT_MS));
    this.timers.push(
      setInterval(() => {
        for (const runId of this.owned) void this.check(runId);
      }, RECHECK_MS),
    );
    this.timers.forEach((t) => t.unref());
  }

  get instanceId(): string {
    return this.redis.instanceId;
  }

  onEnded(listener: (runId: string, outcome: SolveJobOutcome) => void): void {
    this.ended.add(listener);
  }

  onEvent(listener: (message: SolveEventMessage) => void): void {
    this.eventListeners.add(listener);
  }

  /** Publish a solve event to every API instance (and so to every browser following the run). */
  async publish(message: SolveEventMessage): Promise<void> {
    await this.redis.client.publish(solveEventsChannel(this.prefix), JSON.stringify(message));
  }

  async enqueue(runId: string, problem: RosterProblem, timeLimitSeconds: number): Promise<void> {
    this.owned.add(runId);
    // Before the job exists, so no job of this version is ever without its owner key.
    await this.redis.client.set(solveOwnerKey(this.prefix, runId), this.instanceId, 'PX', OWNER_KEY_MS);
    await this.queue.add(
      'solve',
      {
        runId,
        owner: this.instanceId,
        problem: encodeValue(problem),
        timeLimitSeconds,
        queuedAt: Date.now(),
      },
      {
        jobId: runId,
        attempts: 1,
        removeOnComplete: { age: 3600 },
        removeOnFail: { age: 24 * 3600 },
      },
    );
  }

  /** Forget a run this instance owned (it ended some other way). */
  disown(runId: string): void {
    this.release(runId);
  }

  /** Stop owning a run and drop its owner key; false when it was not owned (any more). */
  private release(runId: string): boolean {
    if (!this.owned.delete(runId)) return false;
    this.redis.client.del(solveOwnerKey(this.prefix, runId)).catch(() => undefined);
    return true;
  }

  /**
   * Cancel a run: a job still waiting is removed ('removed'); a running one is told to stop and
   * keep its best roster ('signalled'; its owner saves it when the job completes).
   */
  async cancel(runId: string): Promise<'removed' | 'signalled'> {
    await this.redis.client.set(solveCancelKey(this.prefix, runId), '1', 'EX', 24 * 3600);
    const job = await this.queue.getJob(runId);
    if (job && ['waiting', 'prioritized', 'delayed'].includes(await job.getState())) {
      try {
        await job.remove();
        return 'removed';
      } catch {
        // A worker took it meanwhile: stop it like a running one.
      }
    }
    await this.control({ runId, action: 'cancel' });
    return 'signalled';
  }

  /** End a running solve at once (its worker thread is terminated; no roster is kept). */
  async kill(runId: string): Promise<void> {
    await this.redis.client.set(solveCancelKey(this.prefix, runId), '1', 'EX', 24 * 3600);
    await this.control({ runId, action: 'kill' });
  }

  /**
   * The owner state of each run, in two round trips whatever the number of runs: one MGET of the
   * runs' owner keys, one MGET of their owners' heartbeat keys.
   */
  async owners(runIds: readonly string[]): Promise<Map<string, RunOwnerState>> {
    const states = new Map<string, RunOwnerState>();
    if (!runIds.length) return states;
    const client = this.redis.client;
    const owners = await client.mget(runIds.map((id) => solveOwnerKey(this.prefix, id)));
    const instances = [...new Set(owners.filter((o): o is string => o !== null))];
    const beats = instances.length
      ? await client.mget(instances.map((id) => apiInstanceKey(this.prefix, id)))
      : [];
    const alive = new Set(instances.filter((_, i) => beats[i] !== null));
    runIds.forEach((id, i) => {
      const owner = owners[i];
      states.set(id, owner === null ? 'unknown' : alive.has(owner) ? 'alive' : 'gone');
    });
    return states;
  }

  /**
   * Whether the API instance that owns a run's job is alive; null when the job is gone. Fetches
   * the whole job: only for a run without an owner key (see {@link owners}).
   */
  async ownerAlive(runId: string): Promise<{ job: Job<SolveJobData>; alive: boolean } | null> {
    const job = await this.queue.getJob(runId);
    if (!job) return null;
    const alive = (await this.redis.client.exists(apiInstanceKey(this.prefix, job.data.owner))) === 1;
    return { job, alive };
  }

  /**
   * Remove a job whatever its state (a run whose owner is gone) and its owner key; a running one
   * is stopped first (its worker still holds the lock, so the job stays until the worker ends it).
   */
  async discard(runId: string): Promise<void> {
    this.owned.delete(runId);
    await this.redis.client.del(solveOwnerKey(this.prefix, runId)).catch(() => undefined);
    await this.kill(runId);
    await this.queue.remove(runId).catch(() => undefined);
  }

  async health(): Promise<QueueHealth> {
    try {
      const counts = await this.queue.getJobCounts('waiting', 'prioritized', 'active');
      const workers = await this.queue.getWorkers();
      return {
        state: 'up',
        waiting: (counts.waiting ?? 0) + (counts.prioritized ?? 0),
        active: counts.active ?? 0,
        // BullMQ names each worker's connection "<prefix>:<queue>:w:<worker name>" (rawname).
        solverWorkers: workers.filter((w) =>
          String(w.rawname ?? '').includes(`:w:${SOLVER_WORKER_NAME_PREFIX}`),
        ).length,
      };
    } catch {
      return { state: 'down', waiting: 0, active: 0, solverWorkers: 0 };
    }
  }

  private async control(message: SolveControlMessage): Promise<void> {
    await this.redis.client.publish(solveControlChannel(this.prefix), JSON.stringify(message));
  }

  /** The heartbeat, and the owner key of every run still owned (set again if it was lost). */
  private async beat(): Promise<void> {
    if (this.closed) return;
    // One round trip. A key written for a run released meanwhile expires by itself; its run has
    // ended, so no sweep reads it.
    const batch = this.redis.client
      .multi()
      .set(apiInstanceKey(this.prefix, this.instanceId), String(Date.now()), 'PX', 3 * HEARTBEAT_MS);
    for (const runId of this.owned)
      batch.set(solveOwnerKey(this.prefix, runId), this.instanceId, 'PX', OWNER_KEY_MS);
    await batch.exec().catch(() => undefined);
  }

  /** Looks at an owned job and reports its end once. */
  private async check(runId: string): Promise<void> {
    if (!this.owned.has(runId) || this.closed) return;
    let outcome: SolveJobOutcome | null = null;
    try {
      const job = await this.queue.getJob(runId);
      if (!job) outcome = { kind: 'missing' };
      else {
        const state = await job.getState();
        if (state === 'completed')
          outcome = {
            kind: 'completed',
            value: decodeValue<SolveJobResult>(job.returnvalue as unknown as string),
          };
        else if (state === 'failed')
          outcome = { kind: 'failed', message: job.failedReason || 'unknown error' };
        else if (job.deferredFailure && ['waiting', 'prioritized'].includes(state)) {
          // Stalled past the limit: BullMQ fails such a job only when a worker takes it next, and
          // there may be none left. Take it off the queue and fail the run now. The outcome is
          // claimed before the removal: the removal wakes another check, which would find the job
          // missing and end the run as cancelled (seen once in the scale-out run).
          if (!this.release(runId)) return;
          const message = job.deferredFailure;
          await job
            .remove()
            .catch((err: unknown) => this.logger.warn(`Removing solve job ${runId}: ${String(err)}`));
          for (const listener of this.ended) listener(runId, { kind: 'failed', message });
          return;
        }
      }
    } catch (err) {
      this.logger.warn(`Checking solve job ${runId}: ${String(err)}`);
      return;
    }
    if (!outcome || !this.release(runId)) return;
    for (const listener of this.ended) listener(runId, outcome);
  }

  /** Stops listening and leaves the queue (called by SolveRunsService when the app stops). */
  async close(): Promise<void> {
    this.closed = true;
    this.timers.forEach((t) => clearInterval(t));
    await this.redis.client.del(apiInstanceKey(this.prefix, this.instanceId)).catch(() => undefined);
    await Promise.allSettled([this.stalledChecker.close(), this.queueEvents.close(), this.queue.close()]);
    await Promise.allSettled(this.connections.map((c) => c.quit()));
  }
}
