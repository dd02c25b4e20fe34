import { minConsecutiveWorkDays } from './min-consecutive-work-days';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('rule minConsecutiveWorkDays', () => {
  const contract = { minConsecutiveWorkDays: 3 };

  it('finds short runs inside the period but not border runs', () => {
    const p = problem({ days: 7, people: [person('a', contract)] });
    const { index } = grid(p, {});
    expect(minConsecutiveWorkDays.check(index, grid(p, { a: '..EE...' }).grid).map((v) => v.days)).toEqual([
      [2, 3],
    ]);
    expect(minConsecutiveWorkDays.check(index, grid(p, { a: 'E.....E' }).grid)).toEqual([]);
    expect(minConsecutiveWorkDays.check(index, grid(p, { a: '.EEE...' }).grid)).toEqual([]);
  });

  it('the model stretches a lone day inside the period to three', async () => {
    // 7 days, early needed only on day 3 (target 0 elsewhere: 1 per extra person). Working day 3
    // alone is a run of 1 inside the period, so the run must be 3 long, e.g. days 2-4:
    // two extra earlies → optimum 2 (leaving the need short would cost 100).
    const p = problem({
      days: 7,
      shiftTypes: [{ id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 480 }],
      people: [person('a', contract)],
      coverNeeds: [...needs('E', [3]), ...needs('E', [0, 1, 2, 4, 5, 6], 0)],
    });
    expect((await solveAndCheck(p)).objective).toBe(2);
  });

  it('a lone day on the first day of the period is allowed', async () => {
    // Early needed only on day 0: a run touching the border may be short → optimum 0.
    const p = problem({
      days: 7,
      shiftTypes: [{ id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 480 }],
      people: [person('a', contract)],
      coverNeeds: [...needs('E', [0]), ...needs('E', [1, 2, 3, 4, 5, 6], 0)],
    });
    expect((await solveAndCheck(p)).objective).toBe(0);
  });
});
