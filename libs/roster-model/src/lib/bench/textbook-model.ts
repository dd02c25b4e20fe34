/**
 * The plain "textbook" 0/1 formulation of a benchmark instance, written straight from the compact
 * MIP in ../shared/benchmarks/curtois-qu/SOURCES.md §4 ("A 0/1 MIP formulation that reproduces the
 * published optima": C1-C10, cover balance, objective). It shares no code with the product's model
 * builder, for two uses:
 * - a baseline for the benchmark (`npm run bench -- … --model textbook`), so docs/benchmarks.md can
 *   say what the product's modelling gains over the textbook model on the same HiGHS build;
 * - an independent formulation for the external tests, which solve it with a second solver (GLPK).
 * The LP is kept in a neutral form (named columns and rows) with converters to each solver.
 */
import type { Roster } from '../problem';
import type { HighsModelArrays } from '../model/builder';
import type { BenchInstance } from './curtois-qu';

export interface LpTerm {
  name: string;
  coef: number;
}

export interface LinearProgram {
  /** Minimise offset + Σ cost·column. */
  columns: { name: string; lb: number; ub: number; cost: number; integer: boolean }[];
  rows: { name: string; lb: number; ub: number; terms: LpTerm[] }[];
  offset: number;
}

export interface TextbookModel {
  lp: LinearProgram;
  /** Roster from column values by name (x > 0.5 → that shift). */
  decode(values: Record<string, number>): Roster;
}

export function textbookModel(inst: BenchInstance): TextbookModel {
  const H = inst.horizon;
  const x = (e: number, d: number, s: number): string => `x_${e}_${d}_${s}`;
  const staffIndex = new Map(inst.staff.map((e, i) => [e.id, i]));
  const shiftIndex = new Map(inst.shifts.map((s, i) => [s.id, i]));
  const columns: LinearProgram['columns'] = [];
  const colIndex = new Map<string, number>();
  const column = (name: string, lb: number, ub: number, integer: boolean): void => {
    colIndex.set(name, columns.length);
    columns.push({ name, lb, ub, cost: 0, integer });
  };
  const addCost = (name: string, c: number): void => {
    columns[colIndex.get(name) as number].cost += c;
  };
  const rows: LinearProgram['rows'] = [];
  const row = (name: string, terms: LpTerm[], lb: number, ub: number): void => {
    rows.push({ name, lb, ub, terms });
  };
  const w = (e: number, d: number, coef: number): LpTerm[] =>
    inst.shifts.map((_, s) => ({ name: x(e, d, s), coef }));

  inst.staff.forEach((emp, e) => {
    const off = new Set(inst.daysOff[emp.id] ?? []);
    for (let d = 0; d < H; d++) {
      // x binary; C10: fixed to 0 on a listed day off
      inst.shifts.forEach((_, s) => column(x(e, d, s), 0, off.has(d) ? 0 : 1, true));
      // C1: one shift per day
      row(`c1_${e}_${d}`, w(e, d, 1), -Infinity, 1);
    }
    inst.shifts.forEach((sh, s) => {
      // C2: forbidden successions on days d, d+1 inside the horizon
      for (const next of sh.forbiddenNext) {
        const t = shiftIndex.get(next) as number;
        for (let d = 0; d + 1 < H; d++) {
          const terms = [
            { name: x(e, d, s), coef: 1 },
            { name: x(e, d + 1, t), coef: 1 },
          ];
          row(`c2_${e}_${d}_${s}_${t}`, terms, -Infinity, 1);
        }
      }
      // C3: max shifts per type
      const terms = Array.from({ length: H }, (_, d) => ({ name: x(e, d, s), coef: 1 }));
      row(`c3_${e}_${s}`, terms, -Infinity, emp.maxShifts[sh.id] ?? 0);
    });
    // C4/C5: total minutes
    const minutes: LpTerm[] = [];
    for (let d = 0; d < H; d++) {
      inst.shifts.forEach((sh, s) => minutes.push({ name: x(e, d, s), coef: sh.lengthMinutes }));
    }
    row(`c45_${e}`, minutes, emp.minTotalMinutes, emp.maxTotalMinutes);
    // C6: any K+1 consecutive days hold at most K working days
    const K = emp.maxConsecutiveShifts;
    for (let d = 0; d + K < H; d++) {
      const terms: LpTerm[] = [];
      for (let j = d; j <= d + K; j++) terms.push(...w(e, j, 1));
      row(`c6_${e}_${d}`, terms, -Infinity, K);
    }
    // C7: no "off, k working days, off" strictly inside the horizon for k < MinConsecutiveShifts
    for (let k = 1; k < emp.minConsecutiveShifts; k++) {
      for (let a = 1; a + k <= H - 1; a++) {
        const terms = [...w(e, a - 1, 1), ...w(e, a + k, 1)];
        for (let j = a; j < a + k; j++) terms.push(...w(e, j, -1));
        row(`c7_${e}_${k}_${a}`, terms, 1 - k, Infinity);
      }
    }
    // C8: no "work, k days off, work" strictly inside the horizon for k < MinConsecutiveDaysOff
    for (let k = 1; k < emp.minConsecutiveDaysOff; k++) {
      for (let a = 1; a + k <= H - 1; a++) {
        const terms = [...w(e, a - 1, -1), ...w(e, a + k, -1)];
        for (let j = a; j < a + k; j++) terms.push(...w(e, j, 1));
        row(`c8_${e}_${k}_${a}`, terms, -1, Infinity);
      }
    }
    // C9: weekend k (days 7k+5, 7k+6) worked if either day is worked; at most MaxWeekends
    const ys: LpTerm[] = [];
    for (let k = 0; 7 * k + 5 < H; k++) {
      const y = `y_${e}_${k}`;
      column(y, 0, 1, false);
      ys.push({ name: y, coef: 1 });
      for (const d of [7 * k + 5, 7 * k + 6]) {
        if (d < H) row(`c9_${e}_${k}_${d}`, [{ name: y, coef: 1 }, ...w(e, d, -1)], 0, Infinity);
      }
    }
    if (ys.length > 0) row(`c9_${e}`, ys, -Infinity, emp.maxWeekends);
  });

  // Cover balance: Σ_e x + u - o = req, u and o continuous ≥ 0 with weights WeightUnder, WeightOver
  inst.cover.forEach((c, i) => {
    const s = shiftIndex.get(c.shiftId) as number;
    const u = `u_${i}`;
    const o = `o_${i}`;
    column(u, 0, Infinity, false);
    column(o, 0, Infinity, false);
    addCost(u, c.weightUnder);
    addCost(o, c.weightOver);
    const terms: LpTerm[] = inst.staff.map((_, e) => ({ name: x(e, c.day, s), coef: 1 }));
    row(`cov_${i}`, [...terms, { name: u, coef: 1 }, { name: o, coef: -1 }], c.requirement, c.requirement);
  });

  // Requests: on = w·(1 - x) (the constant part goes to the offset), off = w·x
  let offset = 0;
  const xOf = (q: { staffId: string; day: number; shiftId: string }): string =>
    x(staffIndex.get(q.staffId) as number, q.day, shiftIndex.get(q.shiftId) as number);
  for (const q of inst.onRequests) {
    offset += q.weight;
    addCost(xOf(q), -q.weight);
  }
  for (const q of inst.offRequests) addCost(xOf(q), q.weight);

  return {
    lp: { columns, rows, offset },
    decode(values) {
      const roster: Roster = {};
      inst.staff.forEach((emp, e) => {
        roster[emp.id] = Array.from({ length: H }, (_, d) => {
          const s = inst.shifts.findIndex((_, si) => (values[x(e, d, si)] ?? 0) > 0.5);
          return s < 0 ? null : inst.shifts[s].id;
        });
      });
      return roster;
    },
  };
}

