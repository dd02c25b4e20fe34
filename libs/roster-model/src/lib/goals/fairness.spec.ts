import { fairNights } from './fair-nights';
import { fairWeekends } from './fair-weekends';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('goal fairNights', () => {
  const p = problem({ days: 2, people: [person('a'), person('b')], coverNeeds: needs('N', [0, 1]) });

  it('charges the spread between most and fewest nights', () => {
    const { index } = grid(p, {});
    // a 2 nights, b 0 → spread 2 × weight 5 = 10.
    expect(fairNights.check(index, grid(p, { a: 'NN', b: '..' }).grid)).toBe(10);
    expect(fairNights.check(index, grid(p, { a: 'N.', b: '.N' }).grid)).toBe(0);
  });

  it('leaves out people who may not work nights', () => {
    const q = problem({ ...p, people: [person('a'), person('b', { maxShiftsPerType: { N: 0 } })] });
    const { index } = grid(q, {});
    expect(fairNights.check(index, grid(q, { a: 'NN', b: '..' }).grid)).toBe(0);
  });

  it('the model shares the nights', async () => {
    // Two nights, two people: one each → spread 0, cover met → 0.
    const r = await solveAndCheck(p);
    expect(r.objective).toBe(0);
  });
});

describe('goal fairWeekends', () => {
  // 7 days from Monday: one weekend (days 5-6).
  const p = problem({ days: 7, people: [person('a'), person('b')], coverNeeds: needs('E', [5, 6]) });

  it('charges the spread of worked weekends', () => {
    const { index } = grid(p, {});
    expect(fairWeekends.check(index, grid(p, { a: '.....EE', b: '.......' }).grid)).toBe(5);
    expect(fairWeekends.check(index, grid(p, { a: '.....E.', b: '......E' }).grid)).toBe(0);
  });

  it('the model gives each person one weekend day', async () => {
    // Both weekend days needed: a on Saturday and b on Sunday (or the other way) → spread 0 → 0.
    expect((await solveAndCheck(p)).objective).toBe(0);
  });
});
