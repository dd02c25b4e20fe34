/**
 * A lower bound on the best roster by column generation over people's lines (the linear relaxation
 * of the set-partitioning model of rostering: one column per person and whole line).
 *
 * Master LP (kept in one HiGHS model and re-solved from its last basis as columns are added):
 *   min Σ cost(line)·λ + Σ_i (wMin_i·uMin_i + wTarget_i·uTarget_i + wOver_i·over_i)
 *   s.t. Σ covers_i(line)·λ + uMin_i + uTarget_i − over_i = target_i   for every cover need i,
 *        Σ_lines of p λ = 1                                          for every person p,
 *        λ ≥ 0, 0 ≤ uMin_i ≤ min_i, 0 ≤ uTarget_i ≤ target_i − min_i, over_i ≥ 0,
 * where cost(line) is everything that depends on the person alone (LineCost's soft cost) and every
 * hard rule of the person is in the choice of lines. Pricing is line-dp.ts with no caps (exact).
 *
 * The two fairness spreads (goals/spread.ts: weight·(hi − lo) with hi ≥ count_p ≥ lo, counts of
 * nights and of worked weekends) are rows of the master too: hi − Σ count·λ ≥ 0 and
 * Σ count·λ − lo ≥ 0 per person of the group, hi and lo in [0, most possible].
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
import { nightEligible } from '../goals/fair-nights';
import { LineDp } from '../search/line-dp';
import type { LineScore } from '../search/line-cost';

export interface LineBoundOptions {
  /** Stop after this many milliseconds (the best bound so far is returned). */
  timeLimitMs: number;
  /** Lines to start from (person-major, D days each, -1 off), e.g. the search's best roster. */
  seed?: Int16Array | null;
  /** Stop as soon as the bound reaches this value (e.g. the best roster's objective). */
  target?: number;
  /** Asked between iterations: true stops. */
  shouldStop?: () => boolean;
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
}

/**
 * Exact pricing rounds a solve is expected to need (benchmark instances 1-12: 2-6 once the capped
 * rounds have found most columns); a probe longer than the time limit / (people × this) skips it.
 */
const EXACT_ROUNDS_EXPECTED = 4;

/** Reduced costs above this count as zero (the master's duals carry HiGHS's tolerances). */
const RC_TOLERANCE = 1e-6;

