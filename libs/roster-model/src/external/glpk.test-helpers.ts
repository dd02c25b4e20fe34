/**
 * GLPK (glpk.js 5, GLPK 5.0 compiled to WebAssembly; test-only devDependency) as a second,
 * independent MIP solver. glpk.js is an ES module only; jest's CommonJS runtime on Node 20 cannot
 * load it, so each solve runs glpk-runner.mjs in a child node process.
 */
import { execFileSync } from 'node:child_process';
import * as path from 'node:path';
import type { LinearProgram } from '../lib/bench/textbook-model';

// GLPK's own constant values (glpk.h; the same numbers glpk.js exposes as GLP_*).
export const GLP_MIN = 1;
const GLP_FR = 1;
const GLP_LO = 2;
const GLP_UP = 3;
const GLP_DB = 4;
const GLP_FX = 5;

export interface GlpkTerm {
  name: string;
  coef: number;
}
export interface GlpkBounds {
  type: number;
  lb: number;
  ub: number;
}
/** The LP object glpk.js takes (a structural copy of its `LP` type). */
export interface GlpkLp {
  name: string;
  objective: { direction: number; name: string; vars: GlpkTerm[] };
  subjectTo: { name: string; vars: GlpkTerm[]; bnds: GlpkBounds }[];
  bounds?: ({ name: string } & GlpkBounds)[];
  binaries?: string[];
  generals?: string[];
}

export interface GlpkResult {
  status: string;
  /** Objective value without any constant offset. */
  z: number;
  vars: Record<string, number>;
  glpkVersion: string;
}

/** GLPK bound type and values for lb ≤ · ≤ ub (±Infinity for a missing side). */
export function glpkBounds(lb: number, ub: number): GlpkBounds {
  const hasLb = Number.isFinite(lb);
  const hasUb = Number.isFinite(ub);
  if (hasLb && hasUb) return lb === ub ? { type: GLP_FX, lb, ub } : { type: GLP_DB, lb, ub };
  if (hasLb) return { type: GLP_LO, lb, ub: 0 };
  if (hasUb) return { type: GLP_UP, lb: 0, ub };
  return { type: GLP_FR, lb: 0, ub: 0 };
}

export function solveWithGlpk(lp: GlpkLp, options: { tmlim?: number; mipgap?: number } = {}): GlpkResult {
  const runner = path.join(__dirname, 'glpk-runner.mjs');
  const out = execFileSync(process.execPath, [runner], {
    input: JSON.stringify({ lp, options }),
    maxBuffer: 64 * 1024 * 1024,
    cwd: __dirname,
  });
  return JSON.parse(out.toString('utf8')) as GlpkResult;
}

/** The part of highs' ModelData that a model from the product's builder fills in. */
export interface ModelArrays {
  numCols: number;
  numRows: number;
  offset?: number;
  colCost: ArrayLike<number>;
  colLower: ArrayLike<number>;
  colUpper: ArrayLike<number>;
  rowLower: ArrayLike<number>;
  rowUpper: ArrayLike<number>;
  matrix: {
    format: 'csr' | 'csc';
    starts: ArrayLike<number>;
    indices: ArrayLike<number>;
    values: ArrayLike<number>;
  };
  integrality?: ArrayLike<number>;
}

/**
 * The same model, term by term, as a glpk.js LP (minimise). Columns are named c0, c1, …; the
 * objective offset is not part of GLPK's z and must be added by the caller.
 */
export function arraysToGlpk(m: ModelArrays, name = 'model'): GlpkLp {
  const col = (j: number): string => `c${j}`;
  const rowTerms: GlpkTerm[][] = Array.from({ length: m.numRows }, () => []);
  const { starts, indices, values } = m.matrix;
  const outer = m.matrix.format === 'csr' ? m.numRows : m.numCols;
  for (let o = 0; o < outer; o++) {
    for (let k = starts[o]; k < starts[o + 1]; k++) {
      const [i, j] = m.matrix.format === 'csr' ? [o, indices[k]] : [indices[k], o];
      rowTerms[i].push({ name: col(j), coef: values[k] });
    }
  }
  const objective: GlpkTerm[] = [];
  const bounds: ({ name: string } & GlpkBounds)[] = [];
  const generals: string[] = [];
  for (let j = 0; j < m.numCols; j++) {
    // every column appears in the objective (coefficient 0 if need be) so GLPK knows it
    objective.push({ name: col(j), coef: m.colCost[j] });
    bounds.push({ name: col(j), ...glpkBounds(m.colLower[j], m.colUpper[j]) });
    if (m.integrality && m.integrality[j] !== 0) generals.push(col(j));
  }
  return {
    name,
    objective: { direction: GLP_MIN, name: 'obj', vars: objective },
    subjectTo: rowTerms.map((vars, i) => ({
      name: `r${i}`,
      vars,
      bnds: glpkBounds(m.rowLower[i], m.rowUpper[i]),
    })),
    bounds,
    generals,
  };
}

/**
 * A named LP (lib/bench/textbook-model.ts) as a glpk.js LP. Integer columns are "generals" with
 * explicit bounds: glpk.js "binaries" would reset the bounds to [0, 1], losing columns fixed to 0.
 * The offset is not part of GLPK's z.
 */
export function linearProgramToGlpk(lp: LinearProgram, name = 'model'): GlpkLp {
  return {
    name,
    objective: {
      direction: GLP_MIN,
      name: 'obj',
      vars: lp.columns.map((c) => ({ name: c.name, coef: c.cost })),
    },
    subjectTo: lp.rows.map((r) => ({ name: r.name, vars: r.terms, bnds: glpkBounds(r.lb, r.ub) })),
    bounds: lp.columns.map((c) => ({ name: c.name, ...glpkBounds(c.lb, c.ub) })),
    generals: lp.columns.filter((c) => c.integer).map((c) => c.name),
  };
}
