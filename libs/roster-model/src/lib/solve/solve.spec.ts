/**
 * solveRoster on the real HiGHS build, with the real checker. Problems are tiny or time-limited so
 * each test runs in a few seconds. Expected outcomes are worked out by hand beside each check.
 */
import * as checker from '../check/checker';
import * as modelBuilder from '../model/build-model';
import type { SolveProgress } from '../result';
import { busyUnit, smallWard } from './fixtures.test-helpers';
import { SolverCheckError, assertCheckerAgrees, solveRoster } from './solve';

describe('solveRoster', () => {
  afterEach(() => jest.restoreAllMocks());

  it('solves a small ward to a proven optimum that the independent checker confirms', async () => {
    // Hand-worked: every day needs an rn on each of E, L, N plus a second person on E: 4 shifts a
    // day, 28 in the week, for 6 people who may each work up to 5 days (30 shift slots), with 11 h
    // rest making N→E/L and L→E on consecutive days impossible. A roster with no cover shortfall
    // exists (e.g. two rn rotating nights), and with targets equal to minimums and no requests
    // every penalty can be 0. So the optimum is 0 and the bound proves it.
    const result = await solveRoster(smallWard(), { timeLimitSeconds: 60 });
    expect(result.status).toBe('optimal');
    expect(result.objective).toBe(0);
    expect(result.bound).toBeCloseTo(0, 6);
    expect(result.check?.violations).toEqual([]);
    expect(result.quality).toBe('Proven best possible roster.');
    expect(result.unmetNeeds).toEqual([]);
    // The roster really covers every need: count rn on each shift of each day.
    const problem = smallWard();
    for (const need of problem.coverNeeds) {
      const count = problem.people.filter(
        (p) =>
          (need.skillId === null || p.skills.includes(need.skillId)) &&
          result.roster?.[p.id][need.day] === need.shiftTypeId,
      ).length;
      expect(count).toBeGreaterThanOrEqual(need.min);
    }
  });

  it('emits throttled progress and respects the time limit on a problem it cannot finish', async () => {
    const events: SolveProgress[] = [];
    const limit = 6;
    const result = await solveRoster(busyUnit(), {
      timeLimitSeconds: limit,
      // The plain MIP path: its progress carries HiGHS's bound once the root LP is solved.
      strategy: 'mip',
      onProgress: (p) => events.push(p),
    });
    expect(result.status).toBe('timeLimit');
    // Not a speed test: the limit covers the whole call, but model building and the heuristic
    // cannot be interrupted (on a loaded machine they may use it all up), and HiGHS checks its clock
    // between steps. So: HiGHS stops within a second of the limit, or of the end of the setup.
    // Without the limit this problem runs for minutes.
    expect(result.seconds).toBeLessThan(Math.max(limit, result.setupSeconds) + 1);
    if (result.roster !== null) {
      expect(result.check?.violations).toEqual([]);
      // (A bound from before the root LP is far below the roster: nothing proved yet.)
      if (result.gap !== null && result.gap < 0.995) {
        expect(result.quality).toMatch(
          /^No roster can be more than \d+(\.\d)?% better than this one \(stopped at the time limit\)\.$/,
        );
      } else {
        // A loaded machine may stop HiGHS before its root LP gives a bound.
        expect(result.gap === null || result.gap >= 0.995).toBe(true);
        expect(result.quality).toBe(
          'A roster was found (stopped at the time limit), but the solver has not yet proved how close it is to the best possible.',
        );
      }
    } else {
      // On a heavily loaded machine the heuristic and HiGHS may not reach a roster in time.
      expect(result.quality).toBe('Stopped at the time limit before a roster was found.');
    }
    // Progress: several events, time moving forward, at most about 4 a second (the last one is forced).
    expect(events.length).toBeGreaterThanOrEqual(2);
    for (let i = 1; i < events.length; i++) {
      expect(events[i].elapsedSeconds).toBeGreaterThanOrEqual(events[i - 1].elapsedSeconds);
      if (i < events.length - 1)
        expect(events[i].elapsedSeconds - events[i - 1].elapsedSeconds).toBeGreaterThan(0.2);
    }
    const last = events[events.length - 1];
    if (result.objective !== null) expect(last.objective).toBeCloseTo(result.objective, 6);
    expect(last.bound).toBe(result.bound);
  });

  it('stops on cancel and keeps the best roster found so far', async () => {
    const controller = new AbortController();
    let seenObjective: number | null = null;
    const result = await solveRoster(busyUnit(), {
      timeLimitSeconds: 60,
      signal: controller.signal,
      onProgress: (p) => {
        if (p.objective !== null && seenObjective === null) {
          seenObjective = p.objective;
          controller.abort();
        }
      },
    });
    expect(seenObjective).not.toBeNull();
    expect(result.status).toBe('interrupted');
    expect(result.seconds).toBeLessThan(30);
    expect(result.roster).not.toBeNull();
    expect(result.check?.violations).toEqual([]);
    // The incumbent kept is the one seen, or a better one found before the interrupt took effect.
    expect(result.objective as number).toBeLessThanOrEqual((seenObjective as unknown as number) + 1e-6);
    expect(result.quality).toMatch(/\(stopped early\)/);
  });

  it('reports "no roster" correctly when stopped before any was found', async () => {
    // No warm start and a limit shorter than presolve: HiGHS ends with an infinite objective.
    const result = await solveRoster(busyUnit(), { timeLimitSeconds: 0.01, warmStart: null });
    expect(result.status).toBe('timeLimit');
    expect(result.roster).toBeNull();
    expect(result.objective).toBeNull();
    expect(result.check).toBeNull();
    expect(result.quality).toBe('Stopped at the time limit before a roster was found.');
  });

  it('keeps a valid warm start when stopped before HiGHS took it', async () => {
    // A roster that meets every hard rule (the small ward's optimum), given as the start, with a limit
    // shorter than HiGHS's own setup: HiGHS reports no solution, the start must still be returned.
    const problem = smallWard();
    const first = await solveRoster(problem, { timeLimitSeconds: 60, explain: false });
    const result = await solveRoster(problem, {
      timeLimitSeconds: 0.01,
      explain: false,
      warmStart: first.roster!,
    });
    expect(result.warmStartObjective).toBe(first.objective);
    expect(result.roster).not.toBeNull();
    expect(result.check?.violations).toEqual([]);
    expect(result.objective).toBe(first.objective);
  });

  it('fails loudly when the checker disagrees with the solver', async () => {
    // Simulate a model bug: the checker is handed the solver's roster with one person's day
    // changed, so its objective (and possibly its rule verdict) differs from the solver's.
    const real = checker.checkRoster;
    jest.spyOn(checker, 'checkRoster').mockImplementation((problem, roster, index) => {
      const tampered = {
        ...roster,
        ada: roster.ada.map((s, d) => (d === 0 ? (s === null ? 'E' : null) : s)),
      };
      return real(problem, tampered, index);
    });
    await expect(solveRoster(smallWard(), { timeLimitSeconds: 60 })).rejects.toThrow(SolverCheckError);
  });

  it('assertCheckerAgrees accepts the checker’s verdict on a solver roster and rejects a planted violation', async () => {
    const problem = smallWard();
    const result = await solveRoster(problem, { timeLimitSeconds: 60, explain: false });
    const roster = result.roster!;
    const check = checker.checkRoster(problem, roster);
    expect(() => assertCheckerAgrees(check, result.objective!)).not.toThrow();
    // Objective off by one unit: rejected.
    expect(() => assertCheckerAgrees(check, result.objective! + 1)).toThrow(/objective/);
    // Planted violation: ada works 7 days in a row (contract allows 5).
    const planted = { ...roster, ada: ['E', 'E', 'E', 'E', 'E', 'E', 'E'] };
    const bad = checker.checkRoster(problem, planted);
    expect(() => assertCheckerAgrees(bad, bad.objective)).toThrow(/hard rule/);
  });

  it('starts from a given roster (repair-style warm start) and reports its objective', async () => {
    const problem = smallWard();
    const first = await solveRoster(problem, { timeLimitSeconds: 60, explain: false });
    const again = await solveRoster(problem, {
      timeLimitSeconds: 60,
      explain: false,
      warmStart: first.roster!,
    });
    expect(again.warmStartObjective).toBe(first.objective);
    expect(again.objective).toBe(first.objective);
  });
  it('takes a warm start that breaks hard rules (elastic model) and still proves the small ward optimum', async () => {
    // Same hand-worked optimum 0 as the first test. The start has everyone on nights all week,
    // which breaks the weekly limit of working days and leaves earlies uncovered: HiGHS cannot
    // take it on the strict model, the elastic model can, and the result must still be strict.
    const problem = smallWard();
    const allNights = Object.fromEntries(problem.people.map((p) => [p.id, new Array(7).fill('N')]));
    expect(checker.checkRoster(problem, allNights).violations.length).toBeGreaterThan(0);
    const builds = jest.spyOn(modelBuilder, 'buildModel');
    const result = await solveRoster(problem, {
      timeLimitSeconds: 60,
      explain: false,
      strategy: 'mip',
      warmStart: allNights,
    });
    expect(result.status).toBe('optimal');
    expect(result.objective).toBe(0);
    expect(result.check?.violations).toEqual([]);
    expect(checker.checkRoster(problem, result.roster!).violations).toEqual([]);
    expect(builds.mock.calls.some(([, o]) => (o?.elastic ?? 0) > 0)).toBe(true);
  });

  it('fix-and-optimise first, then the full MIP, still reaches and proves the small ward optimum', async () => {
    // Same hand-worked optimum 0 as the first test: the final full MIP starts from the
    // fix-and-optimise roster and proves it.
    const result = await solveRoster(smallWard(), {
      timeLimitSeconds: 60,
      explain: false,
      strategy: 'fixAndOptimise',
    });
    expect(result.status).toBe('optimal');
    expect(result.objective).toBe(0);
    expect(result.check?.violations).toEqual([]);
  });

  it.each(['fixAndOptimise', 'mipThenFixAndOptimise'] as const)(
    'strategy %s returns a checked roster no worse than its warm start on a problem it cannot finish',
    async (strategy) => {
      const result = await solveRoster(busyUnit(), { timeLimitSeconds: 8, explain: false, strategy });
      if (result.roster === null) {
        // On a heavily loaded machine the heuristic and HiGHS may not reach a roster in time.
        expect(result.quality).toBe('Stopped at the time limit before a roster was found.');
        return;
      }
      expect(result.check?.violations).toEqual([]);
      if (result.warmStartObjective !== null)
        expect(result.objective as number).toBeLessThanOrEqual(result.warmStartObjective);
      // Improvements of both phases are reported in time order.
      for (let i = 1; i < result.improvements.length; i++)
        expect(result.improvements[i].seconds).toBeGreaterThanOrEqual(result.improvements[i - 1].seconds);
      // The reported roster is the best improvement found (or the warm start).
      const best = Math.min(
        ...result.improvements.map((i) => i.objective),
        result.warmStartObjective ?? Infinity,
      );
      expect(result.objective as number).toBeLessThanOrEqual(best + 1e-6);
    },
  );
});
