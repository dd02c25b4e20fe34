/**
 * The local search (roster-search.ts): every roster it returns passes the independent checker with
 * the objective it states; it keeps pins and absences; it reaches the proven optimum of a published
 * benchmark instance; and it continues from a better roster handed in by another solve.
 * Runs are bounded by a number of moves, not by time, so they repeat exactly.
 */
import { checkRoster } from '../check/checker';
import { loadInstance } from '../bench/curtois-qu';
import { bestKnownFor } from '../bench/best-known';
import { construct } from '../heuristic/construct';
import { ProblemIndex, type Grid } from '../model/context';
import { randomProblem } from '../model/random.test-helpers';
import { solveRoster } from '../solve/solve';
import { LineDp } from './line-dp';
import { RosterSearch, searchRoster } from './roster-search';

const LONG = 1e9;

describe('searchRoster', () => {
  it('returns rosters that pass the checker with the stated objective (random problems, every rule and goal)', () => {
    let feasible = 0;
    for (let seed = 1; seed <= 10; seed++) {
      const problem = randomProblem(seed, 6, 14);
      const index = new ProblemIndex(problem);
      const start = construct(problem, { maxIterations: 500, seed });
      const result = searchRoster(index, start, { maxMoves: 50_000, timeLimitMs: LONG, seed });
      const check = checkRoster(problem, result.roster, index);
      expect(result.feasible).toBe(check.violations.length === 0);
      if (!result.feasible) continue;
      feasible++;
      expect(result.objective).toBeCloseTo(check.objective, 6);
      // Pins hold and nobody works a blocked cell.
      for (const pin of problem.pins) expect(result.roster[pin.personId][pin.day]).toBe(pin.shiftTypeId);
      for (const a of problem.absences) expect(result.roster[a.personId][a.day]).toBeNull();
    }
    expect(feasible).toBeGreaterThanOrEqual(7);
  });

  it('keeps its totals right with best-line and two-line moves (random problems, checked by the checker)', () => {
    let feasible = 0;
    for (let seed = 1; seed <= 10; seed++) {
      const problem = randomProblem(seed, 6, 14);
      const index = new ProblemIndex(problem);
      const dp = new LineDp(index);
      const after: [number, ReturnType<typeof checkRoster>][] = [];
      const start = construct(problem, { maxIterations: 500, seed });
      const result = searchRoster(index, start, {
        maxMoves: 50_000,
        timeLimitMs: LONG,
        seed,
        lineSolver: (p, extra) => dp.solve(p, extra),
        lineShare: 0.5,
        linePair: 0.5,
        // After every line move the running totals are those of the roster (exact bookkeeping).
        afterLineMove: (soft, hard, grid) => {
          if (hard === 0) after.push([soft, checkRoster(problem, index.fromGrid(grid()), index)]);
        },
      });
      expect(after.length).toBeGreaterThan(0);
      for (const [objective, check] of after) {
        expect(check.violations).toEqual([]);
        expect(objective).toBeCloseTo(check.objective, 6);
      }
      // The line moves ran (they are due by time, so their number varies from run to run).
      expect(dp.calls).toBeGreaterThan(index.P);
      const check = checkRoster(problem, result.roster, index);
      expect(result.feasible).toBe(check.violations.length === 0);
      if (!result.feasible) continue;
      feasible++;
      expect(result.objective).toBeCloseTo(check.objective, 6);
      for (const pin of problem.pins) expect(result.roster[pin.personId][pin.day]).toBe(pin.shiftTypeId);
      for (const a of problem.absences) expect(result.roster[a.personId][a.day]).toBeNull();
    }
    expect(feasible).toBeGreaterThanOrEqual(7);
  });

  it('reaches the proven optimum 607 of benchmark Instance1 (Curtois & Qu; SOURCES.md §5a: bound = best)', () => {
    const { problem, name } = loadInstance(1);
    expect(bestKnownFor(name)).toEqual({ lowerBound: 607, best: 607 });
    const index = new ProblemIndex(problem);
    for (const seed of [1, 2]) {
      const start = construct(problem, { maxIterations: 2000, seed });
      const result = searchRoster(index, start, { maxMoves: 4_000_000, timeLimitMs: LONG, seed });
      expect(result.feasible).toBe(true);
      expect(checkRoster(problem, result.roster, index).objective).toBe(607);
    }
  });

  it('gives up when it finds no roster that keeps every rule', () => {
    // Nobody may work more than 2 shifts but one person must be paid for 5: no roster keeps every rule.
    const problem = randomProblem(5, 4, 7);
    problem.people[0].contract = {
      ...problem.people[0].contract,
      minPaidMinutes: 5 * 480,
      maxPaidMinutes: 2 * 480,
    };
    const index = new ProblemIndex(problem);
    const result = searchRoster(index, construct(problem, { maxIterations: 100 }), {
      maxMoves: Number.MAX_SAFE_INTEGER,
      timeLimitMs: LONG,
      giveUpMs: 200,
    });
    expect(result.feasible).toBe(false);
    expect(checkRoster(problem, result.roster, index).violations.length).toBeGreaterThan(0);
  });

  it('stops at a target objective and never reports below the proven optimum', () => {
    const { problem } = loadInstance(1);
    const index = new ProblemIndex(problem);
    const seen: number[] = [];
    const result = searchRoster(index, construct(problem, { maxIterations: 2000 }), {
      maxMoves: 5_000_000,
      timeLimitMs: LONG,
      targetObjective: 700,
      onBest: (objective, roster) => {
        seen.push(objective);
        const check = checkRoster(problem, index.fromGrid(roster()), index);
        expect(check.violations).toEqual([]);
        expect(check.objective).toBeCloseTo(objective, 6);
      },
    });
    expect(result.objective).toBeLessThanOrEqual(700);
    expect(result.moves).toBeLessThan(5_000_000);
    expect(Math.min(...seen)).toBeGreaterThanOrEqual(607);
    // Each reported roster is better than the one before.
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeLessThan(seen[i - 1]);
  });

  it('takes a better roster handed in at a restart, and ignores one that breaks a rule', async () => {
    const problem = randomProblem(3, 5, 7);
    const index = new ProblemIndex(problem);
    const optimal = await solveRoster(problem, { timeLimitSeconds: 30, explain: false });
    expect(optimal.status).toBe('optimal');
    const best = index.toGrid(optimal.roster!).grid;
    const empty: Grid = best.map((row) => row.map(() => -1));
    const offers: (Grid | null)[] = [empty, best];
    const start = construct(problem, { maxIterations: 10 });
    // Few moves per round, so the offers arrive long before the search could find the optimum itself.
    const search = new RosterSearch(index, index.toGrid(start).grid);
    const result = search.run({
      maxMoves: 70_000, // restarts after 20,000 and 60,000 moves
      timeLimitMs: LONG,
      startTemperature: 1000,
      incoming: () => (offers.length ? offers.shift()! : null),
    });
    expect(offers).toEqual([]);
    expect(result.feasible).toBe(true);
    expect(result.objective).toBeCloseTo(optimal.objective!, 6);
  });
});
