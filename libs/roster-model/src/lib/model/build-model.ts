/**
 * buildModel(problem) turns a RosterProblem into a 0/1 integer program for HiGHS.
 *
 * Public interface (used by solve/, explain/, bench/ and the API):
 *   const m = buildModel(problem);            // throws InvalidProblemError on bad input
 *   highs.createModel(m.arrays)               // arrays match highs' ModelData (minimise, CSR matrix,
 *                                             //   integrality only on x, colNames/rowNames set)
 *   m.columns[j] / m.rows[i]                  // what column j / row i stands for (rule, person, day, shift)
 *   m.decode(colValue) → Roster               // x > 0.5 → that shift
 *   m.encode(roster) → Float64Array           // full column vector (x and every auxiliary column set
 *                                             //   consistently) for model.setSolution({ colValue })
 *   m.objectiveOf(colValue) → number          // offset + c·x, the value HiGHS reports
 *   m.x(personIndex, day, shiftIndex) → column index or -1 (impossible assignment, no column)
 *   buildModel(problem, { elastic: 1e4 })    // every hard row gets a priced slack: any roster is a solution
 *
 * Columns: x[p,d,s] binary (`x_p_d_s`), only for assignments that are possible (absences, pins to
 * another shift or a day off and maxShiftsPerType 0 remove columns; a missing skill does not);
 * auxiliary columns are continuous (work w[p,d] = Σ_s x, weekend y, run starts v/u, cover slacks,
 * fairness spreads, hours deviation, elastic slacks). Each hard rule (rules/) and soft goal (goals/)
 * adds its own rows and objective terms; see the header of each module for its formulation.
 *
 * Measured on the shift scheduling benchmark (SOURCES.md; 2 shared cores, heavily loaded, so times
 * are only comparable with each other): K + l windows for max consecutive days with min days off
 * raised the LP bound (instance 1: 407 → 426, 4: 1261 → 1420, 5: 711 → 752) and took instance 3
 * from not optimal in 90 s (1103, bound 1000) to proven optimal 1001 in 13.5 s; work columns w cut
 * the matrix by 28% (instance 3: 10,181 → 7,356 nonzeros) and halved the simplex time of the LP of
 * instance 12 (over 150 s → 71 s).
 */
import type { Roster, RosterProblem } from '../problem';
import type { HardRuleName } from '../result';
import { InvalidProblemError, validateProblem } from '../check/validate';
import { GOALS } from '../goals';
import { RULES } from '../rules';
import { MipBuilder, type ColumnMeta, type HighsModelArrays, type RowMeta } from './builder';
import { ModelContext, ProblemIndex, type Grid } from './context';

export interface BuiltModel {
  problem: RosterProblem;
  index: ProblemIndex;
  arrays: HighsModelArrays;
  columns: ColumnMeta[];
  rows: RowMeta[];
  /** Number of x columns (they come first: columns 0 … numX-1). */
  numX: number;
  /** Whether hard rows carry priced slacks (BuildOptions.elastic). */
  elastic: boolean;
  x(personIndex: number, day: number, shiftIndex: number): number;
  decode(values: ArrayLike<number>): Roster;
  encode(roster: Roster): Float64Array;
  objectiveOf(values: ArrayLike<number>): number;
}

export interface BuildOptions {
  /**
   * Elastic mode: every hard-rule row gets a slack column costing this much per unit of violation
   * (days, shifts, minutes … in the row's own unit), so any roster is a solution of the model and
   * the solver trades violations against the objective (minutes rules: this much per longest shift's
   * minutes). For repairing rosters that break rules
   * (fix-and-optimise from an imperfect start) and for finding the least violation. Off by default.
   */
  elastic?: number;
}

const HARD = new Set<string>([
  'oneShiftPerDay',
  'absence',
  'pin',
  'minRest',
  'forbiddenSuccession',
  'maxShiftsPerType',
  'minPaidMinutes',
  'maxPaidMinutes',
  'maxConsecutiveWorkDays',
  'minConsecutiveWorkDays',
  'minConsecutiveDaysOff',
  'maxWeekends',
  'maxConsecutiveNights',
]);

