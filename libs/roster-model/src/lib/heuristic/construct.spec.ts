import { construct, improve } from './construct';
import { checkRoster } from '../check/checker';
import { needs, person, problem, roster } from '../model/fixtures.test-helpers';
import { randomProblem } from '../model/random.test-helpers';

describe('construct', () => {
  it('always keeps pins and absences', () => {
    for (const seed of [11, 12, 13]) {
      const p = randomProblem(seed, 6, 14);
      const r = construct(p, { seed, timeLimitMs: 200 });
      const v = checkRoster(p, r).violations;
      expect(v.filter((x) => x.rule === 'pin' || x.rule === 'absence')).toEqual([]);
    }
  });

  it('finds the obvious roster on a small case', () => {
    // Two people, 7 days, one early a day, at most 4 working days each and min 2 in a row:
    // 7 earlies can be split 4 + 3 with no shortfall and no over-cover → objective 0.
    const p = problem({
      days: 7,
      shiftTypes: [{ id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 480 }],
      people: [
        person('a', { maxPaidMinutes: 4 * 480, minConsecutiveWorkDays: 2 }),
        person('b', { maxPaidMinutes: 4 * 480 }),
      ],
      coverNeeds: needs('E', [0, 1, 2, 3, 4, 5, 6]),
      weights: { fairWeekends: 0 },
    });
    const r = checkRoster(p, construct(p, { seed: 1, timeLimitMs: 300 }));
    expect(r.violations).toEqual([]);
    expect(r.objective).toBe(0);
  });

  it('the same seed and move budget give the same roster', () => {
    const p = randomProblem(21);
    const a = construct(p, { seed: 3, timeLimitMs: 10_000, maxIterations: 2000 });
    const b = construct(p, { seed: 3, timeLimitMs: 10_000, maxIterations: 2000 });
    expect(a).toEqual(b);
  });

  it('improve never makes a roster worse and repairs a planted violation', () => {
    // a works 5 days in a row against a maximum of 3; cover wants one early a day and b is free.
    const p = problem({
      days: 5,
      shiftTypes: [{ id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 480 }],
      people: [person('a', { maxConsecutiveWorkDays: 3 }), person('b', { maxConsecutiveWorkDays: 3 })],
      coverNeeds: needs('E', [0, 1, 2, 3, 4]),
      weights: { fairWeekends: 0 },
    });
    const start = roster({ a: 'EEEEE', b: '.....' });
    const before = checkRoster(p, start);
    expect(before.violations).toHaveLength(1);
    const after = checkRoster(p, improve(p, start, { seed: 2, timeLimitMs: 300 }));
    expect(after.violations).toEqual([]);
    expect(after.objective).toBeLessThanOrEqual(before.objective);
  });
});
