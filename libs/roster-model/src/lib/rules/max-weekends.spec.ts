import { maxWeekends } from './max-weekends';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('rule maxWeekends', () => {
  // 14 days from Monday 2 March 2026: weekends are days 5-6 and 12-13.
  const p = problem({ days: 14, people: [person('a', { maxWeekends: 1 })], coverNeeds: needs('E', [5, 13]) });

  it('counts a weekend as worked when any of its days is worked', () => {
    const { index } = grid(p, {});
    expect(maxWeekends.check(index, grid(p, { a: '.....E.......E' }).grid)[0].amount).toBe(1);
    expect(maxWeekends.check(index, grid(p, { a: '.....EE.......' }).grid)).toEqual([]);
  });

  it('counts a weekend cut by the start of the period', () => {
    // From Sunday 1 March 2026: day 0 (Sunday) is a weekend of its own, days 6-7 the next one.
    const q = problem({ startDate: '2026-03-01', days: 8, people: [person('a', { maxWeekends: 1 })] });
    const { index } = grid(q, {});
    expect(maxWeekends.check(index, grid(q, { a: 'E.....E.' }).grid)).toHaveLength(1);
  });

  it('the model works only one of the two weekends', async () => {
    // Saturday day 5 and Sunday day 13 both need an early; at most one weekend → optimum 100.
    expect((await solveAndCheck(p)).objective).toBe(100);
  });
});
