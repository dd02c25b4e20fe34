/**
 * The first roster (phases.ts, warmStartRoster): which models let the local search hand over to
 * HiGHS on a stall (policy.ts: SEARCH_STALL_MS, SEARCH_NO_STALL_X), on shift scheduling benchmark
 * instances (Curtois & Qu, SOURCES.md) of three sizes; a roster handed over that keeps every hard
 * rule by the independent checker is never below the instance's published lower bound.
 */
import { BEST_KNOWN } from '../bench/best-known';
import { loadInstance } from '../bench/curtois-qu';
import { checkRoster } from '../check/checker';
import { buildModel } from '../model/build-model';
import * as search from '../search/roster-search';
import { warmStartRoster } from './phases';
import { AUTO_LARGE_MODEL_X, SEARCH_NO_STALL_X, SEARCH_STALL_MS } from './policy';

describe('warmStartRoster: the local search before HiGHS', () => {
  afterEach(() => jest.restoreAllMocks());

  it.each([
    // instance, x columns of the product's model, whether the search hands over on a stall
    [1, 104, true],
    [7, 1248, false],
    [8, 2158, true],
  ])('on instance %i (%i x columns), hands over on a stall: %s', (n, columns, stalls) => {
    const { problem } = loadInstance(n);
    const built = buildModel(problem);
    expect(built.numX).toBe(columns);
    // The three sizes: below the band, inside it, and a large model.
    expect(columns < SEARCH_NO_STALL_X || columns >= AUTO_LARGE_MODEL_X).toBe(stalls);
    const calls = jest.spyOn(search, 'searchRoster');
    const start = warmStartRoster(built, problem, { randomSeed: 1 }, 2, performance.now(), { last: 0 });
    expect(calls).toHaveBeenCalledTimes(1);
    expect(calls.mock.calls[0][2]?.stallMs).toBe(stalls ? SEARCH_STALL_MS : undefined);
    expect(start).not.toBeNull();
    // A 2 s limit leaves the search under a second: a roster that keeps every rule is likely but
    // not certain on a loaded machine. One that does is never below the published lower bound
    // (BEST_KNOWN, from SOURCES.md §5a).
    const check = checkRoster(problem, start!.roster);
    if (check.violations.length === 0)
      expect(check.objective).toBeGreaterThanOrEqual(BEST_KNOWN[n].lowerBound);
  });
});
