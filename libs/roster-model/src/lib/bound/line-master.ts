/**
 * The master problem over people's lines (the set-partitioning model of rostering): one column per
 * person and whole line, and the rows that couple people. Shared by the column-generation bound
 * (line-bound.ts, its linear relaxation) and the roster from the generated lines
 * (search/line-pack.ts, the same model with whole lines).
 *
 *   min Σ cost(line)·λ + Σ_i (wMin_i·uMin_i + wTarget_i·uTarget_i + wOver_i·over_i)
 *       + Σ_groups weight·(hi − lo)
 *   s.t. Σ covers_i(line)·λ + uMin_i + uTarget_i − over_i = target_i   for every cover need i,
 *        Σ_lines of p λ = 1                                          for every person p,
 *        hi − Σ count_p(line)·λ ≥ 0 and Σ count_p(line)·λ − lo ≥ 0     for every person of a spread,
 *        λ ≥ 0, 0 ≤ uMin_i ≤ min_i, 0 ≤ uTarget_i ≤ target_i − min_i, over_i ≥ 0, hi, lo in [0, most],
 * where cost(line) is everything that depends on the person alone (LineCost's soft cost) and every
 * hard rule of the person is in the choice of lines (every hard rule of the product is a rule of one
 * person). With λ whole, its value is the roster's objective exactly.
 */
import type { ModelData } from 'highs';
import type { ProblemIndex } from '../model/context';
import type { CoverNeed, Roster } from '../problem';
import { nightEligible } from '../goals/fair-nights';
import type { LineCost, LineScore } from '../search/line-cost';

/** A fairness spread in the master: its weight, people, largest count, rows and current duals. */
export interface Spread {
  weight: number;
  people: number[];
  most: number;
  hiRow: Int32Array;
  loRow: Int32Array;
  count: (score: LineScore) => number;
  alpha: Float64Array;
  beta: Float64Array;
}

/** A line of one person: `line[d]` is the shift type index worked on day d, or -1. */
export interface PersonLine {
  person: number;
  line: Int16Array;
}

export interface MasterColumn {
  cost: number;
  indices: number[];
  values: number[];
}

/** The roster as lines, person-major (D days each, -1 off). */
export function linesOf(index: ProblemIndex, roster: Roster): Int16Array {
  const lines = new Int16Array(index.P * index.D);
  index.toGrid(roster).grid.forEach((line, p) => lines.set(line, p * index.D));
  return lines;
}

/** The roster of person-major lines (D days each, -1 off). */
export function rosterOfLines(index: ProblemIndex, lines: Int16Array): Roster {
  const { P, D } = index;
  return index.fromGrid(Array.from({ length: P }, (_, p) => Array.from(lines.subarray(p * D, (p + 1) * D))));
}

export function nightsOf(score: LineScore): number {
  return score.nights;
}

export class LineMaster {
  readonly needs: CoverNeed[];
  readonly N: number;
  readonly weights: { underMin: number; underTarget: number; over: number }[];
  /** needsAt[p][d * S + s]: the needs a worked (d, s) of person p counts towards. */
  readonly needsAt: number[][][];
  readonly spreads: Spread[] = [];
  /** Rows: cover needs, one per person, then each spread's hi and lo rows of its people. */
  readonly numRows: number;
  /** The last line scored by `column` (its person's nights and weekends). */
  readonly score: LineScore = { hard: 0, soft: 0, nights: 0, weekends: 0 };
  private readonly grid: Int16Array;

