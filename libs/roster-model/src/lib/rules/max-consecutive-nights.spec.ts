import { maxConsecutiveNights } from './max-consecutive-nights';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('rule maxConsecutiveNights', () => {
  const p = problem({
    days: 4,
    people: [person('a', { maxConsecutiveNights: 2 })],
    coverNeeds: needs('N', [0, 1, 2, 3]),
  });

  it('counts only night shifts in a row (N is 22:00-07:00, a night by the 00:00-05:00 rule)', () => {
    const { index } = grid(p, {});
    expect(maxConsecutiveNights.check(index, grid(p, { a: 'NNN.' }).grid).map((v) => v.days)).toEqual([
      [0, 2],
    ]);
    expect(maxConsecutiveNights.check(index, grid(p, { a: 'NNEN' }).grid)).toEqual([]);
  });

  it('the model breaks a run of nights after two', async () => {
    // Nights needed on 4 days, at most 2 in a row: NN.N → one short → optimum 100.
    expect((await solveAndCheck(p)).objective).toBe(100);
  });
});
