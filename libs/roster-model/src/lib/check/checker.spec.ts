import { checkRoster } from './checker';
import { needs, person, problem, roster } from '../model/fixtures.test-helpers';

describe('checkRoster', () => {
  const p = problem({
    days: 4,
    people: [person('a', { maxConsecutiveWorkDays: 2, minPaidMinutes: 960 }), person('b')],
    coverNeeds: needs('E', [0, 1, 2, 3]),
    forbiddenSuccessions: [{ from: 'N', to: 'E' }],
    requests: [{ personId: 'b', day: 0, kind: 'dayOff', weight: 2 }],
    absences: [{ personId: 'b', day: 3, kind: 'unavailable' }],
  });

  it('reports every violation and every term of a hand-made roster', () => {
    // a: N E E E → N→E succession on days 0-1, 4 working days in a row from day 0 (max 2).
    // b: E . . E → E on an unavailable day 3, dayOff request on day 0 broken (2).
    // Cover: E needed 1/day; day 0: b → 1; day 1: a; day 2: a; day 3: a and b → 1 over.
    const r = checkRoster(p, roster({ a: 'NEEE', b: 'E..E' }));
    expect(r.violations.map((v) => `${v.rule}:${v.personId}:${v.days.join('-')}`).sort()).toEqual([
      'absence:b:3',
      'forbiddenSuccession:a:0-1',
      'maxConsecutiveWorkDays:a:0-3',
    ]);
    expect(r.terms.coverOver).toBe(1);
    expect(r.terms.coverUnderTarget).toBe(0);
    expect(r.terms.requests).toBe(2);
    // fairness: nights a 1, b 0 → spread 1 × 5; weekends: none in days 0-3 (Mon-Thu) → 0.
    expect(r.terms.fairNights).toBe(5);
    expect(r.objective).toBe(1 + 2 + 5);
  });

  it('reports unknown shift types and treats the cell as a day off', () => {
    const r = checkRoster(p, { a: ['X', 'E', null, 'E'], b: [] });
    expect(r.violations.filter((v) => v.rule === 'unknownShiftType')).toHaveLength(1);
    // Cover: day 0 none (100), day 1 a, day 2 none (100), day 3 a → 200. a: 960 paid minutes, ok.
    expect(r.terms.coverUnderTarget).toBe(200);
  });

  it('a person missing from the roster is off every day', () => {
    const r = checkRoster(p, { b: ['E', 'E', 'E', null] });
    // a works nothing: 0 < 960 paid minutes.
    expect(r.violations.map((v) => v.rule)).toEqual(['minPaidMinutes']);
  });
});
