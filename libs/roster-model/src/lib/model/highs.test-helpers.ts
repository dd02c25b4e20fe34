/**
 * Test helper: solve a built model with `highs` directly (no solve wrapper), so the model can be
 * tested on its own. Loads the WebAssembly module once per test file.
 */
import type { Highs, ModelData } from 'highs';
import type { HighsModelArrays } from './builder';

let loaded: Promise<Highs> | null = null;

export function loadHighs(): Promise<Highs> {
  if (!loaded) {
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const factory = require('highs') as (o?: object) => Promise<Highs>;
    loaded = factory();
  }
  return loaded;
}

export interface DirectSolve {
  status: number;
  objective: number;
  values: Float64Array;
  bound: number;
}

/** Solves to optimality (tiny models only); optionally as an LP relaxation, optionally from a start. */
export async function solveDirect(
  arrays: HighsModelArrays,
  opts: { relax?: boolean; start?: Float64Array; timeLimit?: number } = {},
): Promise<DirectSolve> {
  const highs = await loadHighs();
  const data = {
    ...arrays,
    integrality: opts.relax ? new Int32Array(arrays.numCols) : arrays.integrality,
  } as unknown as ModelData;
  const model = highs.createModel(data);
  try {
    model.options.set({ output_flag: false, time_limit: opts.timeLimit ?? 60, mip_rel_gap: 0 });
    if (opts.start) model.setSolution({ colValue: opts.start });
    const run = model.run();
    const values = model.getSolution().colValue;
    let bound = NaN;
    if (!opts.relax) {
      try {
        bound = Number(model.info.get('mip_dual_bound'));
      } catch {
        bound = NaN;
      }
    }
    return { status: run.modelStatus, objective: model.getObjectiveValue(), values, bound };
  } finally {
    model.dispose();
  }
}

/** HiGHS model status "Optimal" (kModelStatusOptimal = 7) and "Infeasible" (8). */
export const STATUS_OPTIMAL = 7;
export const STATUS_INFEASIBLE = 8;
