/**
 * The search's own scoring against the independent checker (check/checker.ts, which uses each
 * rule's and goal's own check): on random problems that use every rule and goal, and on random and
 * nearly feasible rosters, a line scores hard 0 exactly when the checker finds no violation for that
 * person, and the search's total equals the checker's objective.
 */
import fc from 'fast-check';
import { checkRoster } from '../check/checker';
import { construct } from '../heuristic/construct';
import { ProblemIndex, type Grid } from '../model/context';
import { randomProblem, seeded } from '../model/random.test-helpers';
import { RULES } from '../rules';
import { productProblemArb } from '../../external/random-instances.test-helpers';
import type { RosterProblem } from '../problem';
import { LineCost, type LineScore } from './line-cost';
import { RosterSearch } from './roster-search';

function randomGrid(index: ProblemIndex, random: () => number, density: number): Grid {
  return Array.from({ length: index.P }, () =>
    Array.from({ length: index.D }, () => (random() < density ? Math.floor(random() * index.S) : -1)),
  );
}

function expectAgreement(problem: RosterProblem, grid: Grid): void {
  const index = new ProblemIndex(problem);
  const line = new LineCost(index);
  const flat = new Int16Array(index.P * index.D);
  grid.forEach((row, p) => row.forEach((v, d) => (flat[p * index.D + d] = v)));
  const score: LineScore = { hard: 0, soft: 0, nights: 0, weekends: 0 };
  for (let p = 0; p < index.P; p++) {
    line.score(p, flat, score);
    const found = RULES.flatMap((rule) => rule.checkPerson(index, p, grid[p]));
    expect({ person: p, breaks: score.hard > 0 }).toEqual({ person: p, breaks: found.length > 0 });
  }
  // RosterSearch keeps pins and clears blocked cells of its start: compare on the grid it holds.
  const search = new RosterSearch(index, grid);
  const check = checkRoster(problem, index.fromGrid(search.toGrid()), index);
  expect(search.hard === 0).toBe(check.violations.length === 0);
  expect(search.soft).toBeCloseTo(check.objective, 6);
}

describe('LineCost and RosterSearch totals against the checker', () => {
  it('agree on random problems with every rule and goal and random rosters', () => {
    fc.assert(
      fc.property(
        productProblemArb({ horizons: [7, 14], maxStaff: 5, maxShiftTypes: 3 }),
        fc.integer({ min: 1, max: 1_000_000 }),
        fc.double({ min: 0.1, max: 0.9, noNaN: true }),
        (problem, seed, density) => {
          const index = new ProblemIndex(problem);
          expectAgreement(problem, randomGrid(index, seeded(seed), density));
        },
      ),
      { seed: 20261204, numRuns: 150 },
    );
  });

  it('agree on nearly feasible rosters: a heuristic roster and every one-cell change of it', () => {
    for (let seed = 1; seed <= 4; seed++) {
      const problem = randomProblem(seed, 5, 14);
      const index = new ProblemIndex(problem);
      const { grid } = index.toGrid(construct(problem, { maxIterations: 20000, seed }));
      expectAgreement(problem, grid);
      const random = seeded(seed);
      for (let k = 0; k < 25; k++) {
        const changed = grid.map((row) => row.slice());
        const p = Math.floor(random() * index.P);
        const d = Math.floor(random() * index.D);
        changed[p][d] = Math.floor(random() * (index.S + 1)) - 1;
        expectAgreement(problem, changed);
      }
    }
  });
});
