/**
 * solveRoster: the product's solve path.
 *
 * build the model (buildModel) → optional warm start (a given roster, or the construction
 * heuristic) → HiGHS with time limit, gap target, cancel and progress → decode the roster →
 * independent checker (checkRoster) → explanations and the quality statement.
 *
 * The solve FAILS LOUDLY (throws SolverCheckError) when the checker finds a hard-rule violation in
 * the solver's roster or computes a different objective: either would be a bug in the model or in
 * HiGHS (SOLVER-NOTES.md: upstream still has open wrong-answer reports).
 *
 * This runs on the calling thread and blocks it while HiGHS works; the pool (pool/solver-pool.ts)
 * runs it in a worker thread for servers.
 */
import type { Roster, RosterProblem } from '../problem';
import type { CheckResult, ConflictExplanation, SolveProgress, SolveResult } from '../result';
import { checkRoster } from '../check/checker';
import { explainConflicts } from '../explain/conflicts';
import { qualityStatement } from '../explain/quality';
import { explainRequests } from '../explain/requests';
import { explainUnmetNeeds } from '../explain/unmet-needs';
import { construct } from '../heuristic/construct';
import { buildModel, type BuiltModel } from '../model/build-model';
import { type HighsSession, isWasmFailure } from './highs-session';
import { isCancelled, relativeGap, runMip, solverArrays, threadSession, type MipRunResult } from './run-mip';

export interface SolveRosterOptions {
  /** Wall-clock limit for the whole solve, model building included (default 60 s). */
  timeLimitSeconds?: number;
  /** Stop when no roster can be more than this share better (default: HiGHS's 1e-4). */
  mipRelGap?: number;
  /** HiGHS random_seed (independent solves use different seeds). */
  randomSeed?: number;
  /** Start from this roster, or from the construction heuristic ('heuristic', the default), or none (null). */
  warmStart?: Roster | 'heuristic' | null;
  /** Progress at most 4 times a second: best objective, bound, gap, elapsed seconds. */
  onProgress?: (progress: SolveProgress) => void;
  /** Abort to stop the solve and keep the best roster found so far. */
  signal?: AbortSignal;
  /** Shared-memory cancel switch (set element 0 to 1), used by the worker pool. */
  cancelFlag?: Int32Array;
  /** Compute explanations of unmet needs, unhonoured requests and conflicts (default true). */
  explain?: boolean;
  /** Largest accepted |checker objective − solver objective| (default 1e-6·max(1, |objective|)). */
  objectiveTolerance?: number;
  /** Further HiGHS options by snake_case name (never `threads`). */
  highsOptions?: Record<string, boolean | number | string>;
  /** Run on this HiGHS session (default: this thread's session). */
  session?: HighsSession;
}

/** What solveRoster returns: the SolveResult the product uses, plus numbers for benchmarks and logs. */
export interface RosterSolveResult extends SolveResult {
  model: { columns: number; rows: number; nonzeros: number };
  /** Seconds spent before HiGHS started (model building and the warm-start heuristic). */
  setupSeconds: number;
  /** HiGHS model status name (e.g. "optimal", "timeLimit", "interrupted"). */
  solverStatus: string;
  nodes: number;
  /** Penalty of the warm-start roster, when one was given and met every hard rule. */
  warmStartObjective: number | null;
  /** Every improving roster's objective and the second it was found. */
  improvements: { objective: number; seconds: number }[];
}

/** The solver returned a roster that the independent checker rejects: a bug, never a user error. */
export class SolverCheckError extends Error {
  constructor(
    message: string,
    readonly check: CheckResult,
    readonly solverObjective: number,
  ) {
    super(message);
    this.name = 'SolverCheckError';
  }
}

/** Compare the checker's verdict on a solver roster with the solver's own objective; throw on any disagreement. */
export function assertCheckerAgrees(check: CheckResult, solverObjective: number, tolerance?: number): void {
  if (check.violations.length > 0) {
    const shown = check.violations
      .slice(0, 5)
      .map((v) => v.message)
      .join('; ');
    throw new SolverCheckError(
      `Solver/checker disagreement: the solver's roster breaks ${check.violations.length} hard rule(s): ${shown}`,
      check,
      solverObjective,
    );
  }
  const allowed = tolerance ?? 1e-6 * Math.max(1, Math.abs(solverObjective));
  if (!(Math.abs(check.objective - solverObjective) <= allowed)) {
    throw new SolverCheckError(
      `Solver/checker disagreement: the solver reports objective ${solverObjective} but the checker computes ${check.objective} (terms ${JSON.stringify(check.terms)})`,
      check,
      solverObjective,
    );
  }
}

