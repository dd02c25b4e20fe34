/**
 * A small pool of solver worker threads, sized to the cores, so a solve never blocks the caller's
 * event loop.
 *
 * - Each worker keeps one warm HiGHS session (see solve/highs-session.ts) and runs one task at a time;
 *   further tasks wait in a queue.
 * - Progress flows back as messages. Cancelling sets a flag in shared memory that the solver's
 *   interrupt callback reads, so the solve stops and still returns its best roster. `kill()` (or
 *   `killSignal`) terminates the worker: the only hard stop of a running HiGHS call.
 * - A WebAssembly abort inside a solve fails that solve with a clear error and the worker replaces its
 *   instance; a worker that dies (out of memory, crash, kill) fails its solve and is replaced.
 * - Two independent solves with different random seeds can run on two workers (`portfolio: 2`);
 *   the better roster is kept and the better of the two proven bounds is reported.
 *
 * The worker runs from compiled JavaScript when this file is compiled (dist/…/solve-worker.js), and
 * through tsx's CommonJS hook from the TypeScript sources in tests and development.
 */
import * as os from 'node:os';
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { EncodedModel, ModelData } from 'highs';
import type { Roster, RosterProblem } from '../problem';
import type { SolveProgress } from '../result';
import { qualityStatement } from '../explain/quality';
import { ProblemIndex } from '../model/context';
import { mergedStaffingSafety, staffingStatement } from '../safety/staffing';
import { compiledHighsModule, type WasmModule } from '../solve/highs-session';
import { relativeGap, type MipRunResult } from '../solve/run-mip';
import type { RosterSolveResult, SolveRosterOptions } from '../solve/solve';
import type {
  PoolMessage,
  PortableMipOptions,
  TaskMessage,
  WorkerErrorInfo,
  WorkerInit,
  WorkerMessage,
  WorkerResult,
  WorkerTask,
} from './protocol';

export type SolverErrorKind = 'failed' | 'wasm' | 'crashed' | 'killed' | 'closed';

/** A solve that ended without a result. `kind` says why; the pool stays usable in every case. */
export class SolverError extends Error {
  constructor(
    message: string,
    readonly kind: SolverErrorKind,
  ) {
    super(message);
    this.name = 'SolverError';
  }
}

export interface SolverPoolOptions {
  /** Number of worker threads; default: the number of cores. */
  size?: number;
  /** A worker replaces its HiGHS instance when WebAssembly memory grows beyond this (bytes). */
  memoryLimitBytes?: number;
}

export interface TaskControls {
  onProgress?: (progress: SolveProgress) => void;
  /** Abort to stop the solve and keep the best roster found so far. */
  signal?: AbortSignal;
  /** Abort to end the solve at once by terminating its worker (no roster is returned). */
  killSignal?: AbortSignal;
  /** Every better roster (meeting every hard rule) a roster task finds while it runs. */
  onRoster?: (roster: Roster, objective: number) => void;
  /**
   * The task runs on a spare core: the pool stops it (as a cancel, keeping its roster) as soon as
   * another task waits for a worker.
   */
  yieldable?: boolean;
}

export interface PoolRosterOptions
  extends Omit<SolveRosterOptions, 'onProgress' | 'signal' | 'cancelFlag' | 'session'>, TaskControls {
  /** Independent solves on this many workers with seeds randomSeed, randomSeed+1, …; the best is kept. */
  portfolio?: number;
  /**
   * Strategy of each portfolio member in turn (member i uses entry i mod length), e.g.
   * ['mip', 'mipThenFixAndOptimise'] so one core proves the bound while the other improves rosters.
   * Default: every member uses `strategy`.
   */
  portfolioStrategies?: NonNullable<SolveRosterOptions['strategy']>[];
  /**
   * Options of each portfolio member in turn (member i uses entry i mod length), over the common
   * ones and `portfolioStrategies`.
   */
  portfolioOptions?: PortfolioMemberOptions[];
  /**
   * Use the cores nobody else needs: with a worker free beside this solve's own, a second member
   * runs TWO_CORE_PORTFOLIO's fix-and-optimise beside it, handing rosters both ways, and gives its
   * core back (stopping with its best roster) as soon as another solve waits. Ignored with `portfolio`.
   */
  spareCores?: boolean;
  /**
   * Members hand each other every better roster they find (default true): a member in its
   * fix-and-optimise phase continues from the best roster of all of them.
   */
  shareRosters?: boolean;
}

