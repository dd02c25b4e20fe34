import { forbiddenSuccession } from './forbidden-succession';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('rule forbiddenSuccession', () => {
  const p = problem({
    days: 3,
    people: [person('a')],
    forbiddenSuccessions: [{ from: 'N', to: 'E' }],
    coverNeeds: [...needs('N', [0]), ...needs('E', [1])],
  });

  it('finds an early straight after a night, and only on the next day', () => {
    const { index } = grid(p, {});
    expect(forbiddenSuccession.check(index, grid(p, { a: 'NE.' }).grid).map((v) => v.days)).toEqual([[0, 1]]);
    expect(forbiddenSuccession.check(index, grid(p, { a: 'N.E' }).grid)).toEqual([]);
    expect(forbiddenSuccession.check(index, grid(p, { a: 'EN.' }).grid)).toEqual([]);
  });

  it('the model covers only one of night day 0 and early day 1', async () => {
    // One person; N on day 0 and E on day 1 are both needed but may not follow: optimum 100.
    expect((await solveAndCheck(p)).objective).toBe(100);
  });
});