function warmStartValues(
  built: BuiltModel,
  problem: RosterProblem,
  warmStart: SolveRosterOptions['warmStart'],
  timeLimitSeconds: number,
): { values: Float64Array; objective: number } | null {
  if (warmStart === null) return null;
  // The heuristic's local search gets its default second (it needs it to meet minimum-hours rules),
  // or the whole limit when that is shorter.
  const heuristicMs = Math.max(0, Math.min(1000, timeLimitSeconds * 1000));
  const roster =
    warmStart === undefined || warmStart === 'heuristic'
      ? construct(problem, { timeLimitMs: heuristicMs })
      : warmStart;
  const check = checkRoster(problem, roster, built.index);
  // A start that breaks a hard rule is rejected by HiGHS anyway; do not spend its time on it.
  if (check.violations.length > 0) return null;
  return { values: built.encode(roster), objective: check.objective };
}

function emptyResult(
  run: MipRunResult,
  built: BuiltModel,
  conflicts: ConflictExplanation | null,
  setupSeconds: number,
): RosterSolveResult {
  return {
    setupSeconds,
    status: run.status,
    roster: null,
    objective: null,
    bound: run.bound,
    gap: null,
    seconds: run.seconds,
    secondsToBest: null,
    check: null,
    quality: qualityStatement({ status: run.status, objective: null, bound: run.bound }),
    unmetNeeds: [],
    requestsNotHonoured: [],
    conflicts,
    model: modelSize(built),
    solverStatus: run.modelStatusText,
    nodes: run.nodes,
    warmStartObjective: null,
    improvements: run.improvements,
  };
}

function modelSize(built: BuiltModel): RosterSolveResult['model'] {
  return {
    columns: built.arrays.numCols,
    rows: built.arrays.numRows,
    nonzeros: built.arrays.matrix.indices.length,
  };
}

export async function solveRoster(
  problem: RosterProblem,
  options: SolveRosterOptions = {},
): Promise<RosterSolveResult> {
  const clockStart = performance.now();
  const session = options.session ?? (await threadSession());
  await session.ensureHealthy();
  const built = buildModel(problem);
  const timeLimitSeconds = options.timeLimitSeconds ?? 60;
  const start = warmStartValues(built, problem, options.warmStart, timeLimitSeconds);
  const data = solverArrays(built);
  const setupSeconds = (performance.now() - clockStart) / 1000;

  let run: MipRunResult;
  try {
    run = runMip(session, data, {
      timeLimitSeconds,
      mipRelGap: options.mipRelGap,
      randomSeed: options.randomSeed,
      highsOptions: options.highsOptions,
      onProgress: options.onProgress,
      signal: options.signal,
      cancelFlag: options.cancelFlag,
      startValues: start?.values,
      clockStart,
    });
  } catch (err) {
    if (isWasmFailure(err)) {
      session.markBroken();
      const message = err instanceof Error ? err.message : String(err);
      throw new Error(`The solver failed inside WebAssembly (${message}); its instance was replaced.`, {
        cause: err,
      });
    }
    throw err;
  }

  const explain = options.explain ?? true;
  if (run.status === 'infeasible') {
    const conflicts = explain
      ? explainConflicts(session, built, { cancelled: () => isCancelled(options) })
      : null;
    return emptyResult(run, built, conflicts, setupSeconds);
  }
  let values = run.values;
  let solverObjective = run.objective;
  let secondsToBest = run.secondsToBest;
  if ((values === null || solverObjective === null) && start) {
    // HiGHS takes a MIP start only after its own setup; stopped before that, it reports no
    // solution. The warm start met every hard rule, so it is the best roster known: keep it.
    values = start.values;
    solverObjective = built.objectiveOf(start.values);
    secondsToBest = setupSeconds;
  }
  if (values === null || solverObjective === null) return emptyResult(run, built, null, setupSeconds);

  const roster = built.decode(values);
  const check = checkRoster(problem, roster, built.index);
  assertCheckerAgrees(check, solverObjective, options.objectiveTolerance);

  // Report the checker's exact objective; the solver's carries floating-point noise.
  const objective = check.objective;
  const bound = run.bound === null ? null : Math.min(run.bound, objective);
  const gap = relativeGap(objective, bound);
  return {
    status: run.status,
    roster,
    objective,
    bound,
    gap,
    seconds: run.seconds,
    secondsToBest,
    check,
    quality: qualityStatement({ status: run.status, objective, bound }),
    unmetNeeds: explain ? explainUnmetNeeds(problem, roster, built.index) : [],
    requestsNotHonoured: explain ? explainRequests(problem, roster, built.index) : [],
    conflicts: null,
    model: modelSize(built),
    setupSeconds,
    solverStatus: run.modelStatusText,
    nodes: run.nodes,
    warmStartObjective: start?.objective ?? null,
    improvements: run.improvements,
  };
}
