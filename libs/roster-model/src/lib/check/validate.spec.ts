import { validateProblem } from './validate';
import { needs, person, problem } from '../model/fixtures.test-helpers';

describe('validateProblem', () => {
  it('accepts a well-formed problem', () => {
    expect(
      validateProblem(problem({ days: 7, people: [person('a')], coverNeeds: needs('E', [0, 6]) })),
    ).toEqual([]);
  });

  it('lists each error in plain words', () => {
    const p = problem({
      startDate: '2026-02-30',
      timeZone: 'Nowhere/Town',
      days: 3,
      shiftTypes: [
        { id: 'E', name: 'Early', start: '7:00', end: '15:00', paidMinutes: 480 },
        { id: 'E', name: 'Again', start: '07:00', end: '15:00', paidMinutes: -5 },
      ],
      people: [
        person('a', { minPaidMinutes: 900, maxPaidMinutes: 600, maxShiftsPerType: { Z: 1 } }),
        person('a'),
      ],
      coverNeeds: [{ day: 0, shiftTypeId: 'E', skillId: null, min: 2, target: 1 }],
      requests: [{ personId: 'ghost', day: 9, kind: 'shiftOn', weight: 1 }],
      absences: [{ personId: 'a', day: -1, kind: 'leave' }],
      pins: [
        { personId: 'a', day: 0, shiftTypeId: 'E' },
        { personId: 'a', day: 0, shiftTypeId: null },
      ],
      forbiddenSuccessions: [{ from: 'E', to: 'Q' }],
      weights: { coverOver: -1 },
    });
    const errors = validateProblem(p);
    for (const expected of [
      'startDate: Date "2026-02-30" does not exist',
      'timeZone "Nowhere/Town" is not a known IANA time zone',
      'shift type id "E" is used twice',
      'shift type "E" start: Time "7:00" is not in HH:mm 24-hour form',
      'shift type "E": paidMinutes must be a number ≥ 0',
      'person id "a" is used twice',
      'person "a": maxShiftsPerType names unknown shift type "Z"',
      'person "a": minPaidMinutes 900 is above maxPaidMinutes 600',
      'cover need 0 (day 0, E): min 2 is above target 1',
      'request 0 (ghost, day 9): unknown person',
      'request 0 (ghost, day 9): day is outside the period 0…2',
      'request 0 (ghost, day 9): shiftOn needs a known shift type (got "undefined")',
      'absence 0 (a, day -1): day is outside the period 0…2',
      'pin 1 (a, day 0): the same cell is pinned twice',
      'forbidden succession 0: unknown shift type ("E" → "Q")',
      'weights.coverOver must be a number ≥ 0 (got -1)',
    ]) {
      expect(errors).toContain(expected);
    }
  });

  it('rejects a minimum shortfall that costs less than a target shortfall', () => {
    const p = problem({
      days: 1,
      people: [person('a')],
      coverNeeds: [
        {
          day: 0,
          shiftTypeId: 'E',
          skillId: null,
          min: 1,
          target: 2,
          weightUnderMin: 5,
          weightUnderTarget: 10,
        },
      ],
    });
    expect(validateProblem(p)).toEqual([
      'cover need 0 (day 0, E): a person short of the minimum (5) may not cost less than one short of the target (10)',
    ]);
  });
});
