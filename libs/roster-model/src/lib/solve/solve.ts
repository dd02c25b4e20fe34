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
import type { CheckResult, ConflictExplanation, SolveProgress, SolveResult, StaffingSafety } from '../result';
import { checkRoster } from '../check/checker';
import { explainConflicts } from '../explain/conflicts';
import { qualityStatement } from '../explain/quality';
import { explainRequests } from '../explain/requests';
import { explainUnmetNeeds } from '../explain/unmet-needs';
import { construct, improve } from '../heuristic/construct';
import { fixAndOptimise, type SubMipSolver } from '../heuristic/fix-and-optimise';
import { buildModel, type BuiltModel } from '../model/build-model';
import { searchRoster } from '../search/roster-search';
import {
  mergedStaffingSafety,
  staffingSafety,
  staffingShortfall,
  staffingStatement,
} from '../safety/staffing';
import { type HighsSession, isWasmFailure } from './highs-session';
import { LineDp } from '../search/line-dp';
import { lineBound } from '../bound/line-bound';
import { linesOf, rosterOfLines } from '../bound/line-master';
import { linePack } from '../search/line-pack';
import {
  isCancelled,
  MODEL_STATUS,
  relativeGap,
  runMip,
  solverArrays,
  threadSession,
  type MipRunResult,
} from './run-mip';

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
  /**
   * How to spend the time limit:
   * - 'mip': the full MIP from the warm start for the whole limit;
   * - 'fixAndOptimise': first fix-and-optimise (sub-MIPs over a few people or a window of days, fixed
   *   elsewhere to the best roster) for `fixAndOptimiseShare` of the limit, then the full MIP from its
   *   best roster for the rest (it proves the bound, and keeps the F&O roster if it finds nothing better);
   * - 'mipThenFixAndOptimise': the full MIP first for the rest of the limit (it finds a first roster
   *   and the proven bound), then fix-and-optimise from its best roster for `fixAndOptimiseShare`;
   * - 'auto' (default): after the local search (`searchShare`), 'mipThenFixAndOptimise': the MIP from
   *   the search's roster proves the bound, fix-and-optimise polishes the best roster for
   *   AUTO_FIX_AND_OPTIMISE_SHARE_SMALL of the rest, FIX_AND_OPTIMISE_BEFORE_COLUMNS of its time before
   *   the column-generation bound is considered (AUTO_FIX_AND_OPTIMISE_SHARE on models with
   *   AUTO_LARGE_MODEL_X assignment columns or more, which also get the root LP by interior point and
   *   more MIP heuristic effort: AUTO_LARGE_HIGHS_OPTIONS; options passed in highsOptions win). Without
   *   the search (`searchShare: 0` or a given warm start), 'mip' below AUTO_LARGE_MODEL_X. Measured on
   *   the benchmark: docs/benchmarks.md.
   */
  strategy?: 'auto' | 'mip' | 'fixAndOptimise' | 'mipThenFixAndOptimise';
  /**
   * Share of the time limit (after setup) given to fix-and-optimise in the 'fixAndOptimise' and
   * 'mipThenFixAndOptimise' strategies (default 0.5). In 'mipThenFixAndOptimise' the full MIP runs
   * first for the rest and fix-and-optimise continues from its best roster.
   */
  fixAndOptimiseShare?: number;
  /** Time limit of each fix-and-optimise sub-MIP in seconds (default FIX_AND_OPTIMISE_SUB_SECONDS). */
  fixAndOptimiseSubSeconds?: number;
  /**
   * Count the shortfall below minimum cover and prove the fewest possible (safety/staffing.ts) in at
   * most STAFFING_SHARE of the limit (at most STAFFING_MAX_SECONDS): right after the first roster when
   * it keeps every hard rule (the time the proof does not need goes to the solve), else at the end.
   * Default: as `explain`.
   */
  staffingCheck?: boolean;
  /**
   * Share of the time limit (after model building) for the local search (search/roster-search.ts)
   * that runs from the construction heuristic's roster before HiGHS starts (default AUTO_SEARCH_SHARE,
   * AUTO_SEARCH_SHARE_HUGE on huge models;
   * 0: none). Only with the heuristic warm start.
   */
  searchShare?: number;
  /**
   * Share of the local search's time spent re-optimising one person's whole line exactly
   * (search/line-dp.ts; default the search's LINE_SHARE; 0: never, and no line repair either).
   */
  lineShare?: number;
  /**
   * Share of the time left for the column-generation bound (bound/line-bound.ts) in 'auto': after the
   * MIP when its bound leaves a gap above `lineBoundGap` (default LINE_BOUND_SHARE), or before it on
   * large models (default LINE_BOUND_SHARE_LARGE); 0: never. Below AUTO_HUGE_MODEL_X only.
   */
  lineBoundShare?: number;
  /** The MIP's gap above which 'auto' computes the column-generation bound (default LINE_BOUND_GAP). */
  lineBoundGap?: number;
  /**
   * After the column-generation bound, look for rosters among its lines (search/line-dive.ts and
   * search/line-pack.ts) for COLUMN_ROSTER_SHARE of the time left (default true).
   */
  columnRosters?: boolean;
  /**
   * Every better roster that meets every hard rule, as it is found (the MIP's incumbents and
   * fix-and-optimise's improvements), so a solve on another core can continue from it.
   */
  onRoster?: (roster: Roster, objective: number) => void;
  /**
   * Asked between fix-and-optimise rounds: a roster found by another solve of the same problem, or
   * null. A better one that meets every hard rule replaces the current roster.
   */
  incomingRoster?: () => Roster | null;
}

