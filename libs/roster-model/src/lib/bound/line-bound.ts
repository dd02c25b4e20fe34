/**
 * A lower bound on the best roster by column generation over people's lines (the linear relaxation
 * of the set-partitioning model of rostering: one column per person and whole line).
 *
 * The master LP is line-master.ts's model (cover rows, one row per person, the two fairness
 * spreads), kept in one HiGHS model as columns are added (line-columns.ts). Pricing is line-dp.ts
 * with no caps (exact); a capped pass first finds most columns at a fraction of the time.
 *
 * The bound is the Lagrangian value of the coupling rows at the master's duals (valid for ANY duals
 * π of the cover rows with π_i ≥ −wOver_i, and α, β ≥ 0 of the spread rows; they are taken so):
 *   L = Σ_i π_i·target_i + Σ_i [min(0, wMin_i − π_i)·min_i + min(0, wTarget_i − π_i)·(target_i − min_i)]
 *       + Σ_groups [min(0, w − Σ_p α_p) + min(0, Σ_p β_p − w)]·most
 *       + Σ_p min_line [cost(line) − Σ_i π_i·covers_i(line) + Σ_groups (α_p − β_p)·count(line)].
 * It is a lower bound on every roster's objective (the pricing ignores rest conflicts beyond the next
 * day: a relaxation). When no line has a negative reduced cost, L equals the master's optimum: the
 * column-generation bound. Unlike the compact MIP's LP bound it knows every per-person rule (runs,
 * weekends, hours) exactly, which is where the compact relaxation is weak (SOURCES.md §5b: on
 * benchmark instances 1-9 the column-generation LP bound is within 1% of the optimum but on 1 and 9).
 */
import type { ProblemIndex } from '../model/context';
import type { HighsSession } from '../solve/highs-session';
import { LineDp } from '../search/line-dp';
import { type DiveResult, lineDive } from '../search/line-dive';
import { withLineColumns, type LineColumns } from './line-columns';
import { LineMaster, type PersonLine } from './line-master';

export interface LineBoundOptions {
  /** Stop after this many milliseconds (the best bound so far is returned). */
  timeLimitMs: number;
  /** Lines to start from (person-major, D days each, -1 off), e.g. the search's best roster. */
  seed?: Int16Array | null;
  /** Stop as soon as the bound reaches this value (e.g. the best roster's objective). */
  target?: number;
  /** Asked between iterations: true stops. */
  shouldStop?: () => boolean;
  /**
   * After the bound, a roster by diving on the same master (search/line-dive.ts), pricing for at
   * most this many milliseconds more (0 or absent: none; a function is asked once the bound is done).
   */
  diveMs?: number | (() => number);
  /**
   * Give up once the master's value falls below this (the bound can then only be lower still: the
   * master's value is an upper bound on it), or when three quarters of the time have gone without a
   * bound above it; no dive follows.
   */
  giveUpBelow?: number;
}

export interface LineBoundResult {
  /** Best lower bound found, or null when none (a person with no rule-keeping line, or no time). */
  bound: number | null;
  /** The master LP's value at the end (an upper bound on the column-generation bound). */
  master: number | null;
  /** No line with a negative reduced cost was left: `bound` is the column-generation bound. */
  converged: boolean;
  iterations: number;
  columns: number;
  ms: number;
  pricingMs: number;
  masterMs: number;
  /** Most labels the exact pricing kept on one day (search/line-dp.ts EXACT_MAX_LABELS). */
  peakLabels: number;
  /** Stopped by `giveUpBelow`: the bound would have been worth nothing to the caller. */
  gaveUp: boolean;
  /** The master's line columns (each keeps every rule of its person), for search/line-pack.ts. */
  lines: PersonLine[];
  /** The dive's roster (with `diveMs`), or null. */
  dive: DiveResult | null;
  /** Milliseconds spent diving, whether or not it gave a roster (included in `ms`). */
  diveSpentMs: number;
}

/**
 * Exact pricing rounds a solve is expected to need (benchmark instances 1-12: 2-6 once the capped
 * rounds have found most columns); a probe longer than the time limit / (people × this) skips it.
 */
const EXACT_ROUNDS_EXPECTED = 4;
/** Share of the time after which a bound still below `giveUpBelow` (or none) gives up. */
const GIVE_UP_LATE_SHARE = 0.75;