/**
 * The portfolio for two cores: one member runs the solve as asked (by default 'auto': the MIP, which
 * also proves the bound, then fix-and-optimise on large models), the other runs fix-and-optimise for
 * the whole time, continuing from every better roster the first one finds and handing its own back
 * (without a staffing proof of its own: the first member proves it for both, mergeRosterResults).
 */
export const TWO_CORE_PORTFOLIO: PortfolioMemberOptions[] = [
  {},
  { strategy: 'fixAndOptimise', fixAndOptimiseShare: 1, staffingCheck: false },
];

/** What may differ between the members of a portfolio. */
export type PortfolioMemberOptions = Pick<
  SolveRosterOptions,
  | 'strategy'
  | 'fixAndOptimiseShare'
  | 'fixAndOptimiseSubSeconds'
  | 'highsOptions'
  | 'warmStart'
  | 'staffingCheck'
>;

/** A running task: its result, and switches to stop it gently or at once. */
export interface TaskHandle<T> {
  result: Promise<T>;
  /** Stop the solve and keep its incumbent. */
  cancel(): void;
  /** Terminate the worker running the solve (the pool starts a new one). */
  kill(): void;
  /** Offer a roster of the same problem to the running roster task (it takes it if better). */
  offer(roster: Roster, objective: number): void;
}

interface Job {
  id: number;
  task: WorkerTask;
  cancelFlag: Int32Array;
  cancelBuffer: SharedArrayBuffer;
  onProgress?: (progress: SolveProgress) => void;
  onRoster?: (roster: Roster, objective: number) => void;
  resolve: (result: WorkerResult) => void;
  reject: (err: Error) => void;
  killRequested: boolean;
  settled: boolean;
  slot: Slot | null;
  yieldable: boolean;
}

interface Slot {
  worker: Worker;
  state: 'starting' | 'idle' | 'busy' | 'dead';
  job: Job | null;
}

/** How to start a worker from here: compiled JavaScript, or the TypeScript sources through tsx. */
function startWorker(init: WorkerInit): Worker {
  const compiled = __filename.endsWith('.js');
  if (compiled) return new Worker(path.join(__dirname, 'solve-worker.js'), { workerData: init });
  const source = path.join(__dirname, 'solve-worker.ts');
  const bootstrap = `require('tsx/cjs');\nrequire(${JSON.stringify(source)});\n`;
  return new Worker(bootstrap, { eval: true, workerData: init });
}

function toError(info: WorkerErrorInfo): SolverError {
  return new SolverError(info.message, info.wasmFailure ? 'wasm' : 'failed');
}

export class SolverPool {
  readonly size: number;
  private readonly slots: Slot[] = [];
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;
  private wasmModule: Promise<WasmModule | undefined> | null = null;
  /** Workers that died before they were ready, in a row; a broken installation must not respawn forever. */
  private startFailures = 0;
  private lastStartError = '';

  constructor(private readonly options: SolverPoolOptions = {}) {
    this.size = Math.max(1, Math.floor(options.size ?? os.availableParallelism()));
  }

  /** Workers alive or starting (for tests and health checks). */
  get workerCount(): number {
    return this.slots.length;
  }

  /** Workers this pool could give a new task now: idle, or not yet started, less what waits. */
  freeWorkers(): number {
    const busy = this.slots.filter((s) => s.state === 'busy').length;
    return Math.max(0, this.size - busy - this.queue.length);
  }

  /** Solves waiting for a free worker. */
  get queued(): number {
    return this.queue.length;
  }

