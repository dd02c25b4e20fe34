import {
  ConflictException,
  Inject,
  Injectable,
  Logger,
  NotFoundException,
  type OnApplicationBootstrap,
  Optional,
  type OnModuleDestroy,
} from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  ACTIVE_SOLVE_RUN_STATUSES,
  isSolveRunEnded,
  type Page,
  type QueueHealthDto,
  type SolveProgressDto,
  type SolveRunDto,
  type SolveRunModeName,
  type SolveRunEventName,
  type SolveRunResultDto,
  type SolveRunStartedDto,
  type SolveRunSummaryDto,
} from '@rotaplex/contracts';
import { EventEmitter } from 'node:events';
import { availableParallelism } from 'node:os';
import { type Roster } from '@rotaplex/roster-model';
import { DataSource, type EntityManager, In, Repository } from 'typeorm';
import { saveSolvedRoster } from '../assignments/assignments.service';
import { type AuthUser } from '../common/auth-user';
import { isPostgres } from '../database/data-source-options';
import { PeriodWriter } from '../roster-periods/period-writer';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { type StartSolveRunDto } from './dto/solve-run.dto';
import { SolveRunEntity } from './solve-run.entity';
import { type PoolSolveResult, SolverPool } from './solver';
import { type SolveEventMessage } from './solve-queue-protocol';
import { SolveQueue, type SolveJobOutcome } from './solve-queue';

export interface SolveRunEvent {
  event: SolveRunEventName;
  data: unknown;
}

/** Message of runs a previous server process left queued or running. */
export const RESTARTED_MESSAGE =
  'The server restarted during the solve, so the run was stopped. Start a new run to generate the roster.';
const STOPPED_MESSAGE = 'The server stopped during the solve, so the run was stopped. Start a new run.';
/** Progress is written to the database at most this often (SSE listeners get every update). */
const PROGRESS_WRITE_MS = 1000;
/** With REDIS_URL: how often each API instance looks for runs whose owning instance is gone. */
const ORPHAN_SWEEP_MS = 5000;
/** A run without a job this long after it was created lost its owner before it was queued. */
const UNQUEUED_GRACE_MS = 60_000;
/** A solver worker died twice during the same solve (BullMQ's stalled-job limit). */
export const WORKER_LOST_MESSAGE =
  'A solver worker stopped during the solve (its process or machine ended) and the retry on another worker stopped too, so the run was stopped. Start a new run.';

/**
 * A run that does something other than generating a draft (e.g. repairing a published roster):
 * it adjusts the model's input before the solve and saves the roster itself at the end, in the
 * transaction that records the run's outcome (throwing there fails the run and saves nothing).
 * The run's row stores the mode's name; the behaviour stays in memory (a queued or running run
 * does not survive a restart anyway).
 */
export interface SolveRunMode {
  /** Stored on the run (default repair, the only mode besides generate). */
  name?: Exclude<SolveRunModeName, 'generate'>;
  /** Period statuses the mode starts on (generate: draft). */
  periodStatuses: readonly string[];
  prepare(input: RosterInput): Promise<void>;
  save(em: EntityManager, input: RosterInput, roster: Roster, run: SolveRunEntity): Promise<void>;
}

/** A run this API instance queued (REDIS_URL set): what it needs to save the result. */
interface OwnedRun {
  input: RosterInput;
  lastWrite: number;
  progressWrite: Promise<unknown>;
}

interface ActiveRun {
  cancel: AbortController;
  kill: AbortController;
  done: Promise<void>;
}

/**
 * Solve runs: a queue in front of the roster model's worker pool (the solver never runs on the
 * event loop), progress to listeners and the database, the roster written in one transaction at
 * the end, and crash safety (a failed solve fails its run; runs a previous process left behind are
 * failed at start-up).
 *
 * With REDIS_URL the queue is BullMQ's (see solve-queue.ts): this instance loads the input and
 * queues the job, a solver worker process solves it, and this instance saves the result as it
 * would its own pool's. Events go through Redis to every instance, so a browser may follow a run
 * from any of them; a run whose instance is gone is failed by the others (as a restart would).
 */