export function lineBound(
  index: ProblemIndex,
  session: HighsSession,
  options: LineBoundOptions,
): LineBoundResult {
  const t0 = performance.now();
  const elapsed = (): number => performance.now() - t0;
  const { P, D, S } = index;
  const exact = new LineDp(index, { exact: true });
  // Capped pricing finds most columns at a fraction of the time (instance 8: ~3 s a round exact);
  // only exact rounds give a bound, run when the capped one finds nothing or time runs short.
  const fast = new LineDp(index, { cost: exact.cost });
  const master = new LineMaster(index, exact.cost);
  const result: LineBoundResult = {
    bound: null,
    master: null,
    converged: false,
    iterations: 0,
    columns: 0,
    ms: 0,
    pricingMs: 0,
    masterMs: 0,
    peakLabels: 0,
    lines: [],
    dive: null,
    diveSpentMs: 0,
    gaveUp: false,
  };
  // A probe: one exact line; when exact pricing cannot finish or would not leave time for a few
  // rounds, there will be no bound (benchmark instance 14: over 100,000 labels a day; instance 8:
  // 5 s a round), so the time goes back to the caller at once.
  const zero = new Float64Array(D * S);
  const tProbe = performance.now();
  exact.solve(0, zero);
  const probeMs = performance.now() - tProbe;
  if (P > 0 && (!exact.lowestIsExact || probeMs * P * EXACT_ROUNDS_EXPECTED > options.timeLimitMs)) {
    result.peakLabels = exact.peakLabels;
    result.ms = elapsed();
    return result;
  }

  // First lines: the seed's where they keep every rule, else the person's cheapest line alone.
  const first: Int16Array[] = [];
  for (let p = 0; p < P; p++) {
    let line: Int16Array | null = null;
    if (options.seed) {
      const seeded = options.seed.slice(p * D, p * D + D);
      if (master.scoreLine(p, seeded).hard === 0) line = seeded;
    }
    line ??= exact.solve(p, zero);
    if (!line) {
      result.ms = elapsed();
      return result;
    }
    first.push(line);
  }

  withLineColumns(index, session, master, first, (columns) => {
    result.lines = columns.pool;
    generate(columns, exact, fast, options, elapsed, result);
    // A master given up on has nothing to dive on (asked for no dive time either).
    const diveMs = result.gaveUp
      ? 0
      : typeof options.diveMs === 'function'
        ? options.diveMs()
        : (options.diveMs ?? 0);
    // No dive once the bound has reached the target (the roster it came from is then optimal).
    const reached = options.target !== undefined && result.bound !== null && result.bound >= options.target;
    if (diveMs > 0 && result.master !== null && !reached && !options.shouldStop?.()) {
      const t1 = performance.now();
      result.dive = lineDive(columns, fast, { timeLimitMs: diveMs, shouldStop: options.shouldStop });
      result.diveSpentMs = performance.now() - t1;
    }
    result.masterMs = columns.masterMs;
    result.pricingMs = columns.pricingMs;
  });
  result.peakLabels = exact.peakLabels;
  result.ms = elapsed();
  return result;
}

/** Column generation until no line has a negative reduced cost, the time is up or the target is met. */
function generate(
  columns: LineColumns,
  exact: LineDp,
  fast: LineDp,
  options: LineBoundOptions,
  elapsed: () => number,
  result: LineBoundResult,
): void {
  const P = columns.index.P;
  let useFast = true;
  for (;;) {
    if (!columns.solve()) break;
    result.master = columns.value();
    // Given up when the master is already below the threshold, or when three quarters of the time
    // have gone without a bound above it (the generated ward at 300 s: the master still at 122
    // against a roster of 298 after 116 s, every bound negative).
    const late = elapsed() > GIVE_UP_LATE_SHARE * options.timeLimitMs;
    if (
      options.giveUpBelow !== undefined &&
      (result.master < options.giveUpBelow ||
        (late && (result.bound === null || result.bound < options.giveUpBelow)))
    ) {
      result.gaveUp = true;
      break;
    }
    // Any multipliers give a bound (line-columns.ts keeps every slack's term finite).
    let lagrangian = columns.constant;
    let added = 0;
    let complete = true;
    let stopped = false;
    const useExact = !useFast || (result.bound === null && elapsed() > options.timeLimitMs / 2);
    const dp = useExact ? exact : fast;
    for (let p = 0; p < P; p++) {
      if (columns.price(p, dp)) added++;
      if (useExact && !dp.lowestIsExact) {
        // Too many labels for an exact answer: no bound can come from further rounds either.
        stopped = true;
        break;
      }
      if (!useExact || !Number.isFinite(dp.lowest)) complete = false;
      else lagrangian += dp.lowest;
      if (elapsed() > options.timeLimitMs || options.shouldStop?.()) {
        stopped = true;
        break;
      }
    }
    result.iterations++;
    result.columns += added;
    if (stopped) break;
    if (complete && (result.bound === null || lagrangian > result.bound)) result.bound = lagrangian;
    if (useExact && added === 0) {
      result.converged = complete;
      break;
    }
    // Capped pricing found nothing: the next round is exact; exact found some: capped again.
    useFast = !(useFast && added === 0);
    if (options.target !== undefined && result.bound !== null && result.bound >= options.target) break;
  }
}