/**
 * From this many x columns on, 'auto' switches to 'mipThenFixAndOptimise'. On the shift scheduling
 * benchmark (SOURCES.md) instances 1-7 have 104-1,248 x columns and 8-12 have 2,158-10,452; on 10-12
 * the full MIP spends the whole minute in its root (cuts) and finds no roster beyond its first.
 */
export const AUTO_LARGE_MODEL_X = 2000;
/**
 * Time limit of each fix-and-optimise sub-MIP (seconds). Paired 60 s two-core runs of benchmark
 * instances 8, 10, 11 and 12 (docs/benchmarks.md): 1 s gave the better roster in 4 of 5 pairs
 * against 3 s (more, smaller neighbourhoods in the same time).
 */
export const FIX_AND_OPTIMISE_SUB_SECONDS = 1;
/** Share of the time for fix-and-optimise in 'auto' on large models. */
export const AUTO_FIX_AND_OPTIMISE_SHARE = 0.8;
/**
 * HiGHS options 'auto' sets for large models: the root LP by interior point (instance 10: first
 * bound after 11-13 s instead of 30 s; instance 12: after 27-28 s instead of none in 60 s) and more
 * heuristic effort at the root (default 0.05).
 */
export const AUTO_LARGE_HIGHS_OPTIONS: Record<string, string | number> = {
  mip_lp_solver: 'ipm',
  mip_heuristic_effort: 0.3,
};

/**
 * Share of the time for the local search before HiGHS. On the demo ward (17 people, 28 days) the
 * search finds in 5-10 s a roster that 30 s of the MIP alone did not; HiGHS then proves the bound
 * from it and improves it (docs/benchmarks.md).
 */
export const AUTO_SEARCH_SHARE = 0.4;
/**
 * Models with this many assignment columns or more (benchmark instances 13, 20 and 21 and beyond:
 * half-year periods, a hundred people) give the local search AUTO_SEARCH_SHARE_HUGE of the time and
 * do not wait for the MIP's root bound: on instance 20 (150 s) the MIP spent 48 s without a bound or
 * a better roster while the search and fix-and-optimise were still improving.
 */
export const AUTO_HUGE_MODEL_X = 40_000;
export const AUTO_SEARCH_SHARE_HUGE = 0.7;
/**
 * Large models below AUTO_HUGE_MODEL_X, where the column-generation bound and the rosters from its
 * lines come first after the search (LINE_BOUND_SHARE_LARGE, COLUMN_ROSTER_SHARE): side by side on
 * benchmark instances 8, 9, 10 and 12 (60 s, one core each), 0.15 against 0.4 gave 1312 / 1404,
 * 439 / 443, 4631 (optimal, in 31 s) / 4691 and 4500 / 4570 (docs/benchmarks.md).
 */
export const AUTO_SEARCH_SHARE_LARGE = 0.15;
/**
 * Latest end of the MIP in 'auto' (share of the time after the search) while it waits for its root
 * bound; on large models fix-and-optimise keeps at least 40% (it finds most of their improvements).
 */
export const MIP_BOUND_CAP = 0.9;
export const MIP_BOUND_CAP_LARGE = 0.6;

/**
 * The search hands over to HiGHS early when it has found nothing better for this long and for half
 * its time so far: small problems then reach HiGHS (which proves them optimal) within a second or two.
 */
const SEARCH_STALL_MS = 1000;

/**
 * The search hands over after this share of its time when it has found no roster that keeps every
 * hard rule (benchmark Instances 20 and 21, 50 and 100 people over 182 days: none in 240 s under
 * load); fix-and-optimise then repairs the roster on the elastic model.
 */
const SEARCH_GIVE_UP_SHARE = 0.25;

/**
 * In 'auto', a MIP bound further than this share below the best roster gets the column-generation
 * bound for at most LINE_BOUND_SHARE of the time left; it stops as soon as it proves the roster
 * optimal. On benchmark instances 1-12 it reaches the published column-generation LP bounds (within
 * 0.3% of the optimum on 5-12, equal to it on 2-4, 10-12) where the MIP's bound after 60 s is up to
 * 18% lower; on the demo ward the MIP's bound is better (docs/benchmarks.md).
 */
export const LINE_BOUND_GAP = 0.02;
export const LINE_BOUND_SHARE = 0.25;
/**
 * On large models (AUTO_LARGE_MODEL_X) the column-generation bound comes first, for at most this
 * share of the time after the search (the time the MIP would wait for its root bound); solved to
 * the end, it replaces the MIP, which on these models spends its time in the root (instances
 * 10-12), and fix-and-optimise gets the rest.
 */
export const LINE_BOUND_SHARE_LARGE = 0.4;
/**
 * Once the column-generation bound has been computed, rosters from its lines (the dive, then the
 * best roster made of the master's lines) get at most this share of the time left, the dive's
 * pricing at most COLUMN_DIVE_SHARE of that (a dive that will not finish gives up early).
 * Alone, after the bound, they reach the best known rosters of instances 5 and 11, and 439 on 9,
 * 1,059 on 7 and 1,317 on 8 in 2-24 s, where the local search and fix-and-optimise stayed 2-15%
 * above in a minute (docs/benchmarks.md).
 */
