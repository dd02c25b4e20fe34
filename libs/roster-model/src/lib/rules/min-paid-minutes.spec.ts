import { minPaidMinutes } from './min-paid-minutes';
import { maxPaidMinutes } from './max-paid-minutes';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('rule minPaidMinutes', () => {
  it('finds too few paid minutes', () => {
    const p = problem({ days: 3, people: [person('a', { minPaidMinutes: 960 })] });
    const { index } = grid(p, {});
    // One early = 480 paid minutes < 960.
    const v = minPaidMinutes.check(index, grid(p, { a: 'E..' }).grid);
    expect(v[0].amount).toBe(480);
    // In hours, as people think of contracts (issue 10: no minutes where people think in hours).
    expect(v[0].message).toMatch(/: 8 h paid \(the contract asks for at least 16 h\)$/);
    expect(minPaidMinutes.check(index, grid(p, { a: 'EL.' }).grid)).toEqual([]);
  });

  it('the model works two shifts even when nobody needs them', async () => {
    // Three days, target 0 earlies each day (1 per person over); at least 960 paid minutes:
    // two 480-minute earlies (cheapest way: 2 × 1 over-cover) → optimum 2.
    const p = problem({
      days: 3,
      shiftTypes: [{ id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 480 }],
      people: [person('a', { minPaidMinutes: 960 })],
      coverNeeds: needs('E', [0, 1, 2], 0),
    });
    expect((await solveAndCheck(p)).objective).toBe(2);
  });
});

describe('rule maxPaidMinutes', () => {
  it('finds too many paid minutes', () => {
    const p = problem({ days: 3, people: [person('a', { maxPaidMinutes: 1000 })] });
    const { index } = grid(p, {});
    // Night 540 + early 480 = 1020 > 1000.
    expect(maxPaidMinutes.check(index, grid(p, { a: 'N.E' }).grid)[0].amount).toBe(20);
    expect(maxPaidMinutes.check(index, grid(p, { a: 'E.E' }).grid)).toEqual([]);
  });

  it('the model stops at the maximum', async () => {
    // Earlies needed on three days; at most 480 paid minutes = one early: optimum 200.
    const p = problem({
      days: 3,
      people: [person('a', { maxPaidMinutes: 480 })],
      coverNeeds: needs('E', [0, 1, 2]),
    });
    expect((await solveAndCheck(p)).objective).toBe(200);
  });
});