@Injectable()
export class SolveRunsService implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('SolveRuns');
  private pool: SolverPool | null = null;
  private readonly waiting: string[] = [];
  private readonly active = new Map<string, ActiveRun>();
  private readonly events = new EventEmitter();
  private readonly modes = new Map<string, SolveRunMode>();
  private readonly owned = new Map<string, OwnedRun>();
  private sweepTimer: NodeJS.Timeout | null = null;
  private stopping = false;

  constructor(
    @InjectRepository(SolveRunEntity) private readonly runs: Repository<SolveRunEntity>,
    private readonly dataSource: DataSource,
    private readonly periods: RosterPeriodsService,
    private readonly input: RosterInputService,
    private readonly writer: PeriodWriter,
    // Null without REDIS_URL (the factory in SolveRunsModule); an explicit token, as the type is a union.
    @Optional() @Inject(SolveQueue) private readonly queue: SolveQueue | null = null,
  ) {
    this.events.setMaxListeners(0);
  }

  /** Runs left queued or running by a previous process can never finish: fail them with a message. */
  async onApplicationBootstrap(): Promise<void> {
    if (this.queue) {
      // Other instances may own the active runs: only runs whose owner is gone are failed (sweep).
      this.queue.onEvent((message) => void this.onQueueEvent(message));
      this.queue.onEnded((runId, outcome) => void this.onJobEnded(runId, outcome));
      await this.queue.start();
      this.sweepTimer = setInterval(() => void this.sweepOrphans(), ORPHAN_SWEEP_MS);
      this.sweepTimer.unref();
      return;
    }
    const result = await this.runs.update(
      { status: In([...ACTIVE_SOLVE_RUN_STATUSES]) },
      { status: 'failed', errorMessage: RESTARTED_MESSAGE, finishedAt: new Date() },
    );
    if (result.affected)
      this.logger.warn(`${result.affected} solve run(s) left by a previous process marked failed`);
  }

  async onModuleDestroy(): Promise<void> {
    this.stopping = true;
    if (this.queue) {
      if (this.sweepTimer) clearInterval(this.sweepTimer);
      // Nobody else can save these runs' rosters: stop their solves and fail them, as a restart would.
      for (const id of [...this.owned.keys()]) {
        this.owned.delete(id);
        this.queue.disown(id);
        await this.queue.discard(id).catch(() => undefined);
        await this.fail(id, STOPPED_MESSAGE);
        await this.emitEnd(id).catch(() => undefined);
      }
      await this.queue.close();
      return;
    }
    const queued = this.waiting.splice(0);
    for (const id of queued) await this.fail(id, STOPPED_MESSAGE);
    const running = [...this.active.values()].map((a) => a.done);
    // The pool's close() can throw while a worker is still starting (roster-model bug reported); the
    // solves are failed before that point, so shutting down goes on.
    await this.pool
      ?.close()
      .catch((err: unknown) => this.logger.error(`Closing the solver pool: ${String(err)}`));
    await Promise.allSettled(running);
  }

  /** The period's queued or running solve, if any, read in `em`'s transaction when given. */
  activeOf(periodId: string, em: EntityManager = this.dataSource.manager): Promise<SolveRunEntity | null> {
    return em.findOneBy(SolveRunEntity, {
      rosterPeriodId: periodId,
      status: In([...ACTIVE_SOLVE_RUN_STATUSES]),
    });
  }

  async start(
    user: AuthUser,
    periodId: string,
    body: StartSolveRunDto,
    mode?: SolveRunMode,
  ): Promise<SolveRunStartedDto> {
    const period = await this.periods.get(user, periodId);
    if (!mode && period.status !== 'draft') {
      throw new ConflictException(`Only a draft period can be generated; this one is ${period.status}`);
    }
    if (mode && !mode.periodStatuses.includes(period.status)) {
      throw new ConflictException(
        `Only a ${mode.periodStatuses.join(' or ')} period can be solved this way; this one is ${period.status}`,
      );
    }
    const run = await this.dataSource.transaction(async (em) => {
      const current = await this.activeOf(periodId, em);
      if (current) {
        throw new ConflictException(
          `A solve run is already ${current.status} for this period (${current.id}); wait for it or cancel it`,
        );
      }
      return em.save(
        em.create(SolveRunEntity, {
          rosterPeriodId: periodId,
          status: 'queued',
          mode: mode ? (mode.name ?? 'repair') : 'generate',
          requestedById: user.id,
          timeLimitSeconds: body.timeLimitSeconds,
          // Only the weights given (DTO instances carry undefined class fields).
          weights: Object.fromEntries(Object.entries(body.weights ?? {}).filter(([, v]) => v !== undefined)),
          progress: null,
          result: null,
          errorMessage: null,
          startedAt: null,
          finishedAt: null,
        }),
      );
    });
    if (mode) this.modes.set(run.id, mode);
    if (this.queue) {
      await this.enqueue(run, mode);
      return { id: run.id };
    }
    this.waiting.push(run.id);
    this.pump();
    return { id: run.id };
  }

  /** A page of the period's runs, newest first, without their results (GET one run for that). */
  async list(
    user: AuthUser,
    periodId: string,
    query: { page: number; pageSize: number },
  ): Promise<Page<SolveRunSummaryDto>> {
    await this.periods.get(user, periodId);
    // On SQLite createdAt has whole seconds: runs of the same second come in the order they were
    // inserted (rowid). PostgreSQL keeps microseconds and has no rowid.
    const tieBreak = isPostgres(this.runs.manager.connection) ? 'run.id' : 'run.rowid';
    const [rows, total] = await this.runs
      .createQueryBuilder('run')
      .select(SUMMARY_COLUMNS.map((c) => `run.${c}`))
      .where('run.rosterPeriodId = :periodId', { periodId })
      .orderBy('run.createdAt', 'DESC')
      .addOrderBy(tieBreak, 'DESC')
      .offset((query.page - 1) * query.pageSize)
      .limit(query.pageSize)
      .getManyAndCount();
    return { items: rows.map(toSolveRunSummaryDto), total, page: query.page, pageSize: query.pageSize };
  }

  async get(user: AuthUser, id: string): Promise<SolveRunDto> {
    return toSolveRunDto(await this.load(user, id));
  }

  /** Stops a run: a queued one at once; a running one keeps the best roster found so far. */
  async cancel(user: AuthUser, id: string): Promise<SolveRunDto> {
    const run = await this.load(user, id);
    if (!(ACTIVE_SOLVE_RUN_STATUSES as readonly string[]).includes(run.status)) {
      throw new ConflictException(`The run has already ended (${run.status})`);
    }
    if (this.queue) {
      if ((await this.queue.cancel(id)) === 'removed') {
        await this.runs.update(
          { id, status: 'queued' },
          { status: 'cancelled', finishedAt: new Date(), errorMessage: null },
        );
        await this.emitEnd(id);
      } else {
        // The worker stops and keeps its roster; the owning instance saves it and ends the run.
        await this.waitForEnd(id, (run.timeLimitSeconds + 120) * 1000);
      }
      return toSolveRunDto(await this.runs.findOneByOrFail({ id }));
    }
    const index = this.waiting.indexOf(id);
    if (index >= 0) {
      this.waiting.splice(index, 1);
      this.modes.delete(id);
      await this.runs.update(
        { id, status: 'queued' },
        { status: 'cancelled', finishedAt: new Date(), errorMessage: null },
      );
      await this.emitEnd(id);
    } else {
      const active = this.active.get(id);
      if (active) {
        active.cancel.abort();
        await active.done;
      }
    }
    return toSolveRunDto(await this.runs.findOneByOrFail({ id }));
  }

  /**
   * Ends a running solve at once by terminating its worker thread (no roster is kept); the run
   * fails with the solver's message. For operations and for testing crash handling.
   */
  async stopAtOnce(id: string): Promise<void> {
    if (this.queue) {
      const run = await this.runs.findOneBy({ id });
      if (!run || isSolveRunEnded(run.status)) return;
      await this.queue.kill(id);
      await this.waitForEnd(id, (run.timeLimitSeconds + 120) * 1000);
      return;
    }
    const active = this.active.get(id);
    if (!active) return;
    active.kill.abort();
    await active.done;
  }

  /** Where solves run and how busy it is, for the health check. */
  async queueHealth(): Promise<QueueHealthDto> {
    if (this.queue) {
      const h = await this.queue.health();
      return {
        kind: 'redis',
        state: h.state,
        waiting: h.waiting,
        active: h.active,
        workers: h.solverWorkers,
      };
    }
    return {
      kind: 'in-process',
      state: 'up',
      waiting: this.waiting.length,
      active: this.active.size,
      workers: this.pool?.size ?? availableParallelism(),
    };
  }

  /** Listen to a run's events; returns the function that stops listening. */
  subscribe(id: string, listener: (event: SolveRunEvent) => void): () => void {
    this.events.on(id, listener);
    return () => this.events.off(id, listener);
  }

  /** Loads a run the caller may see (through its period's unit). */
  private async load(user: AuthUser, id: string): Promise<SolveRunEntity> {
    const run = await this.runs.findOneBy({ id });
    if (!run) throw new NotFoundException('Solve run not found');
    await this.periods.get(user, run.rosterPeriodId);
    return run;
  }

  private solverPool(): SolverPool {
    if (!this.pool) this.pool = new SolverPool();
    return this.pool;
  }

  /** Starts waiting runs while the pool has a free worker. */
  private pump(): void {
    if (this.stopping) return;
    const capacity = this.solverPool().size;
    while (this.active.size < capacity && this.waiting.length > 0) {
      const id = this.waiting.shift() as string;
      const entry: ActiveRun = {
        cancel: new AbortController(),
        kill: new AbortController(),
        done: Promise.resolve(),
      };
      this.active.set(id, entry);
      entry.done = this.execute(id, entry).finally(() => {
        this.active.delete(id);
        this.modes.delete(id);
        this.pump();
      });
    }
  }

  private async execute(id: string, entry: ActiveRun): Promise<void> {
    let progressWrite: Promise<unknown> = Promise.resolve();
    try {
      const run = await this.runs.findOneBy({ id });
      if (!run || run.status !== 'queued') return;
      const input = await this.input.load(run.rosterPeriodId, run.weights);
      if (run.mode !== 'generate') await this.modeOf(run).prepare(input);
      const startedAt = new Date();
      await this.runs.update({ id }, { status: 'running', startedAt });
      this.emit(id, 'status', toSolveRunDto({ ...run, status: 'running', startedAt }));
      let lastWrite = 0;
      const result = await this.solverPool().solveRoster(input.problem, {
        timeLimitSeconds: run.timeLimitSeconds,
        // A core nobody else needs helps this solve, and is given back as soon as another run waits.
        spareCores: true,
        signal: entry.cancel.signal,
        killSignal: entry.kill.signal,
        onProgress: (p) => {
          const progress: SolveProgressDto = {
            elapsedSeconds: p.elapsedSeconds,
            objective: p.objective,
            bound: p.bound,
            gap: p.gap,
          };
          this.emit(id, 'progress', progress);
          const now = Date.now();
          if (now - lastWrite >= PROGRESS_WRITE_MS) {
            lastWrite = now;
            progressWrite = progressWrite
              .then(() => this.runs.update({ id, status: 'running' }, { progress }))
              .catch(() => undefined);
          }
        },
      });
      await progressWrite;
      await this.finish(id, input, result, entry.cancel.signal.aborted);
    } catch (err) {
      await progressWrite;
      const message = err instanceof Error ? err.message : String(err);
      this.logger.warn(`Solve run ${id} failed: ${message}`);
      await this.fail(id, this.stopping ? STOPPED_MESSAGE : `The solve failed: ${message}`);
    } finally {
      await this.emitEnd(id);
    }
  }

  /** Saves the roster (replacing unpinned cells) and the run's outcome in one transaction. */
  private async finish(
    id: string,
    input: RosterInput,
    result: PoolSolveResult,
    cancelled: boolean,
  ): Promise<void> {
    const summary = summaryOf(input, result);
    const progress: SolveProgressDto = {
      elapsedSeconds: result.seconds,
      objective: result.objective,
      bound: result.bound,
      gap: result.gap,
    };
    const finishedAt = new Date();
    await this.dataSource.transaction(async (em) => {
      const base = { progress, result: summary, finishedAt };
      if (!result.roster) {
        await em.update(
          SolveRunEntity,
          { id },
          cancelled
            ? { ...base, status: 'cancelled', errorMessage: null }
            : { ...base, status: 'failed', errorMessage: `No roster was found: ${result.quality}` },
        );
        return;
      }
      const run = await em.findOneByOrFail(SolveRunEntity, { id });
      if (run.mode !== 'generate') {
        await this.modeOf(run).save(em, input, result.roster, run);
        await em.update(
          SolveRunEntity,
          { id },
          { ...base, status: cancelled ? 'cancelled' : 'finished', errorMessage: null },
        );
        return;
      }
      const period = await this.periods.byId(input.period.id, em);
      if (!period || period.status !== 'draft') {
        await em.update(
          SolveRunEntity,
          { id },
          {
            ...base,
            status: 'failed',
            errorMessage: `The period was ${period ? period.status : 'deleted'} during the solve, so the roster was not saved.`,
          },
        );
        return;
      }
      await saveSolvedRoster(em, this.writer, input, result.roster, {
        kind: 'generate',
        actorUserId: run.requestedById,
      });
      await em.update(
        SolveRunEntity,
        { id },
        { ...base, status: cancelled ? 'cancelled' : 'finished', errorMessage: null },
      );
    });
  }

  private async fail(id: string, message: string): Promise<void> {
    try {
      await this.runs.update(
        { id, status: In([...ACTIVE_SOLVE_RUN_STATUSES]) },
        { status: 'failed', errorMessage: message, finishedAt: new Date() },
      );
    } catch (err) {
      // The database is gone (shutting down): the next start marks the run failed.
      this.logger.error(`Could not mark solve run ${id} failed: ${String(err)}`);
    }
  }

  /** The behaviour of a run's stored mode (held by this process since the run started). */
  private modeOf(run: SolveRunEntity): SolveRunMode {
    const mode = this.modes.get(run.id);
    if (!mode) throw new Error(`the ${run.mode} run was started by an earlier server process`);
    return mode;
  }

  private emit(id: string, event: SolveRunEventName, data: unknown): void {
    // With Redis every instance's listeners get it, this one's through the channel too.
    if (this.queue) {
      this.queue.publish({ runId: id, event, data }).catch((err: unknown) => {
        this.logger.warn(`Publishing a ${event} event of run ${id}: ${String(err)}`);
      });
      return;
    }
    this.events.emit(id, { event, data } satisfies SolveRunEvent);
  }

  private async emitEnd(id: string): Promise<void> {
    if (!this.queue && this.events.listenerCount(id) === 0) return;
    const run = await this.runs.findOneBy({ id }).catch(() => null);
    if (run) this.emit(id, 'end', toSolveRunDto(run));
  }

  /** REDIS_URL: load the input (and prepare the mode) here, queue the problem for a solver worker. */
  private async enqueue(run: SolveRunEntity, mode: SolveRunMode | undefined): Promise<void> {
    const queue = this.queue as SolveQueue;
    try {
      const input = await this.input.load(run.rosterPeriodId, run.weights);
      if (mode) await mode.prepare(input);
      this.owned.set(run.id, { input, lastWrite: 0, progressWrite: Promise.resolve() });
      await queue.enqueue(run.id, input.problem, run.timeLimitSeconds);
    } catch (err) {
      this.owned.delete(run.id);
      this.modes.delete(run.id);
      queue.disown(run.id);
      const message = err instanceof Error ? err.message : String(err);
      this.logger.warn(`Solve run ${run.id} could not be queued: ${message}`);
      await this.fail(run.id, `The solve failed: ${message}`);
      await this.emitEnd(run.id);
    }
  }

  /** An event from the Redis channel: forward it to this instance's listeners; owners record it. */
  private async onQueueEvent(message: SolveEventMessage): Promise<void> {
    const { runId: id, event, data } = message;
    if (event !== 'started') this.events.emit(id, { event, data } satisfies SolveRunEvent);
    const own = this.owned.get(id);
    if (!own) return;
    if (event === 'started') {
      const startedAt = new Date((data as { startedAt?: number })?.startedAt ?? Date.now());
      const result = await this.runs.update({ id, status: 'queued' }, { status: 'running', startedAt });
      if (result.affected) {
        const run = await this.runs.findOneBy({ id });
        if (run) this.emit(id, 'status', toSolveRunDto(run));
      }
    } else if (event === 'progress') {
      const now = Date.now();
      if (now - own.lastWrite < PROGRESS_WRITE_MS) return;
      own.lastWrite = now;
      const progress = data as SolveProgressDto;
      own.progressWrite = own.progressWrite
        .then(() => this.runs.update({ id, status: 'running' }, { progress }))
        .catch(() => undefined);
    }
  }

  /** The owner saves the outcome of its queued job, as `execute` does for the in-process pool. */
  private async onJobEnded(id: string, outcome: SolveJobOutcome): Promise<void> {
    const own = this.owned.get(id);
    if (!own) return;
    this.owned.delete(id);
    try {
      await own.progressWrite;
      if (outcome.kind === 'completed') {
        const { result, cancelled } = outcome.value;
        if (result) await this.finish(id, own.input, result, cancelled);
        else
          await this.runs.update(
            { id, status: In([...ACTIVE_SOLVE_RUN_STATUSES]) },
            { status: 'cancelled', finishedAt: new Date(), errorMessage: null },
          );
      } else if (outcome.kind === 'failed') {
        this.logger.warn(`Solve run ${id} failed: ${outcome.message}`);
        await this.fail(
          id,
          /stalled/i.test(outcome.message) ? WORKER_LOST_MESSAGE : `The solve failed: ${outcome.message}`,
        );
      } else {
        // Removed from the queue by a cancel before a worker took it.
        await this.runs.update(
          { id, status: In([...ACTIVE_SOLVE_RUN_STATUSES]) },
          { status: 'cancelled', finishedAt: new Date(), errorMessage: null },
        );
      }
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      this.logger.warn(`Solve run ${id} failed: ${message}`);
      await this.fail(id, `The solve failed: ${message}`);
    } finally {
      this.modes.delete(id);
      await this.emitEnd(id);
    }
  }

  /**
   * Runs whose owning API instance is gone can never be saved: stop their jobs and fail them, as
   * the start-up of a single process does. Every instance sweeps; the updates are conditional.
   * The owners are read from their small keys in one go; a job is fetched only for a run without
   * an owner key (queued by an earlier version, or its owner gone long enough for the key to expire).
   */
  private async sweepOrphans(): Promise<void> {
    const queue = this.queue as SolveQueue;
    try {
      const active = await this.runs.find({
        select: { id: true, createdAt: true },
        where: { status: In([...ACTIVE_SOLVE_RUN_STATUSES]) },
      });
      const others = active.filter((run) => !this.owned.has(run.id));
      const owners = await queue.owners(others.map((run) => run.id));
      for (const run of others) {
        if (this.owned.has(run.id) || this.stopping) continue;
        const owner = owners.get(run.id);
        if (owner === 'alive') continue;
        let queued = true;
        if (owner !== 'gone') {
          if (Date.now() - run.createdAt.getTime() < UNQUEUED_GRACE_MS) continue;
          const info = await queue.ownerAlive(run.id);
          if (info?.alive) continue;
          queued = info !== null;
        }
        if (queued) await queue.discard(run.id);
        await this.fail(run.id, RESTARTED_MESSAGE);
        await this.emitEnd(run.id);
        this.logger.warn(`Solve run ${run.id} failed: the API instance that started it is gone`);
      }
    } catch (err) {
      this.logger.warn(`Looking for orphaned solve runs: ${String(err)}`);
    }
  }

  /** Resolves once the run has ended (its end event here, or its row says so), or after `timeoutMs`. */
  private waitForEnd(id: string, timeoutMs: number): Promise<void> {
    return new Promise((resolve) => {
      let done = false;
      const stop = (): void => {
        if (done) return;
        done = true;
        unsubscribe();
        clearInterval(poll);
        clearTimeout(timeout);
        resolve();
      };
      const unsubscribe = this.subscribe(id, (e) => e.event === 'end' && stop());
      const poll = setInterval(() => {
        this.runs
          .findOneBy({ id })
          .then((r) => (!r || isSolveRunEnded(r.status)) && stop())
          .catch(() => undefined);
      }, 1000);
      const timeout = setTimeout(stop, timeoutMs);
    });
  }
}