  /** Start a task; see `solveRoster` and `solveMip` for the usual entry points. */
  start(task: WorkerTask, controls: TaskControls = {}): TaskHandle<WorkerResult> {
    const cancelBuffer = new SharedArrayBuffer(4);
    let job!: Job;
    const result = new Promise<WorkerResult>((resolve, reject) => {
      job = {
        id: this.nextId++,
        task,
        cancelBuffer,
        cancelFlag: new Int32Array(cancelBuffer),
        onProgress: controls.onProgress,
        onRoster: controls.onRoster,
        resolve,
        reject,
        killRequested: false,
        settled: false,
        slot: null,
        yieldable: Boolean(controls.yieldable),
      };
    });
    const cancel = (): void => {
      Atomics.store(job.cancelFlag, 0, 1);
    };
    const kill = (): void => {
      if (job.settled) return;
      job.killRequested = true;
      if (job.slot) void job.slot.worker.terminate();
      else this.settle(job, new SolverError('The solve was stopped before it started.', 'killed'));
    };
    const offer = (roster: Roster, objective: number): void => {
      if (job.settled || !job.slot || job.slot.job !== job) return;
      const message: PoolMessage = { type: 'roster', id: job.id, roster, objective };
      job.slot.worker.postMessage(message);
    };
    if (controls.signal?.aborted) cancel();
    controls.signal?.addEventListener('abort', cancel, { once: true });
    controls.killSignal?.addEventListener('abort', kill, { once: true });
    if (controls.killSignal?.aborted) kill();
    if (this.closed) this.settle(job, new SolverError('The solver pool is closed.', 'closed'));
    else if (!job.settled) {
      this.queue.push(job);
      this.pump();
    }
    return { result, cancel, kill, offer };
  }

  /** Solve a plain model (arrays or LP/MPS text) in a worker. */
  solveMip(
    model: ModelData | EncodedModel,
    options: PortableMipOptions & TaskControls = {},
  ): Promise<MipRunResult> {
    const { onProgress, signal, killSignal, ...rest } = options;
    const handle = this.start({ kind: 'mip', model, options: rest }, { onProgress, signal, killSignal });
    return handle.result as Promise<MipRunResult>;
  }

  /** Solve a roster problem in a worker (or several, with `portfolio`). */
  async solveRoster(problem: RosterProblem, options: PoolRosterOptions = {}): Promise<RosterSolveResult> {
    const {
      onProgress,
      signal,
      killSignal,
      onRoster,
      portfolio,
      portfolioStrategies,
      portfolioOptions,
      shareRosters = true,
      spareCores = false,
      ...rest
    } = options;
    const spare = portfolio === undefined && spareCores && this.freeWorkers() >= 2;
    const count = spare ? 2 : Math.max(1, Math.floor(portfolio ?? 1));
    const memberOptions = spare ? [{}, TWO_CORE_PORTFOLIO[1]] : portfolioOptions;
    const baseSeed = rest.randomSeed ?? 0;
    const latest: (SolveProgress | null)[] = new Array<SolveProgress | null>(count).fill(null);
    let lastEmit = -Infinity;
    const emitMerged = (i: number, progress: SolveProgress): void => {
      latest[i] = progress;
      if (!onProgress) return;
      if (count === 1) return onProgress(progress);
      const now = performance.now();
      if (now - lastEmit < 250) return;
      lastEmit = now;
      onProgress(mergeProgress(latest));
    };
    // The best roster any member has found so far, handed to the others.
    let shared = Infinity;
    const share = (from: number, roster: Roster, objective: number): void => {
      onRoster?.(roster, objective);
      if (!shareRosters || count === 1 || objective >= shared - 1e-9) return;
      shared = objective;
      handles.forEach((h, j) => {
        if (j !== from) h.offer(roster, objective);
      });
    };
    const handles: TaskHandle<WorkerResult>[] = Array.from({ length: count }, (_, i) =>
      this.start(
        {
          kind: 'roster',
          problem,
          shareRosters: Boolean(onRoster) || (shareRosters && count > 1),
          options: {
            ...rest,
            randomSeed: baseSeed + i,
            ...(portfolioStrategies?.length
              ? { strategy: portfolioStrategies[i % portfolioStrategies.length] }
              : {}),
            ...(memberOptions?.length ? memberOptions[i % memberOptions.length] : {}),
          },
        },
        {
          onProgress: (p) => emitMerged(i, p),
          onRoster: (roster, objective) => share(i, roster, objective),
          signal,
          killSignal,
          yieldable: spare && i > 0,
        },
      ),
    );
    if (count === 1) return (await handles[0].result) as RosterSolveResult;
    // When one solve proves optimality (or infeasibility), the others have nothing left to find.
    const settled = await Promise.allSettled(
      handles.map((h) =>
        h.result.then((r) => {
          const status = (r as RosterSolveResult).status;
          if (status === 'optimal' || status === 'infeasible') handles.forEach((other) => other.cancel());
          return r as RosterSolveResult;
        }),
      ),
    );
    const results = settled.flatMap((s) => (s.status === 'fulfilled' ? [s.value] : []));
    if (results.length === 0) throw (settled[0] as PromiseRejectedResult).reason;
    return mergeRosterResults(results, problem);
  }