export function buildModel(problem: RosterProblem, options: BuildOptions = {}): BuiltModel {
  const errors = validateProblem(problem);
  if (errors.length) throw new InvalidProblemError(errors);
  const index = new ProblemIndex(problem);
  const builder = new MipBuilder();
  const ctx = new ModelContext(index, builder);
  const numX = builder.numCols;
  for (const rule of RULES) rule.build(ctx);
  for (const goal of GOALS) goal.build(ctx);
  // Elastic slacks: [column, row, +1 for a lower-bound slack / −1 for an upper-bound slack].
  const elastic: [number, number, number][] = [];
  if (options.elastic !== undefined && options.elastic > 0) {
    const rowCount = builder.numRows;
    // Minutes rules are priced per longest shift, not per minute: otherwise one shift short of the
    // minimum hours (480 units) outweighs dozens of day-count violations and fix-and-optimise trades
    // it for them (seen on benchmark instance 8: 5 violations became 31).
    const longestShift = Math.max(1, ...problem.shiftTypes.map((s) => s.paidMinutes));
    for (let i = 0; i < rowCount; i++) {
      const meta = builder.rowMeta[i];
      if (!HARD.has(meta.rule)) continue;
      const [lb, ub] = builder.rowBounds(i);
      if (lb === ub) continue; // definitions (work columns), not rules a roster can break
      const colMeta = {
        kind: 'aux' as const,
        rule: meta.rule as HardRuleName,
        personId: meta.personId,
        day: meta.day,
      };
      const price =
        meta.rule === 'minPaidMinutes' || meta.rule === 'maxPaidMinutes'
          ? options.elastic / longestShift
          : options.elastic;
      if (Number.isFinite(ub)) {
        const c = builder.addColumn(`elU_${i}`, 0, Infinity, price, false, colMeta);
        builder.addToRow(i, c, -1);
        elastic.push([c, i, -1]);
      }
      if (Number.isFinite(lb)) {
        const c = builder.addColumn(`elL_${i}`, 0, Infinity, price, false, colMeta);
        builder.addToRow(i, c, 1);
        elastic.push([c, i, 1]);
      }
    }
  }
  const arrays = builder.toHighsArrays();
  const { P, D, S } = index;

  const decodeGrid = (values: ArrayLike<number>): Grid => {
    const grid: Grid = [];
    for (let p = 0; p < P; p++) {
      const row = new Array<number>(D).fill(-1);
      for (let d = 0; d < D; d++) {
        for (let s = 0; s < S; s++) {
          const c = ctx.x(p, d, s);
          if (c >= 0 && values[c] > 0.5) row[d] = s;
        }
      }
      grid.push(row);
    }
    return grid;
  };

  const encode = (roster: Roster): Float64Array => {
    const { grid } = index.toGrid(roster);
    const values = new Float64Array(builder.numCols);
    for (let p = 0; p < P; p++) {
      for (let d = 0; d < D; d++) {
        const s = grid[p][d];
        if (s < 0) continue;
        const c = ctx.x(p, d, s);
        if (c >= 0) values[c] = 1;
        else grid[p][d] = -1; // impossible cell: left off, as the model must
      }
    }
    for (const [col, f] of ctx.auxValue) values[col] = f(grid);
    // Elastic slacks last: the least slack that puts each row back inside its bounds.
    const acts = elastic.map(([, row]) => builder.rowActivity(row, values)); // slacks are still 0 here
    elastic.forEach(([col, row, sign], k) => {
      const [lb, ub] = builder.rowBounds(row);
      values[col] = sign > 0 ? Math.max(0, lb - acts[k]) : Math.max(0, acts[k] - ub);
    });
    return values;
  };

  return {
    problem,
    index,
    arrays,
    columns: builder.columnMeta,
    rows: builder.rowMeta,
    numX,
    elastic: elastic.length > 0,
    x: (p, d, s) => ctx.x(p, d, s),
    decode: (values) => index.fromGrid(decodeGrid(values)),
    encode,
    objectiveOf: (values) => builder.objectiveOf(values),
  };
}
