/**
 * A roster by diving in the master over people's lines (bound/line-columns.ts), after the
 * column-generation bound: repeatedly take the line the master LP likes best (every line at 1 at
 * once, else the one person's line with the largest value), fix it, and generate columns again for
 * the people still free until none has a line with a negative reduced cost; when everyone is fixed,
 * the master's value is the roster's objective. This is the pure diving heuristic of
 * branch-and-price (R. Sadykov, F. Vanderbeck, A. Pessoa, I. Tahiri, E. Uchoa, "Primal heuristics
 * for branch and price: the assets of diving methods", INFORMS Journal on Computing 31(2), 2019).
 *
 * The master always stays feasible (every cover row has its shortfall and surplus columns), and
 * every line keeps every rule of its person, so the dive always ends with a roster that keeps every
 * hard rule. Past its time limit it stops pricing and only fixes (a rounding of the LP); when the
 * time so far says it will not finish in time, it gives up (no roster) and leaves the time to others.
 */
import type { LineColumns } from '../bound/line-columns';
import type { LineDp } from './line-dp';

export interface DiveOptions {
  /** Pricing stops after this many milliseconds; the dive then only fixes lines. */
  timeLimitMs: number;
  /** Asked between steps: true abandons the dive (no roster). */
  shouldStop?: () => boolean;
}

export interface DiveResult {
  /** The roster (person-major, D days each, -1 off). */
  grid: Int16Array;
  /** Its objective (the master's value with every person fixed). */
  objective: number;
  /** Lines fixed one at a time (with pricing after each). */
  steps: number;
  ms: number;
}

/**
 * The dive gives up once the time so far, scaled to everybody, exceeds its limit by this factor
 * (the people fixed early go fastest, as the LP then fixes many at once).
 */
const GIVE_UP_FACTOR = 1.5;

/** A line's value at or above this counts as taken: every such line is fixed at once. */
const TAKEN = 0.999;

export function lineDive(columns: LineColumns, dp: LineDp, options: DiveOptions): DiveResult | null {
  const t0 = performance.now();
  const { P, D } = columns.index;
  const pool = columns.pool;
  const fixed = new Int32Array(P).fill(-1);
  // Fixing changes bounds only: the dual simplex goes on from the last basis.
  columns.model.options.set('simplex_strategy', 1);
  let steps = 0;
  for (;;) {
    if (options.shouldStop?.() || !columns.solve()) return null;
    const lambda = columns.lambda();
    let best = -1;
    let bestValue = -1;
    const taken: number[] = [];
    for (let k = 0; k < pool.length; k++) {
      if (fixed[pool[k].person] >= 0) continue;
      const value = lambda(k);
      if (value >= TAKEN) taken.push(k);
      if (value > bestValue) {
        bestValue = value;
        best = k;
      }
    }
    if (best < 0) break;
    for (const k of taken.length > 0 ? taken : [best]) {
      if (fixed[pool[k].person] >= 0) continue;
      fixed[pool[k].person] = k;
      columns.fix(k);
    }
    if (taken.length > 0) continue;
    steps++;
    // A dive that would run out of pricing time ends in a rounding of the LP, far worse than its
    // own end (benchmark instance 12: 6,973 against 4,040): give the time back instead.
    let done = 0;
    for (let p = 0; p < P; p++) if (fixed[p] >= 0) done++;
    const spent = performance.now() - t0;
    if (done < P && spent * (P / done) > options.timeLimitMs * GIVE_UP_FACTOR) return null;
    // Columns for the people still free, until none prices out or the time is up.
    while (performance.now() - t0 < options.timeLimitMs) {
      if (options.shouldStop?.() || !columns.solve()) return null;
      let added = 0;
      for (let p = 0; p < P; p++) if (fixed[p] < 0 && columns.price(p, dp)) added++;
      if (added === 0) break;
    }
  }
  const grid = new Int16Array(P * D).fill(-1);
  for (let p = 0; p < P; p++) grid.set(pool[fixed[p]].line, p * D);
  return { grid, objective: columns.value(), steps, ms: performance.now() - t0 };
}
