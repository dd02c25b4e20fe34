/**
 * The best-line dynamic programme (line-dp.ts) against a second method and against the checker:
 * - on random problems that use every rule and goal, with random cover terms, its line costs exactly
 *   what the optimal line of the one-person MIP costs (the product's model of rules/ and goals/,
 *   solved to optimality by HiGHS), its `lowest` (column generation's pricing value) is never above
 *   that, and it finds no line exactly when HiGHS proves there is none;
 * - its lines break no rule of the independent checker (each rule's own checkPerson);
 * - on published benchmark instance 8 (Curtois & Qu, SOURCES.md §5a), whose contracts (minimum
 *   hours, runs of 2-5 days, at least 2 days off together, at most 2 weekends) leave an empty roster
 *   breaking rules for all 30 people, the search with the line solver holds a roster that keeps every
 *   rule after its first move, and without it does not.
 */
import fc from 'fast-check';
import { checkRoster } from '../check/checker';
import { ProblemIndex } from '../model/context';
import { RULES } from '../rules';
import { productProblemArb } from '../../external/random-instances.test-helpers';
import { threadSession } from '../solve/run-mip';
import { loadInstance } from '../bench/curtois-qu';
import { LineDp } from './line-dp';
import { LineMip } from './line-mip.test-helpers';
import type { LineCost, LineScore } from './line-cost';
import { searchRoster } from './roster-search';
import { seeded } from '../model/random.test-helpers';

/** Soft cost of person p's line plus its cover terms, as LineCost states it (line-cost.spec.ts checks LineCost). */
function lineValue(cost: LineCost, p: number, line: Int16Array, extra: Float64Array): number {
  const { P, D, S } = cost.index;
  const grid = new Int16Array(P * D).fill(-1);
  grid.set(line, p * D);
  const score: LineScore = { hard: 0, soft: 0, nights: 0, weekends: 0 };
  cost.score(p, grid, score);
  let total = score.soft;
  for (let d = 0; d < D; d++) if (line[d] >= 0) total += extra[d * S + line[d]];
  return total;
}

describe('LineDp: the best line of one person', () => {
  jest.setTimeout(300_000);

  it('costs what the optimal one-person MIP costs, and keeps every rule of the checker', async () => {
    const session = await threadSession();
    let compared = 0;
    await fc.assert(
      fc.asyncProperty(
        productProblemArb({ horizons: [7, 14], maxStaff: 4, maxShiftTypes: 3 }),
        fc.integer({ min: 1, max: 1_000_000 }),
        async (problem, seed) => {
          const index = new ProblemIndex(problem);
          const dp = new LineDp(index, { exact: true });
          const mip = new LineMip(index, session);
          const random = seeded(seed);
          for (let p = 0; p < index.P; p++) {
            const extra = new Float64Array(index.D * index.S);
            for (let i = 0; i < extra.length; i++) extra[i] = Math.round((random() - 0.6) * 40);
            const exact = mip.solve(p, extra, 30);
            if (!exact || (exact.status !== 'optimal' && exact.status !== 'infeasible')) continue;
            const line = dp.solve(p, extra);
            if (exact.status === 'infeasible') {
              expect(line).toBeNull();
              continue;
            }
            compared++;
            expect(line).not.toBeNull();
            const grid = Array.from(line!);
            const broken = RULES.flatMap((rule) => rule.checkPerson(index, p, grid));
            expect(broken).toEqual([]);
            expect(lineValue(dp.cost, p, line!, extra)).toBeCloseTo(
              lineValue(dp.cost, p, exact.line!, extra),
              6,
            );
            // The pricing value of column generation is never above the optimum (bound/line-bound.ts).
            expect(dp.lowest).toBeLessThanOrEqual(lineValue(dp.cost, p, exact.line!, extra) + 1e-6);
          }
        },
      ),
      { seed: 20261205, numRuns: 40 },
    );
    // The property compared real lines (not only problems without any).
    expect(compared).toBeGreaterThan(60);
  });

  it('repairs every line of benchmark instance 8 from an empty roster in the first move', () => {
    const loaded = loadInstance(8);
    const index = new ProblemIndex(loaded.problem);
    const empty = Object.fromEntries(loaded.problem.people.map((p) => [p.id, Array(index.D).fill(null)]));
    expect(checkRoster(loaded.problem, empty, index).violations.length).toBeGreaterThanOrEqual(30);

    const dp = new LineDp(index);
    const withLines = searchRoster(index, empty, {
      maxMoves: 1,
      rescueMs: 0,
      lineSolver: (p, extra) => dp.solve(p, extra),
    });
    expect(withLines.feasible).toBe(true);
    const check = checkRoster(loaded.problem, withLines.roster, index);
    expect(check.violations).toEqual([]);
    expect(check.objective).toBeCloseTo(withLines.objective, 6);

    const without = searchRoster(index, empty, { maxMoves: 1 });
    expect(without.feasible).toBe(false);
  });

  it('finds a rule-keeping half-year line for staff of benchmark instance 21 whose contracts are tight', () => {
    // Instance 21 (Curtois & Qu, SOURCES.md §5a): 182 days, at least 115 shifts' pay in runs of 2-5
    // days with 2 days off between and at most 13 of 26 weekends. The cheapest labels of a capped day
    // all fell behind those hours for each of the first ten staff before the look-ahead and the
    // second pass (furthest ahead first) were added.
    const { problem } = loadInstance(21);
    const index = new ProblemIndex(problem);
    const dp = new LineDp(index);
    const extra = new Float64Array(index.D * index.S);
    for (let p = 0; p < 10; p++) {
      const line = dp.solve(p, extra);
      expect(line).not.toBeNull();
      expect(RULES.flatMap((rule) => rule.checkPerson(index, p, Array.from(line!)))).toEqual([]);
    }
  });
});
