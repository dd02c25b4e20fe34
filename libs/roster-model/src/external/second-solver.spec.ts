/**
 * A second, independent solver: GLPK 5.0 (glpk.js, test-only devDependency).
 * - An independent formulation of the benchmark (lib/bench/textbook-model.ts), written from SOURCES.md §4
 *   of ../shared/benchmarks/curtois-qu and sharing no code with the product's model builder, solved by
 *   GLPK, reaches the published optimum of Instance1 and agrees with the product path (HiGHS on
 *   buildModel's model) on random small instances.
 * - The product's own model arrays, handed to GLPK term by term, give the same optimum as HiGHS on
 *   random problems that use every rule and goal of the product.
 * HiGHS runs without the heuristic warm start here (it only saves time on larger problems, and the
 * optimum is what is compared); checker-properties.spec.ts covers the default path.
 */
import fc from 'fast-check';
import { checkRoster } from '../lib/check/checker';
import { BEST_KNOWN } from '../lib/bench/best-known';
import { loadInstance, toRosterProblem } from '../lib/bench/curtois-qu';
import { evaluateBenchmarkRoster } from '../lib/bench/evaluate';
import { buildModel } from '../lib/model/build-model';
import { solveRoster } from '../lib/solve/solve';
import { textbookModel } from '../lib/bench/textbook-model';
import { arraysToGlpk, linearProgramToGlpk, solveWithGlpk } from './glpk.test-helpers';
import { benchInstanceArb, productProblemArb } from './random-instances.test-helpers';

const close = (a: number, b: number): boolean =>
  Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(a), Math.abs(b));
/** GLPK reports a MIP whose presolve proves it infeasible as "undefined" or "infeasible". */
const glpkInfeasible = (status: string): boolean => status === 'infeasible' || status === 'undefined';

describe('second solver (GLPK)', () => {
  it('independent formulation on GLPK reaches the published optimum of Instance1: 607 (SOURCES.md §5a)', () => {
    const { instance, problem } = loadInstance(1);
    const lp = textbookModel(instance);
    const out = solveWithGlpk(linearProgramToGlpk(lp.lp), { tmlim: 120 });
    expect(out.status).toBe('optimal');
    expect(out.z + lp.lp.offset).toBeCloseTo(BEST_KNOWN[1].best, 6);
    // GLPK's roster, checked by the product's checker and by the benchmark definition
    const roster = lp.decode(out.vars);
    const check = checkRoster(problem, roster);
    expect(check.violations).toEqual([]);
    expect(check.objective).toBe(607);
    expect(evaluateBenchmarkRoster(instance, roster).penalty).toBe(607);
  });

  it('product path (HiGHS) and independent formulation (GLPK) agree on random benchmark instances', async () => {
    let compared = 0;
    await fc.assert(
      fc.asyncProperty(
        benchInstanceArb({ horizons: [7, 14], maxStaff: 3, maxShiftTypes: 2 }),
        async (inst) => {
          const result = await solveRoster(toRosterProblem(inst), {
            timeLimitSeconds: 20,
            mipRelGap: 0,
            explain: false,
            warmStart: null,
          });
          const lp = textbookModel(inst);
          const out = solveWithGlpk(linearProgramToGlpk(lp.lp), { tmlim: 20 });
          if (result.status === 'infeasible') {
            expect(glpkInfeasible(out.status)).toBe(true);
            return;
          }
          expect(result.status).toBe('optimal');
          if (out.status === 'feasible') {
            // GLPK ran out of time: its roster can be no better than the proven optimum
            expect(out.z + lp.lp.offset).toBeGreaterThanOrEqual((result.objective as number) - 1e-6);
            return;
          }
          expect(out.status).toBe('optimal');
          compared++;
          expect(out.z + lp.lp.offset).toBeCloseTo(result.objective as number, 6);
          // GLPK's roster meets the benchmark rules and scores its objective (SOURCES.md §4)
          const ev = evaluateBenchmarkRoster(inst, lp.decode(out.vars));
          expect(ev.violations).toEqual([]);
          expect(ev.penalty).toBeCloseTo(out.z + lp.lp.offset, 6);
        },
      ),
      { seed: 777, numRuns: 10 },
    );
    expect(compared).toBeGreaterThanOrEqual(6);
  });

  it('the same model arrays give the same optimum in HiGHS and GLPK (random problems, every rule and goal)', async () => {
    let compared = 0;
    await fc.assert(
      fc.asyncProperty(
        productProblemArb({ horizons: [7], maxStaff: 3, maxShiftTypes: 2 }),
        async (problem) => {
          const result = await solveRoster(problem, {
            timeLimitSeconds: 20,
            mipRelGap: 0,
            explain: false,
            warmStart: null,
          });
          const built = buildModel(problem);
          const out = solveWithGlpk(arraysToGlpk(built.arrays), { tmlim: 30 });
          if (result.status === 'infeasible') {
            expect(glpkInfeasible(out.status)).toBe(true);
            return;
          }
          expect(result.status).toBe('optimal');
          expect(out.status).toBe('optimal');
          compared++;
          const glpkObjective = out.z + built.arrays.offset;
          if (!close(glpkObjective, result.objective as number)) {
            throw new Error(`GLPK ${glpkObjective} vs HiGHS ${result.objective}`);
          }
        },
      ),
      { seed: 31337, numRuns: 10 },
    );
    expect(compared).toBeGreaterThanOrEqual(6);
  });
});