/** The outcome of a solve for the run's record, in the period's dates. */
function summaryOf(input: RosterInput, result: PoolSolveResult): SolveRunResultDto {
  const date = (d: number) => input.dates[d] ?? String(d);
  return {
    solverStatus: result.status,
    objective: result.objective,
    bound: result.bound,
    gap: result.gap,
    quality: result.quality,
    staffing: result.staffing ?? null,
    staffingStatement: result.staffingStatement ?? '',
    explanations: {
      unmetNeeds: result.unmetNeeds.map((u) => ({
        date: date(u.day),
        shiftTypeId: u.shiftTypeId,
        skillId: u.skillId,
        short: u.short,
        reasons: u.reasons,
      })),
      requestsNotHonoured: result.requestsNotHonoured.map((r) => ({
        staffMemberId: r.personId,
        date: date(r.day),
        kind: r.kind,
        reasons: r.reasons,
      })),
      conflicts: result.conflicts,
    },
    terms: result.check ? { ...result.check.terms } : null,
  };
}

/** Every column but the result (lists leave it out). */
const SUMMARY_COLUMNS = [
  'id',
  'rosterPeriodId',
  'status',
  'mode',
  'requestedById',
  'timeLimitSeconds',
  'weights',
  'progress',
  'errorMessage',
  'createdAt',
  'startedAt',
  'finishedAt',
] as const satisfies readonly (keyof SolveRunEntity)[];

export function toSolveRunSummaryDto(r: Omit<SolveRunEntity, 'result'>): SolveRunSummaryDto {
  return {
    id: r.id,
    rosterPeriodId: r.rosterPeriodId,
    status: r.status,
    mode: r.mode,
    requestedById: r.requestedById,
    timeLimitSeconds: r.timeLimitSeconds,
    weights: r.weights,
    progress: r.progress,
    errorMessage: r.errorMessage,
    createdAt: r.createdAt.toISOString(),
    startedAt: r.startedAt ? r.startedAt.toISOString() : null,
    finishedAt: r.finishedAt ? r.finishedAt.toISOString() : null,
  };
}

export function toSolveRunDto(r: SolveRunEntity): SolveRunDto {
  return { ...toSolveRunSummaryDto(r), result: r.result };
}