/** The LP as highs `createModel` arrays (minimise, CSR; repeated terms of a row summed). */
export function linearProgramToHighs(lp: LinearProgram): HighsModelArrays {
  const colIndex = new Map(lp.columns.map((c, j) => [c.name, j]));
  const starts = new Int32Array(lp.rows.length + 1);
  const indices: number[] = [];
  const values: number[] = [];
  lp.rows.forEach((r, i) => {
    const acc = new Map<number, number>();
    for (const t of r.terms) {
      const j = colIndex.get(t.name);
      if (j === undefined) throw new Error(`Row ${r.name} names unknown column ${t.name}`);
      acc.set(j, (acc.get(j) ?? 0) + t.coef);
    }
    for (const [j, v] of [...acc].sort((a, b) => a[0] - b[0])) {
      if (v === 0) continue;
      indices.push(j);
      values.push(v);
    }
    starts[i + 1] = indices.length;
  });
  return {
    numCols: lp.columns.length,
    numRows: lp.rows.length,
    offset: lp.offset,
    colCost: Float64Array.from(lp.columns, (c) => c.cost),
    colLower: Float64Array.from(lp.columns, (c) => c.lb),
    colUpper: Float64Array.from(lp.columns, (c) => c.ub),
    rowLower: Float64Array.from(lp.rows, (r) => r.lb),
    rowUpper: Float64Array.from(lp.rows, (r) => r.ub),
    matrix: {
      format: 'csr',
      numRows: lp.rows.length,
      numCols: lp.columns.length,
      starts,
      indices: Int32Array.from(indices),
      values: Float64Array.from(values),
    },
    integrality: Int32Array.from(lp.columns, (c) => (c.integer ? 1 : 0)),
    colNames: lp.columns.map((c) => c.name),
    rowNames: lp.rows.map((r) => r.name),
  };
}