  /** Stop every worker; queued and running solves fail with kind 'closed'. */
  async close(): Promise<void> {
    this.closed = true;
    for (const job of this.queue.splice(0))
      this.settle(job, new SolverError('The solver pool is closed.', 'closed'));
    await Promise.all(
      this.slots.map(async (slot) => {
        if (slot.job)
          this.settle(slot.job, new SolverError('The solver pool was closed during the solve.', 'closed'));
        slot.state = 'dead';
        // A slot still loading the wasm module has no worker yet; spawn() drops it once it sees `closed`.
        if (slot.worker) await slot.worker.terminate();
      }),
    );
    this.slots.length = 0;
  }

  private settle(job: Job, outcome: WorkerResult | Error): void {
    if (job.settled) return;
    job.settled = true;
    if (outcome instanceof Error) job.reject(outcome);
    else job.resolve(outcome);
  }

  private pump(): void {
    if (this.closed) return;
    // Drop jobs killed while waiting.
    for (let i = this.queue.length - 1; i >= 0; i--) if (this.queue[i].settled) this.queue.splice(i, 1);
    for (const slot of this.slots) {
      if (this.queue.length === 0) return;
      if (slot.state === 'idle') this.dispatch(slot, this.queue.shift() as Job);
    }
    // Solves still waiting take the cores lent to other solves (stopped gently: their rosters count).
    let waiting = this.queue.length - this.slots.filter((s) => s.state === 'starting').length;
    for (const slot of this.slots) {
      if (waiting <= 0 || this.slots.length < this.size) break;
      const job = slot.job;
      if (slot.state !== 'busy' || !job?.yieldable || Atomics.load(job.cancelFlag, 0) === 1) continue;
      Atomics.store(job.cancelFlag, 0, 1);
      waiting--;
    }
    const starting = this.slots.filter((s) => s.state === 'starting').length;
    if (this.queue.length > starting && this.slots.length < this.size) void this.spawn();
  }

  private dispatch(slot: Slot, job: Job): void {
    slot.state = 'busy';
    slot.job = job;
    job.slot = slot;
    slot.worker.ref();
    const message: TaskMessage = { type: 'task', id: job.id, task: job.task, cancelBuffer: job.cancelBuffer };
    slot.worker.postMessage(message);
  }

  private async spawn(): Promise<void> {
    const placeholder: Slot = { worker: null as unknown as Worker, state: 'starting', job: null };
    this.slots.push(placeholder);
    let wasmModule: WasmModule | undefined;
    try {
      if (!this.wasmModule) this.wasmModule = compiledHighsModule().catch(() => undefined);
      wasmModule = await this.wasmModule;
    } catch {
      wasmModule = undefined;
    }
    if (this.closed) {
      this.slots.splice(this.slots.indexOf(placeholder), 1);
      return;
    }
    const worker = startWorker({ wasmModule, memoryLimitBytes: this.options.memoryLimitBytes });
    placeholder.worker = worker;
    const slot = placeholder;
    worker.on('message', (message: WorkerMessage) => this.onMessage(slot, message));
    worker.on('error', (err) => {
      this.lastStartError = err.message;
      if (slot.job)
        this.settle(slot.job, new SolverError(`The solver worker crashed: ${err.message}`, 'crashed'));
    });
    worker.on('exit', (code) => this.onExit(slot, code));
  }

