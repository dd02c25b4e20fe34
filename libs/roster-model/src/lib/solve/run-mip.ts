/**
 * Run one model through HiGHS with a time limit, a gap target, a cancel switch and throttled
 * progress events, and report what came out in plain numbers.
 *
 * Used by `solveRoster` (the product path) and exposed as `solveMip` for plain models
 * (textbook examples, LP relaxations).
 */
import type { CallbackEventFor, EncodedModel, Model, ModelData, OptionValue } from 'highs';
import type { HighsModelArrays } from '../model/builder';
import type { SolveProgress, SolveStatus } from '../result';
import { HighsSession } from './highs-session';

/** HiGHS model status codes (`highs.constants.modelStatus`), repeated here for readable switches. */
export const MODEL_STATUS = {
  notSet: 0,
  loadError: 1,
  modelError: 2,
  presolveError: 3,
  solveError: 4,
  postsolveError: 5,
  empty: 6,
  optimal: 7,
  infeasible: 8,
  unboundedOrInfeasible: 9,
  unbounded: 10,
  objectiveBound: 11,
  objectiveTarget: 12,
  timeLimit: 13,
  iterationLimit: 14,
  unknown: 15,
  solutionLimit: 16,
  interrupted: 17,
} as const;

const MODEL_STATUS_TEXT: Record<number, string> = Object.fromEntries(
  Object.entries(MODEL_STATUS).map(([name, code]) => [code, name]),
);

export interface MipRunOptions {
  /** Wall-clock limit in seconds for the whole call (measured from `clockStart`). */
  timeLimitSeconds?: number;
  /** Stop when the relative gap between incumbent and bound is at most this (HiGHS default 1e-4). */
  mipRelGap?: number;
  /** HiGHS `random_seed`; independent solves on both cores use different seeds. */
  randomSeed?: number;
  /** Further HiGHS options by their snake_case names. `threads` is never allowed. */
  highsOptions?: Record<string, OptionValue>;
  /** Receives progress at most every `progressIntervalMs` (default 250 ms, i.e. 4 a second). */
  onProgress?: (progress: SolveProgress) => void;
  progressIntervalMs?: number;
  /** performance.now() of the caller's last progress event (the first event here keeps the interval). */
  lastProgressAt?: number;
  /** Abort to stop the solve and keep the best roster found so far. */
  signal?: AbortSignal;
  /**
   * Cancel switch shared with another thread: element 0 set to 1 stops the solve. A worker blocked
   * inside HiGHS cannot receive messages, but it can read shared memory from the solver callback.
   */
  cancelFlag?: Int32Array;
  /** A full column vector to start from (a MIP start via setSolution). */
  startValues?: ArrayLike<number>;
  /** Solve the LP relaxation (integrality dropped). */
  relaxIntegrality?: boolean;
  /** `performance.now()` at which the caller's clock started (so elapsed time includes model building). */
  clockStart?: number;
  /** Every new incumbent's full column vector and objective, as HiGHS finds it. */
  onSolution?: (values: Float64Array, objective: number) => void;
  /**
   * Asked while the MIP runs: stop now (reported as 'timeLimit', a planned end). `rootDone` is true
   * once the root LP has moved the bound or branching has begun (the bound is then worth stating).
   */
  stopWhen?: (state: { elapsedSeconds: number; rootDone: boolean }) => boolean;
}

export interface MipRunResult {
  status: SolveStatus;
  /** HiGHS model status code and its name. */
  modelStatus: number;
  modelStatusText: string;
  /** Objective of the returned solution, or null when there is none. */
  objective: number | null;
  /** Proven bound on the best possible objective (lower bound when minimising), null when unknown. */
  bound: number | null;
  /** Relative gap |objective - bound| / |objective|, null when unknown. */
  gap: number | null;
  /** Column values of the returned solution, or null when HiGHS has no feasible one. */
  values: Float64Array | null;
  /** Seconds since `clockStart`. */
  seconds: number;
  /** Seconds since `clockStart` until the returned objective was first reached. */
  secondsToBest: number | null;
  /** Branch-and-bound nodes (converted from HiGHS's bigint). */
  nodes: number;
  /** Every improving objective with the time it was found. */
  improvements: { objective: number; seconds: number }[];
  /**
   * The bound moved after the first one HiGHS stated, or branching began (as `stopWhen` sees it):
   * false when HiGHS stopped before its root LP, whose bound may then be a trivial finite one.
   */
  rootDone: boolean;
}

