/**
 * The part of a model that a neighbourhood can change, as a model of its own: what fix-and-optimise
 * hands to HiGHS instead of the whole model with most columns fixed.
 *
 * Columns whose bounds are equal are fixed: their share of each row moves into the row's bounds and
 * their cost into the offset. A free continuous column (a slack, a count, a spread's ends) is kept
 * only when it shares a row with a free integer column, directly or through other such columns; the
 * rest of the model then has nothing left to decide, so those columns keep their values in `start`
 * (a roster's tight encoding, already the cheapest for them) and their rows are dropped. The two
 * parts share no column, so the best completion of the part kept, with the rest at `start`, is a best
 * solution of the whole restricted model.
 *
 * Why: HiGHS copies and presolves every column it is given. On benchmark instance 20 (64,037 columns,
 * 75,305 rows) one person freed over the half year was solved to optimality in 0.94 s as the whole
 * model and in 0.10 s as this part (3,009 columns, 2,541 rows) with the same objective
 * (docs/benchmarks.md).
 */
import type { HighsModelArrays } from '../model/builder';

export interface SubModel {
  /** The model over the kept columns (no names: HiGHS does not need them). */
  arrays: Omit<HighsModelArrays, 'colNames' | 'rowNames'>;
  /** Kept column j of `arrays` is column `columns[j]` of the whole model. */
  columns: Int32Array;
  /** A whole-model vector from a vector over the kept columns (the others at their fixed values). */
  expand(values: ArrayLike<number>): Float64Array;
  /** The kept columns' entries of a whole-model vector. */
  restrict(values: ArrayLike<number>): Float64Array;
}

/** Transposes already built, by the matrix they belong to (fix-and-optimise reuses one matrix). */
const transposes = new WeakMap<Int32Array, { starts: Int32Array; rows: Int32Array }>();

/** Row indices of each column (the transpose of the row-wise matrix). */
function rowsOfColumns(model: HighsModelArrays): { starts: Int32Array; rows: Int32Array } {
  const { starts, indices } = model.matrix;
  const known = transposes.get(indices);
  if (known && known.starts.length === model.numCols + 1) return known;
  const colStarts = new Int32Array(model.numCols + 1);
  for (let e = 0; e < indices.length; e++) colStarts[indices[e] + 1]++;
  for (let j = 0; j < model.numCols; j++) colStarts[j + 1] += colStarts[j];
  const fill = colStarts.slice(0, model.numCols);
  const rows = new Int32Array(indices.length);
  for (let i = 0; i < model.numRows; i++)
    for (let e = starts[i]; e < starts[i + 1]; e++) rows[fill[indices[e]]++] = i;
  const transpose = { starts: colStarts, rows };
  transposes.set(indices, transpose);
  return transpose;
}

/**
 * The part of `model` its free integer columns can reach. `start` must satisfy every row (a roster
 * that keeps every hard rule, or any roster in an elastic model) and hold the fixed columns' values.
 */
export function subModel(model: HighsModelArrays, start: ArrayLike<number>): SubModel {
  const n = model.numCols;
  const { colLower, colUpper, integrality, matrix } = model;
  const isFree = (j: number): boolean => colLower[j] < colUpper[j];
  // Columns reachable from a free integer column through shared rows and free continuous columns.
  const live = new Uint8Array(n);
  const queue: number[] = [];
  for (let j = 0; j < n; j++) {
    if (isFree(j) && integrality[j] !== 0) {
      live[j] = 1;
      queue.push(j);
    }
  }
  const byColumn = rowsOfColumns(model);
  const liveRow = new Uint8Array(model.numRows);
  while (queue.length > 0) {
    const j = queue.pop() as number;
    for (let q = byColumn.starts[j]; q < byColumn.starts[j + 1]; q++) {
      const i = byColumn.rows[q];
      if (liveRow[i]) continue;
      liveRow[i] = 1;
      for (let e = matrix.starts[i]; e < matrix.starts[i + 1]; e++) {
        const c = matrix.indices[e];
        if (!live[c] && isFree(c)) {
          live[c] = 1;
          queue.push(c);
        }
      }
    }
  }
  const fixedValue = new Float64Array(n);
  const position = new Int32Array(n).fill(-1);
  const kept: number[] = [];
  let offset = model.offset;
  for (let j = 0; j < n; j++) {
    if (live[j]) {
      position[j] = kept.length;
      kept.push(j);
    } else {
      fixedValue[j] = isFree(j) ? start[j] : colLower[j];
      offset += model.colCost[j] * fixedValue[j];
    }
  }
  const rowStarts: number[] = [0];
  const indices: number[] = [];
  const values: number[] = [];
  const rowLower: number[] = [];
  const rowUpper: number[] = [];
  for (let i = 0; i < model.numRows; i++) {
    if (!liveRow[i]) continue;
    let fixed = 0;
    for (let e = matrix.starts[i]; e < matrix.starts[i + 1]; e++) {
      const j = matrix.indices[e];
      if (position[j] < 0) fixed += matrix.values[e] * fixedValue[j];
      else {
        indices.push(position[j]);
        values.push(matrix.values[e]);
      }
    }
    rowLower.push(model.rowLower[i] - fixed);
    rowUpper.push(model.rowUpper[i] - fixed);
    rowStarts.push(indices.length);
  }
  const columns = Int32Array.from(kept);
  const pick = (source: ArrayLike<number>): Float64Array => Float64Array.from(columns, (j) => source[j]);
  return {
    arrays: {
      numCols: columns.length,
      numRows: rowLower.length,
      offset,
      colCost: pick(model.colCost),
      colLower: pick(colLower),
      colUpper: pick(colUpper),
      rowLower: Float64Array.from(rowLower),
      rowUpper: Float64Array.from(rowUpper),
      matrix: {
        format: 'csr',
        numRows: rowLower.length,
        numCols: columns.length,
        starts: Int32Array.from(rowStarts),
        indices: Int32Array.from(indices),
        values: Float64Array.from(values),
      },
      integrality: Int32Array.from(columns, (j) => integrality[j]),
    },
    columns,
    expand(subValues) {
      const out = Float64Array.from(fixedValue);
      for (let q = 0; q < columns.length; q++) out[columns[q]] = subValues[q];
      return out;
    },
    restrict: pick,
  };
}