  private onMessage(slot: Slot, message: WorkerMessage): void {
    switch (message.type) {
      case 'ready':
        this.startFailures = 0;
        slot.state = 'idle';
        slot.worker.unref();
        this.pump();
        return;
      case 'startFailed': {
        // Fail one waiting job so the error is seen, then drop the worker (no endless restarts).
        const job = this.queue.shift();
        if (job)
          this.settle(job, new SolverError(`The solver could not start: ${message.error.message}`, 'failed'));
        slot.state = 'dead';
        void slot.worker.terminate();
        return;
      }
      case 'progress':
        if (slot.job && slot.job.id === message.id && !slot.job.settled)
          slot.job.onProgress?.(message.progress);
        return;
      case 'roster':
        if (slot.job && slot.job.id === message.id && !slot.job.settled)
          slot.job.onRoster?.(message.roster, message.objective);
        return;
      case 'done':
      case 'failed': {
        const job = slot.job;
        slot.job = null;
        slot.state = 'idle';
        slot.worker.unref();
        if (job && job.id === message.id) {
          this.settle(job, message.type === 'done' ? message.result : toError(message.error));
        }
        this.pump();
        return;
      }
    }
  }

  private onExit(slot: Slot, code: number): void {
    const index = this.slots.indexOf(slot);
    if (index >= 0) this.slots.splice(index, 1);
    if (slot.state === 'starting' && !this.closed) {
      this.startFailures += 1;
      if (this.startFailures >= 3) {
        this.startFailures = 0;
        const reason = this.lastStartError || `exit code ${code}`;
        for (const job of this.queue.splice(0)) {
          this.settle(job, new SolverError(`The solver workers cannot start (${reason}).`, 'failed'));
        }
      }
    }
    slot.state = 'dead';
    const job = slot.job;
    slot.job = null;
    if (job) {
      const error = job.killRequested
        ? new SolverError('The solve was stopped at once; no roster was kept.', 'killed')
        : new SolverError(
            `The solver worker stopped unexpectedly (exit code ${code}), for example out of memory; the solve was lost and a new worker was started.`,
            'crashed',
          );
      this.settle(job, error);
    }
    this.pump();
  }
}

/** Combine the latest progress of several independent solves: best roster, best bound. */
function mergeProgress(latest: (SolveProgress | null)[]): SolveProgress {
  const known = latest.filter((p): p is SolveProgress => p !== null);
  const objectives = known.map((p) => p.objective).filter((v): v is number => v !== null);
  const bounds = known.map((p) => p.bound).filter((v): v is number => v !== null);
  const objective = objectives.length ? Math.min(...objectives) : null;
  const bound = bounds.length ? Math.max(...bounds) : null;
  return {
    elapsedSeconds: Math.max(0, ...known.map((p) => p.elapsedSeconds)),
    objective,
    bound,
    gap: relativeGap(objective, bound),
  };
}

/**
 * Keep the best of several independent solves of the same problem. Each proven lower bound holds for
 * the same model, so the largest one is reported with the best roster.
 */
export function mergeRosterResults(results: RosterSolveResult[], problem?: RosterProblem): RosterSolveResult {
  const infeasible = results.find((r) => r.status === 'infeasible');
  if (infeasible) return infeasible;
  const withRoster = results.filter((r) => r.objective !== null);
  const best = withRoster.length
    ? withRoster.reduce((a, b) => ((b.objective as number) < (a.objective as number) ? b : a))
    : results[0];
  const bounds = results.map((r) => r.bound).filter((b): b is number => b !== null);
  const bound = bounds.length ? Math.max(...bounds) : null;
  const anyOptimal = results.some((r) => r.status === 'optimal');
  // The first member runs the solve as asked, so its status says how the run ended (a member on a
  // spare core may have been stopped early to give its core back).
  const status = anyOptimal && best.objective !== null ? 'optimal' : results[0].status;
  // Staffing of the roster shown, with the fewest possible as proved by any member (the first
  // member proves it; the others leave their time to the search).
  const proofs = results.map((r) => r.staffing);
  const staffing =
    problem && best.roster && proofs.some((s) => s)
      ? mergedStaffingSafety(new ProblemIndex(problem), best.roster, proofs)
      : best.staffing;
  return {
    ...best,
    ...(staffing ? { staffing, staffingStatement: staffingStatement(staffing) } : {}),
    status,
    bound,
    gap: relativeGap(best.objective, bound),
    seconds: Math.max(...results.map((r) => r.seconds)),
    quality: qualityStatement({ status, objective: best.objective, bound }),
  };
}

let shared: SolverPool | null = null;

/**
 * One pool for the whole process, sized to the cores, created on first use. Idle workers do not
 * keep the process alive, so command-line tools can use it and still exit.
 */
export function sharedSolverPool(): SolverPool {
  if (!shared) shared = new SolverPool();
  return shared;
}