/** Relative gap as HiGHS reports it, or null when it cannot be stated. */
export function relativeGap(objective: number | null, bound: number | null): number | null {
  if (objective === null || bound === null || !Number.isFinite(objective) || !Number.isFinite(bound))
    return null;
  const diff = Math.abs(objective - bound);
  if (diff <= 1e-9 * Math.max(1, Math.abs(objective))) return 0;
  if (Math.abs(objective) < 1e-12) return null;
  return diff / Math.abs(objective);
}

function finiteOrNull(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

function infoNumber(model: Model, name: string): number | null {
  try {
    const value = model.info.get(name);
    return typeof value === 'bigint' ? Number(value) : finiteOrNull(value);
  } catch {
    return null;
  }
}

export function isCancelled(options: Pick<MipRunOptions, 'signal' | 'cancelFlag'>): boolean {
  return (
    Boolean(options.signal?.aborted) ||
    (options.cancelFlag ? Atomics.load(options.cancelFlag, 0) === 1 : false)
  );
}

function statusOf(modelStatus: number, hasSolution: boolean): SolveStatus {
  switch (modelStatus) {
    case MODEL_STATUS.optimal:
      return 'optimal';
    case MODEL_STATUS.infeasible:
    case MODEL_STATUS.unboundedOrInfeasible:
      return 'infeasible';
    case MODEL_STATUS.timeLimit:
      return 'timeLimit';
    case MODEL_STATUS.interrupted:
      return 'interrupted';
    case MODEL_STATUS.objectiveBound:
    case MODEL_STATUS.objectiveTarget:
    case MODEL_STATUS.iterationLimit:
    case MODEL_STATUS.solutionLimit:
    case MODEL_STATUS.unknown:
      return hasSolution ? 'feasible' : 'error';
    default:
      return 'error';
  }
}

/**
 * Run one model synchronously on `session`. Blocks the calling thread until HiGHS stops;
 * call it in a worker (see pool/) when the caller must stay responsive.
 */
export function runMip(
  session: HighsSession,
  data: ModelData | EncodedModel,
  options: MipRunOptions = {},
): MipRunResult {
  const clockStart = options.clockStart ?? performance.now();
  const elapsed = (): number => (performance.now() - clockStart) / 1000;
  const interval = options.progressIntervalMs ?? 250;

  return session.withModel(data, (model) => {
    if (options.relaxIntegrality) model.clearIntegrality();
    const integrality = 'format' in data ? model.getModel().integrality : data.integrality;
    const isMip = !options.relaxIntegrality && Boolean(integrality?.some((t) => t !== 0));
    const minimise = Number(model.getObjectiveSense()) === 1;
    const settings: Record<string, OptionValue> = { output_flag: false, ...options.highsOptions };
    if ('threads' in settings)
      throw new Error('The HiGHS option "threads" must not be set: this build is single-threaded.');
    if (options.mipRelGap !== undefined) settings.mip_rel_gap = options.mipRelGap;
    if (options.randomSeed !== undefined) settings.random_seed = options.randomSeed;
    if (options.timeLimitSeconds !== undefined) {
      // The limit covers the whole call: model building before this point uses up part of it.
      settings.time_limit = Math.max(0.001, options.timeLimitSeconds - elapsed());
    }
    model.options.set(settings);
    if (options.startValues) model.setSolution({ colValue: Array.from(options.startValues) });

    const improvements: { objective: number; seconds: number }[] = [];
    let stoppedByRule = false;
    let firstBound: number | null = null;
    let rootDone = false;
    let lastEmit = options.lastProgressAt ?? -Infinity;
    let incumbent: number | null = null;
    let bound: number | null = null;
    const emit = (force: boolean): void => {
      if (!options.onProgress) return;
      const now = performance.now();
      if (!force && now - lastEmit < interval) return;
      lastEmit = now;
      options.onProgress({
        elapsedSeconds: elapsed(),
        objective: incumbent,
        bound,
        gap: relativeGap(incumbent, bound),
      });
    };

    const result = model.run(
      isMip
        ? {
            [6](event: CallbackEventFor<6>) {
              incumbent = finiteOrNull(event.data.mip_primal_bound) ?? incumbent;
              bound = finiteOrNull(event.data.mip_dual_bound) ?? bound;
              emit(false);
              if (firstBound === null) firstBound = bound;
              if (!rootDone)
                rootDone =
                  (bound !== null && firstBound !== null && bound !== firstBound) ||
                  Number(event.data.mip_node_count ?? 0) > 0;
              if (isCancelled(options)) event.interrupt();
              else if (options.stopWhen) {
                if (options.stopWhen({ elapsedSeconds: elapsed(), rootDone })) {
                  stoppedByRule = true;
                  event.interrupt();
                }
              }
              return undefined;
            },
            [4](event: CallbackEventFor<4>) {
              const objective = finiteOrNull(event.data.objective_function_value);
              if (objective !== null) {
                const better =
                  incumbent === null || (minimise ? objective < incumbent : objective > incumbent);
                if (better || improvements.length === 0) {
                  incumbent = objective;
                  improvements.push({ objective, seconds: elapsed() });
                  const solution = event.data.mip_solution;
                  if (options.onSolution && solution) options.onSolution(solution, objective);
                }
              }
              bound = finiteOrNull(event.data.mip_dual_bound) ?? bound;
              emit(false);
              return undefined;
            },
          }
        : {
            [1](event: CallbackEventFor<1>) {
              if (isCancelled(options)) event.interrupt();
              return undefined;
            },
          },
    );

    const modelStatus = result.modelStatus;
    const hasSolution = infoNumber(model, 'primal_solution_status') === 2;
    const rawObjective = hasSolution ? finiteOrNull(model.getObjectiveValue()) : null;
    const values = hasSolution && rawObjective !== null ? model.getSolution().colValue : null;
    let finalBound: number | null;
    if (isMip) finalBound = infoNumber(model, 'mip_dual_bound');
    else finalBound = modelStatus === MODEL_STATUS.optimal ? rawObjective : null;
    const seconds = elapsed();
    const objective = values ? rawObjective : null;
    // Seconds to best: the first improvement that already had the final objective.
    let secondsToBest: number | null = null;
    if (objective !== null) {
      const tolerance = 1e-6 * Math.max(1, Math.abs(objective));
      const first = improvements.find((i) => Math.abs(i.objective - objective) <= tolerance);
      secondsToBest = first ? first.seconds : seconds;
    }
    incumbent = objective;
    bound = finalBound;
    emit(true);
    const stoppedAsPlanned = stoppedByRule && modelStatus === MODEL_STATUS.interrupted;
    return {
      status: stoppedAsPlanned ? 'timeLimit' : statusOf(modelStatus, values !== null),
      modelStatus,
      modelStatusText: MODEL_STATUS_TEXT[modelStatus] ?? `status ${modelStatus}`,
      objective,
      bound: finalBound,
      gap: relativeGap(objective, finalBound),
      values,
      seconds,
      secondsToBest,
      nodes: isMip ? (infoNumber(model, 'mip_node_count') ?? 0) : 0,
      improvements,
      rootDone: isMip ? rootDone : modelStatus === MODEL_STATUS.optimal,
    };
  });
}

let defaultSession: Promise<HighsSession> | null = null;

/** The session of this thread, created on first use and kept healthy between solves. */
export async function threadSession(): Promise<HighsSession> {
  if (!defaultSession) {
    defaultSession = HighsSession.create().catch((err: unknown) => {
      defaultSession = null;
      throw err;
    });
  }
  const session = await defaultSession;
  await session.ensureHealthy();
  return session;
}

/**
 * Solve a plain model given as highs `createModel` arrays or as LP/MPS text (a MIP, or with
 * `relaxIntegrality` its LP relaxation) on this thread's session. Blocks this thread while HiGHS
 * runs: use the pool (pool/solver-pool.ts) to keep a server responsive.
 */
export async function solveMip(
  data: ModelData | EncodedModel,
  options: MipRunOptions = {},
): Promise<MipRunResult> {
  const clockStart = options.clockStart ?? performance.now();
  const session = await threadSession();
  return runMip(session, data, { ...options, clockStart });
}

/**
 * The model for HiGHS without row and column names: passing names costs 0.25-0.75 s per model on a
 * benchmark-sized roster (measured on instance 12, 14,489 columns), and explanations map rows back
 * through the row meta of buildModel, not through names.
 */
export function solverArrays(built: {
  arrays: Omit<HighsModelArrays, 'colNames' | 'rowNames'> & Partial<HighsModelArrays>;
}): ModelData {
  const { colNames: _colNames, rowNames: _rowNames, ...rest } = built.arrays;
  return rest as unknown as ModelData;
}