export const COLUMN_ROSTER_SHARE = 0.7;
export const COLUMN_DIVE_SHARE = 0.75;

/** Share of the time limit, and most seconds, kept for proving the fewest people short of minimum. */
export const STAFFING_SHARE = 0.1;
export const STAFFING_MAX_SECONDS = 10;
/** Seconds the staffing proof gets at least (when the time limit leaves them). */
const STAFFING_MIN_SECONDS = 1;

/** Progress events at most this often (HiGHS's own events keep the same interval). */
const PROGRESS_INTERVAL_MS = 250;

/** Share of the time after the search for fix-and-optimise on models below AUTO_LARGE_MODEL_X. */
export const AUTO_FIX_AND_OPTIMISE_SHARE_SMALL = 0.6;
/**
 * Small models in 'auto': after the MIP, fix-and-optimise gets this share of the time left before
 * the column-generation bound is considered (LINE_BOUND_GAP), and the rest after it. The gap that
 * decides is then a polished roster's: on the demo ward (30 s, one core, six seeds) the bound, which
 * does not finish there, no longer takes a quarter of the time (mean 2,399 against 2,409.3); on
 * benchmark instances 1-7 (60 s) every result stayed the same or better (docs/benchmarks.md).
 */
export const FIX_AND_OPTIMISE_BEFORE_COLUMNS = 0.6;

