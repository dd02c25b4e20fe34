/**
 * Column generation over people's lines: the master LP (line-master.ts) kept in one HiGHS model and
 * re-solved from its last basis as columns arrive, its pool of lines, and pricing by the best-line
 * programme (search/line-dp.ts) at the master's duals. Shared by the bound (line-bound.ts) and the
 * dive (search/line-dive.ts), which run one after the other on the same model.
 *
 * Duals: π of the cover rows (taken ≥ −wOver so every slack's Lagrangian term is finite), α and β
 * of the spread rows (taken ≥ 0). Person p's line then costs
 *   cost(line) − Σ_i π_i·covers_i(line) + Σ_groups (α_p − β_p)·count(line),
 * and its reduced cost is that minus the dual of p's row.
 */
import type { Model } from 'highs';
import type { ProblemIndex } from '../model/context';
import type { HighsSession } from '../solve/highs-session';
import type { LineDp } from '../search/line-dp';
import { type LineMaster, nightsOf, type PersonLine } from './line-master';

/** Reduced costs above this count as zero (the master's duals carry HiGHS's tolerances). */
const RC_TOLERANCE = 1e-6;

export class LineColumns {
  readonly pool: PersonLine[];
  /** The Lagrangian value at the current duals without the people's cheapest lines (see line-bound.ts). */
  constant = 0;
  masterMs = 0;
  pricingMs = 0;
  private duals: ArrayLike<number> = [];
  private readonly pi: Float64Array;
  private readonly extra: Float64Array;

  constructor(
    readonly index: ProblemIndex,
    readonly master: LineMaster,
    readonly model: Model,
    readonly session: HighsSession,
    first: readonly Int16Array[],
  ) {
    this.pool = first.map((line, person) => ({ person, line }));
    this.pi = new Float64Array(master.N);
    this.extra = new Float64Array(index.D * index.S);
  }

  /** Solves the master LP; false when HiGHS does not reach its optimum. Reads the duals. */
  solve(): boolean {
    const tm = performance.now();
    this.model.run();
    this.masterMs += performance.now() - tm;
    if (this.model.getModelStatus() !== this.session.highs.constants.modelStatus.optimal) return false;
    const duals = (this.duals = this.model.getSolution().rowDual);
    const { N, needs, weights, spreads } = this.master;
    let constant = 0;
    for (let i = 0; i < N; i++) {
      const pi = (this.pi[i] = Math.max(duals[i], -weights[i].over));
      const min = Math.max(0, needs[i].min);
      constant += pi * needs[i].target;
      constant += Math.min(0, weights[i].underMin - pi) * min;
      constant += Math.min(0, weights[i].underTarget - pi) * Math.max(0, needs[i].target - min);
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
      constant += (Math.min(0, g.weight - alphas) + Math.min(0, betas - g.weight)) * g.most;
    }
    this.constant = constant;
    return true;
  }

  /** The master LP's objective value after `solve`. */
  value(): number {
    return this.model.getObjectiveValue();
  }

  /** The value of line column k (an index into `pool`) after `solve`. */
  lambda(): (k: number) => number {
    const values = this.model.getSolution().colValue;
    const first = this.master.slackColumns;
    return (k) => values[first + k];
  }

  /**
   * Prices person p with `dp` at the current duals: adds the best line when its reduced cost is
   * negative. Returns whether it added one (dp.lowest and dp.lowestIsExact tell the rest).
   */
  price(p: number, dp: LineDp): boolean {
    const tp = performance.now();
    const { D, S } = this.index;
    const { N, spreads, needsAt, lc } = this.master;
    let perNight = 0;
    let perWeekend = 0;
    for (const g of spreads) {
      if (g.hiRow[p] < 0) continue;
      const price = g.alpha[p] - g.beta[p];
      if (g.count === nightsOf) perNight += price;
      else perWeekend += price;
    }
    const extra = this.extra;
    for (let ds = 0; ds < D * S; ds++) {
      let e = lc.night[ds % S] === 1 ? perNight : 0;
      for (const i of needsAt[p][ds]) e -= this.pi[i];
      extra[ds] = e;
    }
    const line = dp.solve(p, extra, perWeekend);
    let added = false;
    if (line) {
      const c = this.master.column(p, line);
      let reduced = c.cost + perWeekend * this.master.score.weekends - this.duals[N + p];
      for (let d = 0; d < D; d++) {
        const s = line[d];
        if (s >= 0) reduced += extra[d * S + s];
      }
      if (reduced < -RC_TOLERANCE) {
        this.model.addCol(c.cost, 0, Infinity, { indices: c.indices, values: c.values });
        this.pool.push({ person: p, line });
        added = true;
      }
    }
    this.pricingMs += performance.now() - tp;
    return added;
  }

  /** Fixes line column k to 1 (its person takes that line; the person's other lines go to 0). */
  fix(k: number): void {
    this.model.changeColBounds(this.master.slackColumns + k, 1, 1);
  }
}

/**
 * Runs `fn` with the master over the `first` lines (one per person) in a HiGHS model of `session`;
 * the model is freed afterwards.
 */
export function withLineColumns<T>(
  index: ProblemIndex,
  session: HighsSession,
  master: LineMaster,
  first: readonly Int16Array[],
  fn: (columns: LineColumns) => T,
): T {
  const pool = first.map((line, person) => ({ person, line }));
  return session.withModel(master.model(pool), (model) => {
    model.options.set('output_flag', false);
    // New columns keep the basis primal feasible: primal simplex goes on from it (instance 12:
    // master time 19 s against 38 s with the default dual simplex, same run under load).
    model.options.set('simplex_strategy', 4);
    return fn(new LineColumns(index, master, model, session, first));
  });
}
