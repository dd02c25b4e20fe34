/**
 * A small sparse MIP builder. Columns and rows are added one at a time; repeated terms of a row
 * are summed when the model is exported. `toHighsArrays()` returns exactly the structure that
 * `highs.createModel()` accepts (see node_modules/highs/types.d.ts, `ModelData`), in compressed
 * sparse row form, with the objective sense left at its default (minimise).
 */
import type { HardRuleName, ObjectiveTermName } from '../result';

/** What a row of the model stands for, so explanations can speak in words. */
export interface RowMeta {
  /** The hard rule or soft goal that wrote the row; 'cover' is the shared cover balance row of a need. */
  rule: HardRuleName | ObjectiveTermName | 'cover' | 'link';
  personId?: string;
  /** First day the row is about. */
  day?: number;
  /** Last day the row is about, when it spans several days (windows, successions). */
  lastDay?: number;
  shiftTypeId?: string;
  /** Index into problem.coverNeeds for cover rows. */
  needIndex?: number;
}

/** What a column stands for: an assignment x[person, day, shift type] or an auxiliary column. */
export type ColumnMeta =
  | { kind: 'x'; personId: string; personIndex: number; day: number; shiftTypeId: string; shiftIndex: number }
  | {
      kind: 'aux';
      rule: HardRuleName | ObjectiveTermName;
      personId?: string;
      day?: number;
      shiftTypeId?: string;
      needIndex?: number;
    };

/** The model in the shape `highs.createModel()` takes (a structural copy of highs' `ModelData`). */
export interface HighsModelArrays {
  numCols: number;
  numRows: number;
  offset: number;
  colCost: Float64Array;
  colLower: Float64Array;
  colUpper: Float64Array;
  rowLower: Float64Array;
  rowUpper: Float64Array;
  matrix: {
    format: 'csr';
    numRows: number;
    numCols: number;
    starts: Int32Array;
    indices: Int32Array;
    values: Float64Array;
  };
  /** 0 continuous, 1 integer (highs.constants.variableType). */
  integrality: Int32Array;
  colNames: string[];
  rowNames: string[];
}

interface RowData {
  name: string;
  lb: number;
  ub: number;
  cols: number[];
  coefs: number[];
}

export class MipBuilder {
  private readonly colNames: string[] = [];
  private readonly colLower: number[] = [];
  private readonly colUpper: number[] = [];
  private readonly colCost: number[] = [];
  private readonly colInteger: boolean[] = [];
  private readonly rows: RowData[] = [];
  private readonly names = new Set<string>();
  readonly columnMeta: ColumnMeta[] = [];
  readonly rowMeta: RowMeta[] = [];
  /** Constant added to the objective. */
  offset = 0;

  get numCols(): number {
    return this.colNames.length;
  }

  get numRows(): number {
    return this.rows.length;
  }

  private claim(name: string): void {
    if (this.names.has(name)) throw new Error(`Model name used twice: ${name}`);
    this.names.add(name);
  }

  /** Adds a column and returns its index. */
  addColumn(name: string, lb: number, ub: number, cost: number, integer: boolean, meta: ColumnMeta): number {
    if (!(lb <= ub)) throw new Error(`Column ${name}: lower bound ${lb} above upper bound ${ub}`);
    this.claim(name);
    this.colNames.push(name);
    this.colLower.push(lb);
    this.colUpper.push(ub);
    this.colCost.push(cost);
    this.colInteger.push(integer);
    this.columnMeta.push(meta);
    return this.colNames.length - 1;
  }

  /** Adds `delta` to the objective coefficient of a column. */
  addCost(col: number, delta: number): void {
    this.colCost[col] += delta;
  }

  cost(col: number): number {
    return this.colCost[col];
  }

