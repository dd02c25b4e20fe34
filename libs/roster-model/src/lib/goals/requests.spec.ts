import { requests } from './requests';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('goal requests', () => {
  const p = problem({
    days: 3,
    people: [person('a')],
    requests: [
      { personId: 'a', day: 0, kind: 'shiftOn', shiftTypeId: 'E', weight: 3 },
      { personId: 'a', day: 1, kind: 'shiftOff', shiftTypeId: 'L', weight: 2 },
      { personId: 'a', day: 2, kind: 'dayOff', weight: 5 },
    ],
  });

  it('charges each request not honoured, times the requests weight', () => {
    const { index } = grid(p, {});
    // shiftOn E day 0 not met by L (3), shiftOff L day 1 broken (2), dayOff day 2 broken (5) = 10.
    expect(requests.check(index, grid(p, { a: 'LLN' }).grid)).toBe(10);
    expect(requests.check(index, grid(p, { a: 'EE.' }).grid)).toBe(0);
    // A day off on day 0 also fails the shift-on request: 3.
    expect(requests.check(index, grid(p, { a: '...' }).grid)).toBe(3);
    const doubled = problem({ ...p, weights: { requests: 2 } });
    expect(requests.check(grid(doubled, {}).index, grid(doubled, { a: '...' }).grid)).toBe(6);
  });

  it('the model honours what it can', async () => {
    // Nothing else matters: all three requests honoured → 0.
    expect((await solveAndCheck(p)).objective).toBe(0);
    // A late needed on day 0 (100 if short) beats the shift-on request for E (3): optimum 3.
    const q = { ...p, coverNeeds: needs('L', [0]) };
    expect((await solveAndCheck(q)).objective).toBe(3);
  });
});