export function lineBound(
  index: ProblemIndex,
  session: HighsSession,
  options: LineBoundOptions,
): LineBoundResult {
  const t0 = performance.now();
  const elapsed = (): number => performance.now() - t0;
  const { P, D, S, problem } = index;
  const exact = new LineDp(index, { exact: true });
  // Capped pricing finds most columns at a fraction of the time (instance 8: ~3 s a round exact);
  // only exact rounds give a bound, run when the capped one finds nothing or time runs short.
  const fast = new LineDp(index, { cost: exact.cost });
  const lc = exact.cost;
  const needs = problem.coverNeeds;
  const N = needs.length;
  const weights = needs.map((need) => ({
    underMin: need.weightUnderMin ?? index.weights.coverUnderMin,
    underTarget: need.weightUnderTarget ?? index.weights.coverUnderTarget,
    over: need.weightOver ?? index.weights.coverOver,
  }));
  // needsAt[p][d * S + s]: the needs a worked (d, s) of person p counts towards.
  const needsAt: number[][][] = Array.from({ length: P }, () => Array.from({ length: D * S }, () => []));
  needs.forEach((need, i) => {
    const s = index.shiftIndex.get(need.shiftTypeId);
    if (s === undefined || need.day < 0 || need.day >= D) return;
    for (let p = 0; p < P; p++) {
      if (need.skillId === null || index.skills[p].has(need.skillId)) needsAt[p][need.day * S + s].push(i);
    }
  });

  // Rows: cover needs, one line per person, then each spread's hi and lo rows of its people.
  const spreads: Spread[] = [];
  let nextRow = N + P;
  const addSpread = (weight: number, people: number[], most: number, count: Spread['count']): void => {
    if (weight === 0 || people.length < 2 || most === 0) return;
    const hiRow = new Int32Array(P).fill(-1);
    const loRow = new Int32Array(P).fill(-1);
    for (const p of people) {
      hiRow[p] = nextRow++;
      loRow[p] = nextRow++;
    }
    spreads.push({
      weight,
      people,
      most,
      hiRow,
      loRow,
      count,
      alpha: new Float64Array(P),
      beta: new Float64Array(P),
    });
  };
  addSpread(index.weights.fairNights, nightEligible(index), D, nightsOf);
  addSpread(index.weights.fairWeekends, [...Array(P).keys()], index.weekends.length, (sc) => sc.weekends);

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
  };
  const score: LineScore = { hard: 0, soft: 0, nights: 0, weekends: 0 };
  const grid = new Int16Array(P * D);
  /** Scores person p's line into `score`. */
  const scoreLine = (p: number, line: Int16Array): LineScore => {
    grid.set(line, p * D);
    lc.score(p, grid, score);
    return score;
  };
  /** The line's cost and its master column (after scoreLine). */
  const column = (p: number, line: Int16Array): { cost: number; indices: number[]; values: number[] } => {
    const sc = scoreLine(p, line);
    const entries = new Map<number, number>();
    for (let d = 0; d < D; d++) {
      const s = line[d];
      if (s >= 0) for (const i of needsAt[p][d * S + s]) entries.set(i, 1);
    }
    entries.set(N + p, 1);
    for (const g of spreads) {
      const n = g.count(sc);
      if (g.hiRow[p] < 0 || n === 0) continue;
      entries.set(g.hiRow[p], -n);
      entries.set(g.loRow[p], n);
    }
    const indices = [...entries.keys()].sort((a, b) => a - b);
    return { cost: sc.soft, indices, values: indices.map((i) => entries.get(i)!) };
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
      if (scoreLine(p, seeded).hard === 0) line = seeded;
    }
    line ??= exact.solve(p, zero);
    if (!line) {
      result.ms = elapsed();
      return result;
    }
    first.push(line);
  }

  // Master: slack columns per need (uMin, uTarget, over), hi and lo per spread, one per line.
  const colCost: number[] = [];
  const colLower: number[] = [];
  const colUpper: number[] = [];
  const starts: number[] = [0];
  const rowIndex: number[] = [];
  const values: number[] = [];
  const addColumn = (cost: number, upper: number, indices: number[], coefs: number[]): void => {
    colCost.push(cost);
    colLower.push(0);
    colUpper.push(upper);
    rowIndex.push(...indices);
    values.push(...coefs);
    starts.push(rowIndex.length);
  };
  needs.forEach((need, i) => {
    const w = weights[i];
    addColumn(w.underMin, Math.max(0, need.min), [i], [1]);
    addColumn(w.underTarget, Math.max(0, need.target - Math.max(0, need.min)), [i], [1]);
    addColumn(w.over, Infinity, [i], [-1]);
  });
  for (const g of spreads) {
    addColumn(
      g.weight,
      g.most,
      g.people.map((p) => g.hiRow[p]),
      g.people.map(() => 1),
    );
    addColumn(
      -g.weight,
      g.most,
      g.people.map((p) => g.loRow[p]),
      g.people.map(() => -1),
    );
  }
  first.forEach((line, p) => {
    const c = column(p, line);
    addColumn(c.cost, Infinity, c.indices, c.values);
  });
  const numCols = colCost.length;
  const numRows = nextRow;
  const rowLower = [
    ...needs.map((n) => n.target),
    ...new Array<number>(P).fill(1),
    ...new Array<number>(numRows - N - P).fill(0),
  ];
  const rowUpper = [
    ...needs.map((n) => n.target),
    ...new Array<number>(P).fill(1),
    ...new Array<number>(numRows - N - P).fill(Infinity),
  ];

  session.withModel(
    {
      numCols,
      numRows,
      colCost,
      colLower,
      colUpper,
      rowLower,
      rowUpper,
      matrix: { format: 'csc', numRows, numCols, starts, indices: rowIndex, values },
    },
    (model) => {
      model.options.set('output_flag', false);
      // New columns keep the basis primal feasible: primal simplex goes on from it (instance 12:
      // master time 19 s against 38 s with the default dual simplex, same run under load).
      model.options.set('simplex_strategy', 4);
      const extra = new Float64Array(D * S);
      const pi = new Float64Array(N);
      let useFast = true;
      let stopped = false;
      for (;;) {
        const tm = performance.now();
        model.run();
        result.masterMs += performance.now() - tm;
        const status = model.getModelStatus();
        if (status !== session.highs.constants.modelStatus.optimal) break;
        result.master = model.getObjectiveValue();
        const duals = model.getSolution().rowDual;
        // Any multipliers give a bound; these keep every slack's term finite.
        let lagrangian = 0;
        for (let i = 0; i < N; i++) {
          pi[i] = Math.max(duals[i], -weights[i].over);
          const need = needs[i];
          const min = Math.max(0, need.min);
          lagrangian += pi[i] * need.target;
          lagrangian += Math.min(0, weights[i].underMin - pi[i]) * min;
          lagrangian += Math.min(0, weights[i].underTarget - pi[i]) * Math.max(0, need.target - min);
        }
        for (const g of spreads) {
          let alphas = 0;
          let betas = 0;
          for (const p of g.people) {
            g.alpha[p] = Math.max(0, duals[g.hiRow[p]]);
            g.beta[p] = Math.max(0, duals[g.loRow[p]]);
            alphas += g.alpha[p];
            betas += g.beta[p];
          }
          lagrangian += (Math.min(0, g.weight - alphas) + Math.min(0, betas - g.weight)) * g.most;
        }
        const tp = performance.now();
        let added = 0;
        let complete = true;
        const useExact = !useFast || (result.bound === null && elapsed() > options.timeLimitMs / 2);
        const dp = useExact ? exact : fast;
        for (let p = 0; p < P; p++) {
          let perNight = 0;
          let perWeekend = 0;
          for (const g of spreads) {
            if (g.hiRow[p] < 0) continue;
            const price = g.alpha[p] - g.beta[p];
            if (g.count === nightsOf) perNight += price;
            else perWeekend += price;
          }
          for (let ds = 0; ds < D * S; ds++) {
            let e = lc.night[ds % S] === 1 ? perNight : 0;
            for (const i of needsAt[p][ds]) e -= pi[i];
            extra[ds] = e;
          }
          const line = dp.solve(p, extra, perWeekend);
          if (useExact && !dp.lowestIsExact) {
            // Too many labels for an exact answer: no bound can come from further rounds either.
            stopped = true;
            break;
          }
          if (!useExact || !Number.isFinite(dp.lowest)) complete = false;
          else lagrangian += dp.lowest;
          if (line) {
            const c = column(p, line);
            let reduced = c.cost + perWeekend * score.weekends - duals[N + p];
            for (let d = 0; d < D; d++) {
              const s = line[d];
              if (s >= 0) reduced += extra[d * S + s];
            }
            if (reduced < -RC_TOLERANCE) {
              model.addCol(c.cost, 0, Infinity, { indices: c.indices, values: c.values });
              added++;
            }
          }
          if (elapsed() > options.timeLimitMs || options.shouldStop?.()) {
            stopped = true;
            break;
          }
        }
        result.pricingMs += performance.now() - tp;
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
    },
  );
  result.peakLabels = exact.peakLabels;
  result.ms = elapsed();
  return result;
}

/** A fairness spread in the master: its weight, people, largest count, rows and current duals. */
interface Spread {
  weight: number;
  people: number[];
  most: number;
  hiRow: Int32Array;
  loRow: Int32Array;
  count: (score: LineScore) => number;
  alpha: Float64Array;
  beta: Float64Array;
}

function nightsOf(score: LineScore): number {
  return score.nights;
}
