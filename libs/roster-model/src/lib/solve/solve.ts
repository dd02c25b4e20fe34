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
 * runs it in a worker thread for servers. The phases live in phases.ts, the shares of the time limit
 * they get (and what each was measured against) in policy.ts, the checker's verdict in agreement.ts.
 */
import type { Roster, RosterProblem } from '../problem';
import type { ConflictExplanation, SolveProgress, SolveResult, StaffingSafety } from '../result';
import { checkRoster } from '../check/checker';
import { explainConflicts } from '../explain/conflicts';
import { qualityStatement } from '../explain/quality';
import { explainRequests } from '../explain/requests';
import { explainUnmetNeeds } from '../explain/unmet-needs';
import { buildModel, type BuiltModel } from '../model/build-model';
import { mergedStaffingSafety, staffingStatement } from '../safety/staffing';
import { type HighsSession, isWasmFailure } from './highs-session';
import {
  isCancelled,
  MODEL_STATUS,
  relativeGap,
  runMip,
  solverArrays,
  threadSession,
  type MipRunResult,
} from './run-mip';
import {
  AUTO_LARGE_MODEL_X,
  AUTO_FIX_AND_OPTIMISE_SHARE,
  AUTO_LARGE_HIGHS_OPTIONS,
  AUTO_HUGE_MODEL_X,
  MIP_BOUND_CAP,
  MIP_BOUND_CAP_LARGE,
  LINE_BOUND_GAP,
  LINE_BOUND_SHARE,
  LINE_BOUND_SHARE_LARGE,
  COLUMN_ROSTER_SHARE,
  STAFFING_SHARE,
  STAFFING_MAX_SECONDS,
  STAFFING_MIN_SECONDS,
  AUTO_FIX_AND_OPTIMISE_SHARE_SMALL,
  FIX_AND_OPTIMISE_BEFORE_COLUMNS,
} from './policy';
import {
  elasticPenalty,
  fixAndOptimisePhase,
  lineBoundPhase,
  proveStaffing,
  startValuesOf,
  strictRun,
  usesSearch,
  warmStartRoster,
  type StartRoster,
} from './phases';
import { assertCheckerAgrees, SolverCheckError } from './agreement';
export { assertCheckerAgrees, SolverCheckError } from './agreement';

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
    // In 'auto', the MIP before fix-and-optimise waits for its root LP's bound (a busy machine can
    // need more than the share), at most to MIP_BOUND_CAP(_LARGE): large models run on past their
    // share, small ones get the LP relaxation alone after it (`onTime` below);
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
    // Small models: HiGHS's own time limit ends the MIP at its share. Its root sub-MIPs (RENS, RINS)
    // see that limit but not the interrupt callback: on the demo ward they ran 7-8 s past the share
    // and left fix-and-optimise half its time. A root LP not done by then is solved alone (below).
    const onTime = waitForBound && !large;
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
          rootDone: true,
        }
      : runMip(session, elastic ? solverArrays(elastic.model) : data, {
          timeLimitSeconds: onTime ? mipLimit : mipCap,
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
    if (onTime && !run.rootDone && run.status === 'timeLimit' && !isCancelled(options)) {
      // Stopped before its root LP (a busy machine), its bound null or trivial: the LP relaxation
      // alone, within the wait's cap. The strict model's: no start is needed, and its bound is
      // at least the elastic one's.
      const lp = runMip(session, data, {
        relaxIntegrality: true,
        timeLimitSeconds: mipCap,
        highsOptions,
        signal: options.signal,
        cancelFlag: options.cancelFlag,
        clockStart,
      });
      if (lp.bound !== null && (run.bound === null || lp.bound > run.bound))
        run = { ...run, bound: lp.bound, gap: relativeGap(run.objective, lp.bound), seconds: lp.seconds };
    }
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