function usesSearch(options: SolveRosterOptions): boolean {
  const heuristic = options.warmStart === undefined || options.warmStart === 'heuristic';
  return heuristic && (options.searchShare ?? AUTO_SEARCH_SHARE) > 0;
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

interface StartRoster {
  roster: Roster;
  check: CheckResult;
}

function warmStartRoster(
  built: BuiltModel,
  problem: RosterProblem,
  options: SolveRosterOptions,
  timeLimitSeconds: number,
  clockStart: number,
  progressClock: { last: number },
): StartRoster | null {
  const warmStart = options.warmStart;
  if (warmStart === null) return null;
  if (warmStart !== undefined && warmStart !== 'heuristic') {
    return { roster: warmStart, check: checkRoster(problem, warmStart, built.index) };
  }
  const huge = built.numX >= AUTO_HUGE_MODEL_X;
  const columnsFirst = !huge && built.numX >= AUTO_LARGE_MODEL_X && options.lineBoundShare !== 0;
  const share = Math.min(
    1,
    Math.max(
      0,
      options.searchShare ??
        (huge ? AUTO_SEARCH_SHARE_HUGE : columnsFirst ? AUTO_SEARCH_SHARE_LARGE : AUTO_SEARCH_SHARE),
    ),
  );
  const left = (): number => timeLimitSeconds * 1000 - (performance.now() - clockStart);
  // The greedy fill with a short local search of its own: the fast search below does the rest.
  const heuristicMs = Math.max(0, Math.min(share > 0 ? 300 : 1000, left()));
  const started = performance.now();
  let roster = construct(problem, { timeLimitMs: heuristicMs });
  let check = checkRoster(problem, roster, built.index);
  const searchMs = share * left();
  if (share > 0 && searchMs > 0) {
    const elapsed = (): number => (performance.now() - clockStart) / 1000;
    // Progress and rosters for the other core at most 4 times a second (and the last one at the end).
    let unsent = false;
    const send = (objective: number, grid: () => number[][]): void => {
      progressClock.last = performance.now();
      unsent = false;
      options.onProgress?.({ elapsedSeconds: elapsed(), objective, bound: null, gap: null });
      options.onRoster?.(built.index.fromGrid(grid()), objective);
    };
    const lineDp = options.lineShare === 0 ? null : new LineDp(built.index);
    const found = searchRoster(built.index, roster, {
      timeLimitMs: searchMs,
      lineSolver: lineDp ? (p, extra) => lineDp.solve(p, extra) : undefined,
      lineShare: options.lineShare,
      stallMs: SEARCH_STALL_MS,
      giveUpMs: searchMs * SEARCH_GIVE_UP_SHARE,
      seed: (options.randomSeed ?? 0) + 1,
      shouldStop: () => isCancelled(options),
      onBest: (objective, grid) => {
        if (performance.now() - progressClock.last >= PROGRESS_INTERVAL_MS) send(objective, grid);
        else unsent = true;
      },
      incoming: options.incomingRoster
        ? () => {
            const offered = options.incomingRoster?.();
            return offered ? built.index.toGrid(offered).grid : null;
          }
        : undefined,
    });
    // The last roster goes to the other core at once; its progress waits for the interval (HiGHS,
    // starting from this roster, reports it).
    if (unsent && found.feasible) options.onRoster?.(found.roster, found.objective);
    roster = found.roster;
    check = checkRoster(problem, roster, built.index);
    return { roster, check };
  }
  // Without the fast search: a start that meets every hard rule lets HiGHS begin from a roster,
  // which it keeps improving; without one it may spend the whole limit searching. So the
  // heuristic's search goes on, a second at a time, while rules are broken, for at most 20% of the
  // limit (8 s at most).
  const extraUntil = started + Math.min(8000, timeLimitSeconds * 200);
  for (let round = 1; check.violations.length > 0 && performance.now() + 1000 <= extraUntil; round++) {
    roster = improve(problem, roster, { timeLimitMs: 1000, seed: round });
    check = checkRoster(problem, roster, built.index);
  }
  return { roster, check };
}

/** A start for HiGHS: only a roster that meets every hard rule (HiGHS rejects any other). */
function startValuesOf(
  built: BuiltModel,
  start: StartRoster | null,
): { values: Float64Array; objective: number } | null {
  if (!start || start.check.violations.length > 0) return null;
  return { values: built.encode(start.roster), objective: start.check.objective };
}

/**
 * The result of a MIP run on the elastic model as a run on the strict one: its incumbent if that
 * breaks no hard rule (re-encoded in the strict model), else no incumbent. Proven optimal with a
 * broken rule means no roster meets every hard rule: reported as infeasible, so the conflicts are
 * explained on the strict model.
 */
function strictRun(
  elasticRun: MipRunResult,
  elastic: BuiltModel,
  penalty: number,
  built: BuiltModel,
  problem: RosterProblem,
): MipRunResult {
  const run = { ...elasticRun, improvements: elasticRun.improvements.filter((i) => i.objective < penalty) };
  if (!run.values) return run;
  const roster = elastic.decode(run.values);
  const check = checkRoster(problem, roster, built.index);
  if (check.violations.length === 0) {
    const values = built.encode(roster);
    return { ...run, values, objective: built.objectiveOf(values) };
  }
  // The model pays for no broken rule, yet the checker finds one: the model and the checker disagree
  // (a defect, never infeasibility).
  if (elasticSlack(elastic, run.values) <= 1e-6) assertCheckerAgrees(check, run.objective ?? NaN);
  const status = run.status === 'optimal' ? 'infeasible' : run.status;
  return {
    ...run,
    status,
    modelStatusText: status === 'infeasible' ? 'infeasible' : run.modelStatusText,
    values: null,
    objective: null,
    gap: null,
    secondsToBest: null,
  };
}

/** Total of the elastic model's slack columns (violations it prices) in `values`. */
function elasticSlack(elastic: BuiltModel, values: ArrayLike<number>): number {
  let total = 0;
  const names = elastic.arrays.colNames;
  for (let j = elastic.numX; j < names.length; j++) {
    if (names[j].startsWith('elU_') || names[j].startsWith('elL_')) total += Math.abs(values[j]);
  }
  return total;
}

/** Price of one unit of hard-rule violation in the elastic model fix-and-optimise repairs a start with. */
function elasticPenalty(built: BuiltModel): number {
  let largest = 1;
  for (const c of built.arrays.colCost) largest = Math.max(largest, Math.abs(c));
  return 1000 * largest;
}

/**
 * Fix-and-optimise from the start roster for `seconds`; a start that breaks hard rules is repaired on
 * the elastic model. Returns the best roster that meets every hard rule, or null.
 */
async function fixAndOptimisePhase(
  problem: RosterProblem,
  built: BuiltModel,
  session: HighsSession,
  start: StartRoster,
  seconds: number,
  options: SolveRosterOptions,
  onImproved: (objective: number) => void,
  targetObjective?: number,
): Promise<{ values: Float64Array; objective: number } | null> {
  const model =
    start.check.violations.length > 0 ? buildModel(problem, { elastic: elasticPenalty(built) }) : built;
  const stop = new AbortController();
  const solveSub: SubMipSolver = async (arrays, sub) => {
    if (isCancelled(options)) {
      stop.abort();
      return { values: null, optimal: false };
    }
    const run = runMip(session, solverArrays({ arrays }), {
      timeLimitSeconds: sub.timeLimitSeconds,
      startValues: sub.startValues,
      randomSeed: sub.randomSeed,
      signal: options.signal,
      cancelFlag: options.cancelFlag,
    });
    return { values: run.values, optimal: run.status === 'optimal' };
  };
  let best: { values: Float64Array; objective: number } | null = startValuesOf(built, start);
  if (best) options.onRoster?.(start.roster, best.objective);
  const result = await fixAndOptimise(model, start.roster, solveSub, {
    timeLimitSeconds: seconds,
    subTimeLimitSeconds: options.fixAndOptimiseSubSeconds ?? FIX_AND_OPTIMISE_SUB_SECONDS,
    seed: (options.randomSeed ?? 0) + 1,
    signal: stop.signal,
    targetObjective,
    incoming: options.incomingRoster,
    onImprovement: (roster) => {
      const check = checkRoster(problem, roster, built.index);
      if (check.violations.length > 0) return;
      if (best && check.objective >= best.objective) return;
      best = { values: built.encode(roster), objective: check.objective };
      onImproved(check.objective);
      options.onRoster?.(roster, check.objective);
    },
  });
  // The last roster may have come from another solve (`incomingRoster`) and be better than any of
  // this phase's own.
  const last = checkRoster(problem, result.roster, built.index);
  if (last.violations.length === 0 && (!best || last.objective < best.objective - 1e-9)) {
    best = { values: built.encode(result.roster), objective: last.objective };
    onImproved(last.objective);
  }
  return best;
}

function emptyResult(
  run: MipRunResult,
  built: BuiltModel,
  conflicts: ConflictExplanation | null,
  setupSeconds: number,
  seconds: number,
): RosterSolveResult {
  return {
    setupSeconds,
    status: run.status,
    roster: null,
    objective: null,
    bound: run.bound,
    gap: null,
    seconds,
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

/** True when every roster's objective is a whole number (every cost of the model is whole). */
function wholeObjective(built: BuiltModel): boolean {
  for (const c of built.arrays.colCost) if (!Number.isInteger(c)) return false;
  return true;
}

/** What the column phase found: the bound and, when better than the roster it started from, a roster. */
interface ColumnPhaseResult {
  /** The bound, or null when no exact round finished (the dive may still have found a roster). */
  value: number | null;
  converged: boolean;
  better: { values: Float64Array; objective: number; roster: Roster } | null;
}

/**
 * The column-generation bound (bound/line-bound.ts) for at most `seconds`, from the best roster's
 * lines, stopping once it proves that roster optimal; rounded up when every objective is whole.
 * Then, while the bound leaves a gap, rosters from the generated lines: the dive
 * (search/line-dive.ts, pricing for at most COLUMN_DIVE_SHARE of `rosterSeconds`) and the best
 * roster made of the master's lines (search/line-pack.ts, a MIP from the best roster so far, for
 * the rest of `rosterSeconds`). Skipped when `bound` (the MIP's) is within `lineBoundGap` of the
 * roster, on huge models (half-year lines: exact pricing takes too long) and without the search.
 */
function lineBoundPhase(
  problem: RosterProblem,
  built: BuiltModel,
  session: HighsSession,
  best: { roster: Roster; objective: number } | null,
  bound: number | null,
  seconds: number,
  rosterSeconds: () => number,
  options: SolveRosterOptions,
): ColumnPhaseResult | null {
  if (!usesSearch(options) || built.numX >= AUTO_HUGE_MODEL_X || isCancelled(options)) return null;
  if (!best || seconds < 0.5) return null;
  const gap = relativeGap(best.objective, bound);
  if (gap !== null && gap <= (options.lineBoundGap ?? LINE_BOUND_GAP)) return null;
  const { index } = built;
  const whole = wholeObjective(built);
  // A whole objective can stop one below the roster's: rounding up closes the gap.
  const target = best.objective - (whole ? 1 - 1e-6 : 0);
  let rosterMs = 0;
  try {
    const result = lineBound(index, session, {
      timeLimitMs: seconds * 1000,
      seed: linesOf(index, best.roster),
      target,
      diveMs: () => {
        rosterMs = (options.columnRosters ?? true) ? rosterSeconds() * 1000 : 0;
        return rosterMs * COLUMN_DIVE_SHARE;
      },
      shouldStop: () => isCancelled(options),
    });
    const value = result.bound === null ? null : whole ? Math.ceil(result.bound - 1e-6) : result.bound;
    const converged = value !== null && (result.converged || value >= best.objective - 1e-9);
    // Kept in a holder: TypeScript does not follow assignments made inside `offer`.
    const found: { better: ColumnPhaseResult['better'] } = { better: null };
    const offer = (lines: Int16Array | null): void => {
      if (!lines) return;
      const roster = rosterOfLines(index, lines);
      const check = checkRoster(problem, roster, index);
      if (check.violations.length > 0) return;
      if (check.objective >= (found.better?.objective ?? best.objective) - 1e-9) return;
      found.better = { values: built.encode(roster), objective: check.objective, roster };
      options.onRoster?.(roster, check.objective);
    };
    offer(result.dive?.grid ?? null);
    const left = rosterMs - result.diveSpentMs;
    const current = found.better?.objective ?? best.objective;
    if (left > 500 && (value === null || value < current - 1e-9) && !isCancelled(options)) {
      const packed = linePack(index, session, result.lines, {
        timeLimitSeconds: left / 1000,
        start: linesOf(index, found.better?.roster ?? best.roster),
        randomSeed: options.randomSeed,
        signal: options.signal,
        cancelFlag: options.cancelFlag,
      });
      offer(packed.grid);
    }
    const better = found.better;
    return value === null && better === null ? null : { value, converged, better };
  } catch (err) {
    if (isWasmFailure(err)) session.markBroken();
    throw err;
  }
}

/**
 * The fewest people short of minimum cover (safety/staffing.ts) proved from `roster` (which meets
 * every hard rule) within `seconds` (at least STAFFING_MIN_SECONDS when the limit leaves them).
 */
function proveStaffing(
  session: HighsSession,
  index: BuiltModel['index'],
  roster: Roster,
  seconds: number,
  options: SolveRosterOptions,
): StaffingSafety {
  try {
    const limit = isCancelled(options) ? 0 : Math.max(seconds, STAFFING_MIN_SECONDS);
    return staffingSafety(session, index, roster, limit, options);
  } catch (err) {
    if (isWasmFailure(err)) session.markBroken();
    // The roster stands; only the proof is missing.
    return { ...staffingShortfall(index, roster), fewestPossible: null, proven: false };
  }
}

export async function solveRoster(
  problem: RosterProblem,
  options: SolveRosterOptions = {},
): Promise<RosterSolveResult> {
  const clockStart = performance.now();
  const session = options.session ?? (await threadSession());
  await session.ensureHealthy();
  const built = buildModel(problem);
  const requestedSeconds = options.timeLimitSeconds ?? 60;
  const checkStaffing = options.staffingCheck ?? options.explain ?? true;
  // Part of the limit proves the fewest people short of minimum (safety/staffing.ts).
  const staffingSeconds = checkStaffing
    ? Math.min(STAFFING_MAX_SECONDS, requestedSeconds * STAFFING_SHARE)
    : 0;
  let timeLimitSeconds = requestedSeconds - staffingSeconds;
  const progressClock = { last: -Infinity };
  let startRoster = warmStartRoster(built, problem, options, timeLimitSeconds, clockStart, progressClock);
  let start = startValuesOf(built, startRoster);
  const warmStartObjective = start?.objective ?? null;
  // From a first roster that meets every hard rule the proof comes now, and the time it does not need
  // goes to the solve (the demo ward: 0.5 s of its 3 s); without one it comes last, from the roster.
  const earlyStaffing =
    checkStaffing && start !== null && startRoster !== null && !isCancelled(options)
      ? proveStaffing(session, built.index, startRoster.roster, staffingSeconds, options)
      : null;
  if (earlyStaffing) timeLimitSeconds = requestedSeconds;
  const data = solverArrays(built);
  const setupSeconds = (performance.now() - clockStart) / 1000;
  const elapsed = (): number => (performance.now() - clockStart) / 1000;

  const auto = options.strategy === undefined || options.strategy === 'auto';
  const large = built.numX >= AUTO_LARGE_MODEL_X;
  // After the local search, HiGHS first proves the bound (and may improve the roster), then
  // fix-and-optimise polishes the best roster with exact sub-MIPs; without it, small models get the
  // whole MIP.
  const searched = usesSearch(options);
  const strategy = auto ? (large || searched ? 'mipThenFixAndOptimise' : 'mip') : (options.strategy ?? 'mip');
  const highsOptions =
    auto && large ? { ...AUTO_LARGE_HIGHS_OPTIONS, ...options.highsOptions } : options.highsOptions;
  const foImprovements: { objective: number; seconds: number }[] = [];
  const onImproved = (objective: number): void => {
    foImprovements.push({ objective, seconds: elapsed() });
    options.onProgress?.({ elapsedSeconds: elapsed(), objective, bound: null, gap: null });
  };
  const share = Math.min(
    1,
    Math.max(
      0,
      options.fixAndOptimiseShare ??
        (auto ? (large ? AUTO_FIX_AND_OPTIMISE_SHARE : AUTO_FIX_AND_OPTIMISE_SHARE_SMALL) : 0.5),
    ),
  );
  const mipLimit =
    strategy === 'mipThenFixAndOptimise'
      ? setupSeconds + Math.max(0, timeLimitSeconds - setupSeconds) * (1 - share)
      : timeLimitSeconds;
  if (strategy === 'fixAndOptimise' && startRoster) {
    const seconds = Math.max(0, timeLimitSeconds - setupSeconds) * share;
    if (seconds > 0.5) {
      try {
        start = await fixAndOptimisePhase(problem, built, session, startRoster, seconds, options, onImproved);
      } catch (err) {
        if (isWasmFailure(err)) session.markBroken();
        throw err;
      }
    }
  }

  // A start that breaks hard rules cannot seed HiGHS on the strict model. The elastic model (each
  // hard row with a priced slack) takes it as it is, so HiGHS improves a roster from the first
  // second instead of searching for one; the elastic model is a relaxation of the strict one, so
  // its bound is still a valid bound, and an incumbent without slack is a strict roster.
  const elastic =
    !start && startRoster && startRoster.check.violations.length > 0 && !isCancelled(options)
      ? { model: buildModel(problem, { elastic: elasticPenalty(built) }), penalty: elasticPenalty(built) }
      : null;
  // Large models: the column-generation bound first; solved to the end, it stands in for the MIP.
  const lineShare = options.lineBoundShare;
  const lineFirst =
    auto && strategy === 'mipThenFixAndOptimise' && large && start !== null && lineShare !== 0;
  const columnRosterSeconds = (): number => (timeLimitSeconds - elapsed()) * COLUMN_ROSTER_SHARE;
  const firstBound = lineFirst
    ? lineBoundPhase(
        problem,
        built,
        session,
        { roster: startRoster!.roster, objective: start!.objective },
        null,
        (timeLimitSeconds - elapsed()) * (lineShare ?? LINE_BOUND_SHARE_LARGE),
        columnRosterSeconds,
        options,
      )
    : null;
  // A better roster from the generated lines: fix-and-optimise (or the MIP) goes on from it.
  if (firstBound?.better) {
    const { values, objective, roster } = firstBound.better;
    start = { values, objective };
    startRoster = { roster, check: checkRoster(problem, roster, built.index) };
    onImproved(objective);
  }
  let run: MipRunResult;
  try {
    // In 'auto', the MIP before fix-and-optimise runs past its share until its root LP has given a
    // bound worth stating (a busy machine can need more than the share), at most MIP_BOUND_CAP;
    // not when the column-generation bound gave one (stopped early, its bound can be weak: instance
    // 12 under load, 2,709 against the MIP's 3,638).
    const goodFirstBound =
      firstBound !== null &&
      firstBound.value !== null &&
      (firstBound.converged ||
        (relativeGap(start?.objective ?? null, firstBound.value) ?? 1) <= LINE_BOUND_GAP);
    const waitForBound =
      auto && strategy === 'mipThenFixAndOptimise' && built.numX < AUTO_HUGE_MODEL_X && !goodFirstBound;
    // After a column phase that gave no bound (benchmark instance 15 at 600 s: none), the MIP still
    // gets its share of the time left to reach its root bound.
    const boundCap = large ? MIP_BOUND_CAP_LARGE : MIP_BOUND_CAP;
    const mipCap = waitForBound
      ? Math.max(
          mipLimit,
          setupSeconds + Math.max(0, timeLimitSeconds - setupSeconds) * boundCap,
          elapsed() + Math.max(0, timeLimitSeconds - elapsed()) * boundCap,
        )
      : mipLimit;
    run = firstBound?.converged
      ? {
          status: 'timeLimit',
          modelStatus: MODEL_STATUS.timeLimit,
          modelStatusText: 'timeLimit',
          objective: start!.objective,
          bound: firstBound.value,
          gap: relativeGap(start!.objective, firstBound.value),
          values: start!.values,
          seconds: elapsed(),
          secondsToBest: foImprovements.at(-1)?.seconds ?? setupSeconds,
          nodes: 0,
          improvements: [],
        }
      : runMip(session, elastic ? solverArrays(elastic.model) : data, {
          timeLimitSeconds: mipCap,
          stopWhen: waitForBound
            ? ({ elapsedSeconds, rootDone }) => rootDone && elapsedSeconds >= mipLimit
            : undefined,
          mipRelGap: options.mipRelGap,
          randomSeed: options.randomSeed,
          highsOptions,
          // An elastic incumbent that still pays for a broken rule is not a roster to show.
          onProgress:
            elastic && options.onProgress
              ? (p) =>
                  options.onProgress!(
                    p.objective !== null && p.objective >= elastic.penalty
                      ? { ...p, objective: null, gap: null }
                      : p,
                  )
              : options.onProgress,
          signal: options.signal,
          cancelFlag: options.cancelFlag,
          startValues: elastic ? elastic.model.encode(startRoster!.roster) : start?.values,
          clockStart,
          lastProgressAt: progressClock.last,
          onSolution: options.onRoster
            ? (values) => {
                const roster = (elastic ? elastic.model : built).decode(values);
                const check = checkRoster(problem, roster, built.index);
                if (check.violations.length === 0) options.onRoster?.(roster, check.objective);
              }
            : undefined,
        });
    if (elastic) run = strictRun(run, elastic.model, elastic.penalty, built, problem);
    let proven = false;
    // A roster from the generated lines after the MIP, better than the MIP's.
    let columnRoster: StartRoster | null = null;
    // Fix-and-optimise's roster from before the column-generation bound (small models).
    let polished: StartRoster | null = null;
    const firstValue = firstBound?.value ?? null;
    if (firstValue !== null && (run.bound === null || run.bound < firstValue))
      run = { ...run, bound: firstValue, gap: relativeGap(run.objective, firstValue) };
    if (
      auto &&
      strategy === 'mipThenFixAndOptimise' &&
      !lineFirst &&
      (run.status === 'timeLimit' || run.status === 'feasible')
    ) {
      // A weak bound: the column-generation bound from the best roster so far.
      let best: { roster: Roster; objective: number } | null =
        start && startRoster ? { roster: startRoster.roster, objective: start.objective } : null;
      if (run.values && run.objective !== null && (!best || run.objective < best.objective))
        best = { roster: built.decode(run.values), objective: run.objective };
      // Small models: fix-and-optimise first, so the gap that decides is a polished roster's.
      if (!large && best && !isCancelled(options)) {
        const from: StartRoster = {
          roster: best.roster,
          check: checkRoster(problem, best.roster, built.index),
        };
        const found = await fixAndOptimisePhase(
          problem,
          built,
          session,
          from,
          (timeLimitSeconds - elapsed()) * FIX_AND_OPTIMISE_BEFORE_COLUMNS,
          options,
          onImproved,
          run.bound ?? undefined,
        );
        if (found && found.objective < best.objective - 1e-6) {
          start = found;
          const roster = built.decode(found.values);
          polished = { roster, check: checkRoster(problem, roster, built.index) };
          best = { roster, objective: found.objective };
        }
      }
      const columnBound = lineBoundPhase(
        problem,
        built,
        session,
        best,
        run.bound,
        (timeLimitSeconds - elapsed()) * (lineShare ?? LINE_BOUND_SHARE),
        columnRosterSeconds,
        options,
      );
      const columnValue = columnBound?.value ?? null;
      if (columnValue !== null && (run.bound === null || run.bound < columnValue))
        run = { ...run, bound: columnValue, gap: relativeGap(run.objective, columnValue) };
      if (columnBound?.better) {
        const { values, objective, roster } = columnBound.better;
        start = { values, objective };
        columnRoster = { roster, check: checkRoster(problem, roster, built.index) };
        onImproved(objective);
      }
    }
    // The best roster at the bound is optimal: nothing is left for fix-and-optimise.
    if (run.bound !== null) {
      const bestObjective = Math.min(run.objective ?? Infinity, start?.objective ?? Infinity);
      proven = relativeGap(bestObjective, run.bound) === 0;
    }
    const left = timeLimitSeconds - elapsed();
    if (
      strategy === 'mipThenFixAndOptimise' &&
      (run.status === 'timeLimit' || run.status === 'feasible') &&
      left > 0.5 &&
      !proven &&
      !isCancelled(options)
    ) {
      // Continue from the MIP's incumbent, else from the warm start (repaired on the elastic model
      // when it breaks hard rules).
      let from: StartRoster | null = columnRoster ?? polished ?? startRoster;
      if (run.values && run.objective !== null && !columnRoster && !polished) {
        const roster = built.decode(run.values);
        from = { roster, check: checkRoster(problem, roster, built.index) };
      }
      if (from) {
        const found = await fixAndOptimisePhase(
          problem,
          built,
          session,
          from,
          left,
          options,
          onImproved,
          run.bound ?? undefined,
        );
        if (found && (!start || found.objective < start.objective - 1e-6)) start = found;
      }
    }
    run = {
      ...run,
      improvements: [...run.improvements, ...foImprovements].sort((a, b) => a.seconds - b.seconds),
    };
    // Cancelled after the MIP had stopped at its share of the time: the solve was still interrupted.
    if (
      strategy !== 'mip' &&
      isCancelled(options) &&
      (run.status === 'timeLimit' || run.status === 'feasible')
    )
      run = { ...run, status: 'interrupted', modelStatusText: 'interrupted' };
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
    return emptyResult(run, built, conflicts, setupSeconds, Math.max(run.seconds, elapsed()));
  }
  let values = run.values;
  let solverObjective = run.objective;
  let secondsToBest = run.secondsToBest;
  // The MIP incumbent's own cost (its slack columns may sit above their cheapest values; see below).
  const incumbentCost = values === null ? null : built.objectiveOf(built.encode(built.decode(values)));
  if (start && (values === null || incumbentCost === null || start.objective < incumbentCost - 1e-6)) {
    // HiGHS takes a MIP start only after its own setup; stopped before that, it reports no
    // solution. The warm start (or fix-and-optimise's roster) met every hard rule, so it is the best
    // roster known: keep it.
    values = start.values;
    solverObjective = built.objectiveOf(start.values);
    const found = foImprovements.find(
      (i) => Math.abs(i.objective - (start as { objective: number }).objective) < 1e-6,
    );
    secondsToBest = found ? found.seconds : setupSeconds;
  }
  if (values === null || solverObjective === null)
    return emptyResult(run, built, null, setupSeconds, Math.max(run.seconds, elapsed()));

  const roster = built.decode(values);
  const check = checkRoster(problem, roster, built.index);
  // A HiGHS incumbent that is not optimal may hold continuous slack columns above their cheapest
  // values for its x (seen on benchmark instance 12: two needs both 1 short and 1 over, 202 more
  // than the roster's own cost). The roster's cost in the model is that of its tight encoding; the
  // solver's objective may exceed it but never undercut it, and equals it when proven optimal.
  const rosterObjective = built.objectiveOf(built.encode(roster));
  const allowed = options.objectiveTolerance ?? 1e-6 * Math.max(1, Math.abs(solverObjective));
  if (
    rosterObjective > solverObjective + allowed ||
    (run.status === 'optimal' && values === run.values && rosterObjective < solverObjective - allowed)
  ) {
    throw new SolverCheckError(
      `Solver/model disagreement: the solver reports objective ${solverObjective} for a roster whose model cost is ${rosterObjective}`,
      check,
      solverObjective,
    );
  }
  assertCheckerAgrees(check, rosterObjective, options.objectiveTolerance);

  // Report the checker's exact objective; the solver's carries floating-point noise.
  const objective = check.objective;
  const bound = run.bound === null ? null : Math.min(run.bound, objective);
  const gap = relativeGap(objective, bound);
  // A roster at a proven bound (fix-and-optimise can reach the column-generation bound) is optimal.
  const status =
    gap === 0 && (run.status === 'timeLimit' || run.status === 'feasible') ? 'optimal' : run.status;
  let staffing: StaffingSafety | null = null;
  if (earlyStaffing) {
    // The floor holds for every roster of the problem: this roster's count against it.
    staffing = mergedStaffingSafety(built.index, roster, [earlyStaffing]);
  } else if (checkStaffing) {
    const seconds = isCancelled(options)
      ? 0
      : Math.min(requestedSeconds - elapsed(), Math.max(staffingSeconds, STAFFING_MIN_SECONDS));
    staffing = proveStaffing(session, built.index, roster, seconds, options);
  }
  return {
    status,
    roster,
    objective,
    bound,
    gap,
    seconds: Math.max(run.seconds, elapsed()),
    secondsToBest,
    check,
    quality: qualityStatement({ status, objective, bound }),
    staffing,
    staffingStatement: staffing ? staffingStatement(staffing) : '',
    unmetNeeds: explain ? explainUnmetNeeds(problem, roster, built.index) : [],
    requestsNotHonoured: explain ? explainRequests(problem, roster, built.index) : [],
    conflicts: null,
    model: modelSize(built),
    setupSeconds,
    solverStatus: run.modelStatusText,
    nodes: run.nodes,
    warmStartObjective,
    improvements: run.improvements,
  };
}