  constructor(
    readonly index: ProblemIndex,
    readonly lc: LineCost,
  ) {
    const { P, D, S, problem } = index;
    this.needs = problem.coverNeeds;
    const N = (this.N = this.needs.length);
    this.weights = this.needs.map((need) => ({
      underMin: need.weightUnderMin ?? index.weights.coverUnderMin,
      underTarget: need.weightUnderTarget ?? index.weights.coverUnderTarget,
      over: need.weightOver ?? index.weights.coverOver,
    }));
    this.needsAt = Array.from({ length: P }, () => Array.from({ length: D * S }, () => []));
    this.needs.forEach((need, i) => {
      const s = index.shiftIndex.get(need.shiftTypeId);
      if (s === undefined || need.day < 0 || need.day >= D) return;
      for (let p = 0; p < P; p++) {
        if (need.skillId === null || index.skills[p].has(need.skillId))
          this.needsAt[p][need.day * S + s].push(i);
      }
    });
    let nextRow = N + P;
    const addSpread = (weight: number, people: number[], most: number, count: Spread['count']): void => {
      if (weight === 0 || people.length < 2 || most === 0) return;
      const hiRow = new Int32Array(P).fill(-1);
      const loRow = new Int32Array(P).fill(-1);
      for (const p of people) {
        hiRow[p] = nextRow++;
        loRow[p] = nextRow++;
      }
      this.spreads.push({
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
    this.numRows = nextRow;
    this.grid = new Int16Array(P * D);
  }

  /** Scores person p's line into `score` (hard is 0 when it keeps every rule of the person). */
  scoreLine(p: number, line: Int16Array): LineScore {
    this.grid.set(line, p * this.index.D);
    this.lc.score(p, this.grid, this.score);
    return this.score;
  }

  /** The line's cost and its master column; `score` holds the line's score afterwards. */
  column(p: number, line: Int16Array): MasterColumn {
    const { D, S } = this.index;
    const sc = this.scoreLine(p, line);
    const entries = new Map<number, number>();
    for (let d = 0; d < D; d++) {
      const s = line[d];
      if (s >= 0) for (const i of this.needsAt[p][d * S + s]) entries.set(i, 1);
    }
    entries.set(this.N + p, 1);
    for (const g of this.spreads) {
      const n = g.count(sc);
      if (g.hiRow[p] < 0 || n === 0) continue;
      entries.set(g.hiRow[p], -n);
      entries.set(g.loRow[p], n);
    }
    const indices = [...entries.keys()].sort((a, b) => a - b);
    return { cost: sc.soft, indices, values: indices.map((i) => entries.get(i)!) };
  }

  /** Columns before the lines': uMin, uTarget, over per need, then hi and lo per spread. */
  get slackColumns(): number {
    return 3 * this.N + 2 * this.spreads.length;
  }

  /**
   * The master with the given lines as its columns after the slack columns (`integer`: every line
   * column 0/1, the model whose optimum is the best roster made of these lines).
   */
  model(lines: readonly PersonLine[], integer = false): ModelData {
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
    this.needs.forEach((need, i) => {
      const w = this.weights[i];
      addColumn(w.underMin, Math.max(0, need.min), [i], [1]);
      addColumn(w.underTarget, Math.max(0, need.target - Math.max(0, need.min)), [i], [1]);
      addColumn(w.over, Infinity, [i], [-1]);
    });
    for (const g of this.spreads) {
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
    for (const { person, line } of lines) {
      const c = this.column(person, line);
      addColumn(c.cost, integer ? 1 : Infinity, c.indices, c.values);
    }
    const numCols = colCost.length;
    const { N, numRows } = this;
    const P = this.index.P;
    const rowLower = [
      ...this.needs.map((n) => n.target),
      ...new Array<number>(P).fill(1),
      ...new Array<number>(numRows - N - P).fill(0),
    ];
    const rowUpper = [
      ...this.needs.map((n) => n.target),
      ...new Array<number>(P).fill(1),
      ...new Array<number>(numRows - N - P).fill(Infinity),
    ];
    return {
      numCols,
      numRows,
      colCost,
      colLower,
      colUpper,
      rowLower,
      rowUpper,
      matrix: { format: 'csc', numRows, numCols, starts, indices: rowIndex, values },
      ...(integer
        ? {
            integrality: colCost.map((_, j) => (j < this.slackColumns ? 0 : 1)) as (0 | 1)[],
          }
        : {}),
    } as ModelData;
  }

  /**
   * Every column's value for the roster that takes line `chosen[p]` (an index into `lines`) for each
   * person p: the slack columns at their cheapest values (shortfall below target first, then below
   * minimum; the spreads at the largest and smallest count).
   */
  values(lines: readonly PersonLine[], chosen: readonly number[]): Float64Array {
    const { N } = this;
    const out = new Float64Array(this.slackColumns + lines.length);
    const covered = new Float64Array(N);
    const counts = this.spreads.map(() => ({ hi: 0, lo: Infinity }));
    for (const k of chosen) {
      const { person, line } = lines[k];
      out[this.slackColumns + k] = 1;
      const c = this.column(person, line);
      for (const i of c.indices) if (i < N) covered[i] += 1;
      this.spreads.forEach((g, j) => {
        if (g.hiRow[person] < 0) return;
        const n = g.count(this.score);
        counts[j].hi = Math.max(counts[j].hi, n);
        counts[j].lo = Math.min(counts[j].lo, n);
      });
    }
    this.needs.forEach((need, i) => {
      const min = Math.max(0, need.min);
      const short = Math.max(0, need.target - covered[i]);
      const underTarget = Math.min(short, Math.max(0, need.target - min));
      out[3 * i] = short - underTarget;
      out[3 * i + 1] = underTarget;
      out[3 * i + 2] = Math.max(0, covered[i] - need.target);
    });
    counts.forEach((c, j) => {
      out[3 * N + 2 * j] = c.hi;
      out[3 * N + 2 * j + 1] = Number.isFinite(c.lo) ? c.lo : 0;
    });
    return out;
  }
}
