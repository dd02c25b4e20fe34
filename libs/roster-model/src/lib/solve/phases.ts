/**
 * The phases of a solve (solve.ts runs them in turn): the first roster (construction heuristic and
 * local search), fix-and-optimise, the column-generation bound with the rosters from its lines, the
 * staffing proof, and the elastic model's bookkeeping for starts that break hard rules.
 */
import type { Roster, RosterProblem } from '../problem';
import type { CheckResult, StaffingSafety } from '../result';
import { checkRoster } from '../check/checker';
import { construct, improve } from '../heuristic/construct';
import { fixAndOptimise, type SubMipSolver } from '../heuristic/fix-and-optimise';
import { buildModel, type BuiltModel } from '../model/build-model';
import { searchRoster } from '../search/roster-search';
import { staffingSafety, staffingShortfall } from '../safety/staffing';
import { type HighsSession, isWasmFailure } from './highs-session';
import { LineDp } from '../search/line-dp';
import { lineBound } from '../bound/line-bound';
import { linesOf, rosterOfLines } from '../bound/line-master';
import { linePack } from '../search/line-pack';
import { isCancelled, relativeGap, runMip, solverArrays, type MipRunResult } from './run-mip';
import { assertCheckerAgrees } from './agreement';
import type { SolveRosterOptions } from './solve';
import {
  AUTO_LARGE_MODEL_X,
  FIX_AND_OPTIMISE_SUB_SECONDS,
  AUTO_SEARCH_SHARE,
  AUTO_HUGE_MODEL_X,
  AUTO_SEARCH_SHARE_HUGE,
  AUTO_SEARCH_SHARE_LARGE,
  SEARCH_STALL_MS,
  SEARCH_NO_STALL_X,
  SEARCH_GIVE_UP_SHARE,
  LINE_BOUND_GAP,
  LINE_BOUND_HOPELESS_GAP,
  COLUMN_DIVE_SHARE,
  STAFFING_MIN_SECONDS,
  PROGRESS_INTERVAL_MS,
} from './policy';

export function usesSearch(options: SolveRosterOptions): boolean {
  const heuristic = options.warmStart === undefined || options.warmStart === 'heuristic';
  return heuristic && (options.searchShare ?? AUTO_SEARCH_SHARE) > 0;
}

/** What solveRoster returns: the SolveResult the product uses, plus numbers for benchmarks and logs. */
export interface StartRoster {
  roster: Roster;
  check: CheckResult;
}

export function warmStartRoster(
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
      stallMs:
        built.numX >= SEARCH_NO_STALL_X && built.numX < AUTO_LARGE_MODEL_X ? undefined : SEARCH_STALL_MS,
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
export function startValuesOf(
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
export function strictRun(
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
export function elasticSlack(elastic: BuiltModel, values: ArrayLike<number>): number {
  let total = 0;
  const names = elastic.arrays.colNames;
  for (let j = elastic.numX; j < names.length; j++) {
    if (names[j].startsWith('elU_') || names[j].startsWith('elL_')) total += Math.abs(values[j]);
  }
  return total;
}

/** Price of one unit of hard-rule violation in the elastic model fix-and-optimise repairs a start with. */
export function elasticPenalty(built: BuiltModel): number {
  let largest = 1;
  for (const c of built.arrays.colCost) largest = Math.max(largest, Math.abs(c));
  return 1000 * largest;
}

/**
 * Fix-and-optimise from the start roster for `seconds`; a start that breaks hard rules is repaired on
 * the elastic model. Returns the best roster that meets every hard rule, or null.
 */
export async function fixAndOptimisePhase(
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

/** True when every roster's objective is a whole number (every cost of the model is whole). */
export function wholeObjective(built: BuiltModel): boolean {
  for (const c of built.arrays.colCost) if (!Number.isInteger(c)) return false;
  return true;
}

/** What the column phase found: the bound and, when better than the roster it started from, a roster. */
export interface ColumnPhaseResult {
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
export function lineBoundPhase(
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
      // A master far below the roster cannot give a bound worth stating (the generated ward of
      // bench/ward.ts: 38 against rosters of 108 and more after 200 s): its time goes back.
      giveUpBelow: best.objective > 0 ? best.objective * (1 - LINE_BOUND_HOPELESS_GAP) : undefined,
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
export function proveStaffing(
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
