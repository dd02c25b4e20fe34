import { minRest } from './min-rest';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';
import type { ShiftType } from '../problem';

// Shift times of the rest examples: late 14:00-22:00, early 06:00-14:00.
const LATE: ShiftType = { id: 'L', name: 'Late', start: '14:00', end: '22:00', paidMinutes: 480 };
const EARLY: ShiftType = { id: 'E', name: 'Early', start: '06:00', end: '14:00', paidMinutes: 480 };

function london(startDate: string, minRestMinutes: number) {
  return problem({
    startDate,
    timeZone: 'Europe/London',
    days: 2,
    shiftTypes: [EARLY, LATE],
    people: [person('a', { minRestMinutes })],
    coverNeeds: [...needs('L', [0]), ...needs('E', [1])],
  });
}

describe('rule minRest', () => {
  // UK clock changes (Summer Time Order; EU Directive 2000/84/EC): forward 01:00 GMT → 02:00 BST on
  // Sunday 29 March 2026, back 02:00 BST → 01:00 GMT on Sunday 25 October 2026.
  it('late Sat 28 Mar then early Sun 29 Mar breaks an 8 h rest rule (7 h of real rest)', async () => {
    // 22:00 GMT → 06:00 BST = 05:00 UTC: 7 h < 8 h, so only one of the two needs can be covered: 100.
    const p = london('2026-03-28', 480);
    const { index, grid: g } = grid(p, { a: 'LE' });
    const v = minRest.check(index, g);
    expect(v).toHaveLength(1);
    expect(v[0].message).toMatch(/only 7 h rest/);
    expect((await solveAndCheck(p)).objective).toBe(100);
  });

  it('late Sat 24 Oct then early Sun 25 Oct keeps an 8 h rest rule (9 h of real rest)', async () => {
    // 22:00 BST = 21:00 UTC → 06:00 GMT = 06:00 UTC: 9 h ≥ 8 h; both needs covered: 0.
    const p = london('2026-10-24', 480);
    const { index, grid: g } = grid(p, { a: 'LE' });
    expect(minRest.check(index, g)).toEqual([]);
    expect((await solveAndCheck(p)).objective).toBe(0);
  });

  it('looks further than the next day when the limit is long', async () => {
    // Early 06:00-14:00 (UTC) every day, rest limit 41 h = 2460 min. Early day 0 → early day 2:
    // 14:00 → 06:00 two days later = 40 h < 41 h, so any two earlies within two days clash.
    // Three days needing one early each: only one can be worked → optimum 200.
    const p = problem({
      days: 3,
      shiftTypes: [EARLY],
      people: [person('a', { minRestMinutes: 2460 })],
      coverNeeds: needs('E', [0, 1, 2]),
    });
    const { index, grid: g } = grid(p, { a: 'E.E' });
    expect(minRest.check(index, g).map((v) => v.days)).toEqual([[0, 2]]);
    expect((await solveAndCheck(p)).objective).toBe(200);
  });
});
