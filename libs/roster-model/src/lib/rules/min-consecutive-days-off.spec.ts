import { minConsecutiveDaysOff } from './min-consecutive-days-off';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

const E = { id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 480 };

describe('rule minConsecutiveDaysOff', () => {
  const contract = { minConsecutiveDaysOff: 2 };

  it('finds a single day off between shifts but not at the borders', () => {
    const p = problem({ days: 5, people: [person('a', contract)] });
    const { index } = grid(p, {});
    expect(minConsecutiveDaysOff.check(index, grid(p, { a: 'EE.EE' }).grid).map((v) => v.days)).toEqual([
      [2, 2],
    ]);
    expect(minConsecutiveDaysOff.check(index, grid(p, { a: '.EEE.' }).grid)).toEqual([]);
    expect(minConsecutiveDaysOff.check(index, grid(p, { a: 'E..EE' }).grid)).toEqual([]);
  });

  it('the model works through a lone day off rather than taking it', async () => {
    // Early needed on days 0,1,3,4 (target 0 on day 2, 1 per extra person). Taking only day 2 off is a
    // one-day break inside the period; working day 2 costs 1, two days off cost 100 → optimum 1.
    const p = problem({
      days: 5,
      shiftTypes: [E],
      people: [person('a', contract)],
      coverNeeds: [...needs('E', [0, 1, 3, 4]), ...needs('E', [2], 0)],
    });
    expect((await solveAndCheck(p)).objective).toBe(1);
  });

  it('a single day off at the start of the period is allowed', async () => {
    // Early needed on days 1-4 and not on day 0: off on day 0 only is a border run → optimum 0.
    const p = problem({
      days: 5,
      shiftTypes: [E],
      people: [person('a', contract)],
      coverNeeds: [...needs('E', [1, 2, 3, 4]), ...needs('E', [0], 0)],
    });
    expect((await solveAndCheck(p)).objective).toBe(0);
  });
});
