/**
 * The best roster made of given lines (line-pack.ts) against the independent checker and against
 * proven optima:
 * - on random problems that use every rule and goal of the product, given the column-generation
 *   bound's lines plus the lines of the optimum HiGHS proves for the full MIP of the product's model
 *   (build-model.ts), it finds a roster of exactly that optimum, which the checker accepts with the
 *   same objective; from a start roster it never returns a worse one;
 * - on benchmark instance 5 (Curtois & Qu; optimum 1143, SOURCES.md §5a) its roster from the
 *   bound's lines keeps every hard rule, at the objective the checker computes, never below 1143.
 */
import fc from 'fast-check';
import { ProblemIndex } from '../model/context';
import { checkRoster } from '../check/checker';
import { construct } from '../heuristic/construct';
import { threadSession } from '../solve/run-mip';
import { loadInstance } from '../bench/curtois-qu';
import { lineBound } from '../bound/line-bound';
import { linesOf, type PersonLine, rosterOfLines } from '../bound/line-master';
import { fullMip, smallProblems } from '../bound/lines.test-helpers';
import type { RosterProblem } from '../problem';
import { linePack } from './line-pack';

function poolOf(index: ProblemIndex, lines: Int16Array): PersonLine[] {
  return Array.from({ length: index.P }, (_, person) => ({
    person,
    line: lines.slice(person * index.D, (person + 1) * index.D),
  }));
}

describe('linePack: the best roster made of given lines', () => {
  jest.setTimeout(300_000);

  it('finds the proven optimum from the bound’s lines and the optimum’s, and never worsens a start (random problems)', async () => {
    const session = await threadSession();
    let compared = 0;
    let started = 0;
    await fc.assert(
      fc.asyncProperty(smallProblems(), async (problem: RosterProblem) => {
        const solved = await fullMip(problem, session);
        if (solved.status !== 'optimal' || solved.roster === null) return;
        const index = new ProblemIndex(problem);
        const bound = lineBound(index, session, { timeLimitMs: 60_000 });
        const pool = [...bound.lines, ...poolOf(index, linesOf(index, solved.roster))];
        const packed = linePack(index, session, pool, { timeLimitSeconds: 60 });
        expect(packed.optimal).toBe(true);
        const check = checkRoster(problem, rosterOfLines(index, packed.grid!), index);
        expect(check.violations).toEqual([]);
        expect(check.objective).toBeCloseTo(solved.objective!, 6);
        compared++;

        const start = construct(problem, { timeLimitMs: 200, seed: 1 });
        const startCheck = checkRoster(problem, start, index);
        if (startCheck.violations.length > 0) return;
        const fromStart = linePack(index, session, bound.lines, {
          timeLimitSeconds: 60,
          start: linesOf(index, start),
        });
        const after = checkRoster(problem, rosterOfLines(index, fromStart.grid!), index);
        expect(after.violations).toEqual([]);
        expect(after.objective).toBeLessThanOrEqual(startCheck.objective + 1e-6);
        started++;
      }),
      { seed: 20261205, numRuns: 30 },
    );
    expect(compared).toBeGreaterThan(10);
    expect(started).toBeGreaterThan(3);
  });

  it('gives a roster the checker accepts on benchmark instance 5, never below the optimum 1143', async () => {
    const session = await threadSession();
    const { problem } = loadInstance(5);
    const index = new ProblemIndex(problem);
    const bound = lineBound(index, session, { timeLimitMs: 120_000 });
    const packed = linePack(index, session, bound.lines, { timeLimitSeconds: 20 });
    expect(packed.grid).not.toBeNull();
    const check = checkRoster(problem, rosterOfLines(index, packed.grid!), index);
    expect(check.violations).toEqual([]);
    expect(check.objective).toBeCloseTo(packed.objective!, 6);
    expect(check.objective).toBeGreaterThanOrEqual(1143);
  });
});
