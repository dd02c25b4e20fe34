import { pin } from './pin';
import { grid, isInfeasible, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('rule pin', () => {
  it('finds a pinned cell that was changed, both ways', () => {
    const p = problem({
      days: 2,
      people: [person('a')],
      pins: [
        { personId: 'a', day: 0, shiftTypeId: 'E' },
        { personId: 'a', day: 1, shiftTypeId: null },
      ],
    });
    const { index } = grid(p, {});
    expect(pin.check(index, grid(p, { a: 'E.' }).grid)).toEqual([]);
    const v = pin.check(index, grid(p, { a: 'LE' }).grid);
    expect(v.map((x) => x.days[0])).toEqual([0, 1]);
    expect(v[0].message).toMatch(/pinned to shift E but has shift L/);
    expect(v[1].message).toMatch(/pinned to a day off but has shift E/);
  });

  it('the model keeps pins even when they over-cover', async () => {
    // Need one E on day 0 (over-cover costs 1 per person); a and b are both pinned to E: optimum 1.
    const p = problem({
      days: 1,
      people: [person('a'), person('b')],
      coverNeeds: needs('E', [0]),
      pins: [
        { personId: 'a', day: 0, shiftTypeId: 'E' },
        { personId: 'b', day: 0, shiftTypeId: 'E' },
      ],
    });
    expect((await solveAndCheck(p)).objective).toBe(1);
  });

  it('a pin to a day off leaves the need short', async () => {
    // Only person pinned off on day 0 where one E is needed: optimum 100.
    const p = problem({
      days: 1,
      people: [person('a')],
      coverNeeds: needs('E', [0]),
      pins: [{ personId: 'a', day: 0, shiftTypeId: null }],
    });
    expect((await solveAndCheck(p)).objective).toBe(100);
  });

  it('a pin on a leave day makes the model infeasible (rows for both, so it can be explained)', async () => {
    const p = problem({
      days: 1,
      people: [person('a')],
      pins: [{ personId: 'a', day: 0, shiftTypeId: 'E' }],
      absences: [{ personId: 'a', day: 0, kind: 'leave' }],
    });
    expect(await isInfeasible(p)).toBe(true);
  });
});
