import { maxShiftsPerType } from './max-shifts-per-type';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('rule maxShiftsPerType', () => {
  const p = problem({
    days: 3,
    people: [person('a', { maxShiftsPerType: { N: 1, L: 0 } })],
    coverNeeds: needs('N', [0, 1, 2]),
  });

  it('counts shifts of each type against the limit', () => {
    const { index } = grid(p, {});
    const v = maxShiftsPerType.check(index, grid(p, { a: 'N.N' }).grid);
    expect(v).toHaveLength(1);
    expect(v[0].amount).toBe(1);
    expect(maxShiftsPerType.check(index, grid(p, { a: 'L..' }).grid)[0].message).toMatch(
      /1 L shifts \(at most 0\)/,
    );
    expect(maxShiftsPerType.check(index, grid(p, { a: 'NEE' }).grid)).toEqual([]);
  });

  it('the model works at most one night', async () => {
    // Nights needed on three days, at most one night: optimum 2 × 100 = 200.
    expect((await solveAndCheck(p)).objective).toBe(200);
  });
});