  /** Adds a row lb ≤ Σ coef·x[col] ≤ ub (use ±Infinity for a missing side) and returns its index. */
  addRow(
    name: string,
    lb: number,
    ub: number,
    terms: readonly (readonly [number, number])[],
    meta: RowMeta,
  ): number {
    this.claim(name);
    const row: RowData = { name, lb, ub, cols: [], coefs: [] };
    for (const [c, v] of terms) {
      row.cols.push(c);
      row.coefs.push(v);
    }
    this.rows.push(row);
    this.rowMeta.push(meta);
    return this.rows.length - 1;
  }

  /** Adds one more term to an existing row (summed with any earlier term of the same column). */
  addToRow(row: number, col: number, coef: number): void {
    this.rows[row].cols.push(col);
    this.rows[row].coefs.push(coef);
  }

  /** Row activity Σ coef·values[col] (repeated terms summed), for checks and tests. */
  rowActivity(row: number, values: ArrayLike<number>): number {
    const r = this.rows[row];
    let s = 0;
    for (let k = 0; k < r.cols.length; k++) s += r.coefs[k] * values[r.cols[k]];
    return s;
  }

  rowBounds(row: number): [number, number] {
    return [this.rows[row].lb, this.rows[row].ub];
  }

  colBounds(col: number): [number, number] {
    return [this.colLower[col], this.colUpper[col]];
  }

  /** Objective value offset + Σ cost·values. */
  objectiveOf(values: ArrayLike<number>): number {
    let s = this.offset;
    for (let j = 0; j < this.colCost.length; j++) if (this.colCost[j] !== 0) s += this.colCost[j] * values[j];
    return s;
  }

  /** Exports the model; repeated terms of a row are summed and zero coefficients dropped. */
  toHighsArrays(): HighsModelArrays {
    const numCols = this.colNames.length;
    const numRows = this.rows.length;
    const starts = new Int32Array(numRows + 1);
    const idx: number[] = [];
    const vals: number[] = [];
    // Scratch accumulator indexed by column, reset after each row.
    const acc = new Float64Array(numCols);
    const seen = new Uint8Array(numCols);
    const order: number[] = [];
    for (let i = 0; i < numRows; i++) {
      const r = this.rows[i];
      // Fast path: columns strictly increasing (no repeats, already sorted).
      let sorted = true;
      for (let k = 0; k < r.cols.length; k++) {
        const c = r.cols[k];
        if (c < 0 || c >= numCols) throw new Error(`Row ${r.name}: column ${c} does not exist`);
        if (k > 0 && c <= r.cols[k - 1]) sorted = false;
      }
      if (sorted) {
        for (let k = 0; k < r.cols.length; k++) {
          if (r.coefs[k] !== 0) {
            idx.push(r.cols[k]);
            vals.push(r.coefs[k]);
          }
        }
        starts[i + 1] = idx.length;
        continue;
      }
      for (let k = 0; k < r.cols.length; k++) {
        const c = r.cols[k];
        if (!seen[c]) {
          seen[c] = 1;
          order.push(c);
        }
        acc[c] += r.coefs[k];
      }
      order.sort((x, y) => x - y);
      for (const c of order) {
        if (acc[c] !== 0) {
          idx.push(c);
          vals.push(acc[c]);
        }
        acc[c] = 0;
        seen[c] = 0;
      }
      order.length = 0;
      starts[i + 1] = idx.length;
    }
    return {
      numCols,
      numRows,
      offset: this.offset,
      colCost: Float64Array.from(this.colCost),
      colLower: Float64Array.from(this.colLower),
      colUpper: Float64Array.from(this.colUpper),
      rowLower: Float64Array.from(this.rows, (r) => r.lb),
      rowUpper: Float64Array.from(this.rows, (r) => r.ub),
      matrix: {
        format: 'csr',
        numRows,
        numCols,
        starts,
        indices: Int32Array.from(idx),
        values: Float64Array.from(vals),
      },
      integrality: Int32Array.from(this.colInteger, (b) => (b ? 1 : 0)),
      colNames: this.colNames.slice(),
      rowNames: this.rows.map((r) => r.name),
    };
  }
}
