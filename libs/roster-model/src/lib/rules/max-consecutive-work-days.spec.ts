import { maxConsecutiveWorkDays } from './max-consecutive-work-days';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('rule maxConsecutiveWorkDays', () => {
  const p = problem({
    days: 5,
    people: [person('a', { maxConsecutiveWorkDays: 2 })],
    coverNeeds: needs('E', [0, 1, 2, 3, 4]),
  });

  it('finds runs that are too long, including runs at the borders', () => {
    const { index } = grid(p, {});
    expect(maxConsecutiveWorkDays.check(index, grid(p, { a: 'EEE..' }).grid).map((v) => v.days)).toEqual([
      [0, 2],
    ]);
    expect(maxConsecutiveWorkDays.check(index, grid(p, { a: '..ENL' }).grid).map((v) => v.days)).toEqual([
      [2, 4],
    ]);
    expect(maxConsecutiveWorkDays.check(index, grid(p, { a: 'EE.EE' }).grid)).toEqual([]);
  });

  it('the model works at most two days in a row', async () => {
    // Five days needing an early, at most 2 in a row: best is EE.EE, one day short → 100.
    const r = await solveAndCheck(p);
    expect(r.objective).toBe(100);
  });
});
