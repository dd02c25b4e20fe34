/**
 * The dive (line-dive.ts) against the independent checker and against proven optima:
 * - on benchmark instances 1-5 (Curtois & Qu; optima 607, 828, 1001, 1716, 1143 from SOURCES.md
 *   §5a) its roster keeps every hard rule, the checker computes the objective the dive states, and
 *   that objective is never below the published optimum nor the column-generation bound;
 * - on random problems that use every rule and goal of the product, the same against the checker,
 *   and never below the optimum HiGHS proves for the full MIP of the product's model.
 */
import fc from 'fast-check';
import { ProblemIndex } from '../model/context';
import { checkRoster } from '../check/checker';
import { threadSession } from '../solve/run-mip';
import { loadInstance } from '../bench/curtois-qu';
import { lineBound } from '../bound/line-bound';
import { rosterOfLines } from '../bound/line-master';
import { fullMip, smallProblems } from '../bound/lines.test-helpers';
import type { RosterProblem } from '../problem';

function rosterOf(problem: RosterProblem, lines: Int16Array) {
  return rosterOfLines(new ProblemIndex(problem), lines);
}

describe('lineDive: rosters from the column-generation master', () => {
  jest.setTimeout(300_000);

  it.each([
    [1, 607],
    [2, 828],
    [3, 1001],
    [4, 1716],
    [5, 1143],
  ])(
    'on benchmark instance %i gives a roster the checker accepts, never below the optimum %i',
    async (n, optimum) => {
      const session = await threadSession();
      const { problem } = loadInstance(n);
      const result = lineBound(new ProblemIndex(problem), session, { timeLimitMs: 120_000, diveMs: 60_000 });
      expect(result.dive).not.toBeNull();
      const check = checkRoster(problem, rosterOf(problem, result.dive!.grid));
      expect(check.violations).toEqual([]);
      expect(check.objective).toBeCloseTo(result.dive!.objective, 6);
      expect(check.objective).toBeGreaterThanOrEqual(optimum);
      expect(check.objective).toBeGreaterThanOrEqual(result.bound! - 1e-6);
    },
  );

  it('keeps every rule and states the checker objective on random problems, never below the proven optimum', async () => {
    const session = await threadSession();
    let compared = 0;
    await fc.assert(
      fc.asyncProperty(smallProblems(), async (problem) => {
        const result = lineBound(new ProblemIndex(problem), session, {
          timeLimitMs: 60_000,
          diveMs: 60_000,
        });
        if (result.bound === null) return; // some person has no line that keeps every rule
        expect(result.dive).not.toBeNull();
        const check = checkRoster(problem, rosterOf(problem, result.dive!.grid));
        expect(check.violations).toEqual([]);
        expect(check.objective).toBeCloseTo(result.dive!.objective, 6);
        const solved = await fullMip(problem, session);
        if (solved.status !== 'optimal' || solved.objective === null) return;
        expect(check.objective).toBeGreaterThanOrEqual(
          solved.objective - 1e-6 * Math.max(1, solved.objective),
        );
        compared++;
      }),
      { seed: 20261205, numRuns: 30 },
    );
    expect(compared).toBeGreaterThan(10);
  });
});
