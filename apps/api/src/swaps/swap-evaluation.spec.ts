import { type RosterProblem } from '@rotaplex/roster-model';
import { type RosterInput } from '../roster-input/roster-input.service';
import { ClaimCheck, evaluateChanges, staleCells } from './swap-evaluation';

/**
 * The swap findings with the real checker on a small invented roster. Rules: 11 h daily rest
 * (EU Working Time Directive 2003/88/EC, Art. 3) and at most 6 working days in a row (a common
 * contract limit, common practice). Shifts as the demo ward: Early 07:00-15:00, Late 14:30-22:30.
 */
const DATES = [
  '2030-01-07',
  '2030-01-08',
  '2030-01-09',
  '2030-01-10',
  '2030-01-11',
  '2030-01-12',
  '2030-01-13',
  '2030-01-14',
];
const problem: RosterProblem = {
  startDate: DATES[0],
  days: DATES.length,
  timeZone: 'Europe/London',
  shiftTypes: [
    { id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 450 },
    { id: 'L', name: 'Late', start: '14:30', end: '22:30', paidMinutes: 450 },
  ],
  people: ['a', 'b'].map((id) => ({
    id,
    name: id.toUpperCase(),
    skills: [],
    contract: { minRestMinutes: 660, maxConsecutiveWorkDays: 6 },
  })),
  coverNeeds: [],
  requests: [],
  absences: [],
  forbiddenSuccessions: [],
  pins: [],
  weights: {},
};
const input = {
  problem,
  dates: DATES,
  staff: [
    { id: 'a', name: 'A' },
    { id: 'b', name: 'B' },
  ],
  shiftTypes: [
    { id: 'E', code: 'E', name: 'Early', start: '07:00', end: '15:00' },
    { id: 'L', code: 'L', name: 'Late', start: '14:30', end: '22:30' },
  ],
} as unknown as RosterInput;
const row = (staffMemberId: string, day: number, shiftTypeId: string) => ({
  staffMemberId,
  date: DATES[day],
  shiftTypeId,
});

describe('evaluateChanges', () => {
  it('finds a new rest violation for the person taking an Early after their Late (8.5 h < 11 h)', () => {
    const rows = [row('a', 0, 'L'), row('b', 1, 'E')];
    const p = evaluateChanges(input, rows, [
      { staffMemberId: 'b', date: DATES[1], before: 'E', after: null },
      { staffMemberId: 'a', date: DATES[1], before: null, after: 'E' },
    ]);
    expect(p.blocked).toBe(true);
    expect(p.violations.map((v) => [v.rule, v.staffMemberId, v.isNew])).toEqual([['minRest', 'a', true]]);
    expect(p.violations[0].dates).toEqual([DATES[0], DATES[1]]);
  });

  it('does not block on a violation the roster already had, unless the change makes it larger', () => {
    // A works 7 days in a row (one over the limit); B works day 7.
    const rows = [...[0, 1, 2, 3, 4, 5, 6].map((d) => row('a', d, 'E')), row('b', 7, 'E')];
    const same = evaluateChanges(input, rows, [
      { staffMemberId: 'a', date: DATES[3], before: 'E', after: 'E' },
    ]);
    expect(same.violations.map((v) => [v.rule, v.isNew])).toEqual([['maxConsecutiveWorkDays', false]]);
    expect(same.blocked).toBe(false);
    const longer = evaluateChanges(input, rows, [
      { staffMemberId: 'b', date: DATES[7], before: 'E', after: null },
      { staffMemberId: 'a', date: DATES[7], before: null, after: 'E' },
    ]);
    expect(longer.blocked).toBe(true);
    expect(longer.violations.find((v) => v.rule === 'maxConsecutiveWorkDays')?.isNew).toBe(true);
  });

  it('reports only the people the change touches', () => {
    const rows = [row('b', 0, 'L'), row('b', 1, 'E'), row('a', 3, 'E')];
    const p = evaluateChanges(input, rows, [{ staffMemberId: 'a', date: DATES[3], before: 'E', after: 'L' }]);
    expect(p.violations).toEqual([]);
  });
});

describe('staleCells', () => {
  it('lists the cells whose shift differs from the one recorded at proposal', () => {
    const rows = [row('a', 0, 'L'), row('b', 0, 'E')];
    expect(
      staleCells(rows, [
        { staffMemberId: 'a', date: DATES[0], before: 'L', after: 'E' },
        { staffMemberId: 'b', date: DATES[0], before: 'L', after: 'E' },
        { staffMemberId: 'b', date: DATES[1], before: null, after: 'E' },
      ]).map((c) => c.staffMemberId + c.date),
    ).toEqual(['b' + DATES[0]]);
  });
});

describe('ClaimCheck', () => {
  it('answers as evaluateChanges does for every free cell, shift and person of a roster', () => {
    // A: a Late on day 0 (rest), seven days in a row from day 1 (already one over the limit);
    // B: an Early on day 2 and a Late on day 5.
    const rows = [
      row('a', 0, 'L'),
      ...[1, 2, 3, 4, 5, 6, 7].map((d) => row('a', d, 'E')),
      row('b', 2, 'E'),
      row('b', 5, 'L'),
    ];
    const check = new ClaimCheck(input, rows);
    let blocked = 0;
    let allowed = 0;
    for (const person of ['a', 'b']) {
      for (const date of DATES) {
        for (const shift of ['E', 'L']) {
          const before = rows.find((r) => r.staffMemberId === person && r.date === date)?.shiftTypeId ?? null;
          const expected = evaluateChanges(input, rows, [
            { staffMemberId: person, date, before, after: shift },
          ]).blocked;
          expect([person, date, shift, check.blocked(person, date, shift)]).toEqual([
            person,
            date,
            shift,
            expected,
          ]);
          if (expected) blocked++;
          else allowed++;
        }
      }
    }
    // Both answers occur, so the comparison means something.
    expect(blocked).toBeGreaterThan(0);
    expect(allowed).toBeGreaterThan(0);
  });

  it('blocks a person, day or shift the roster does not know', () => {
    const check = new ClaimCheck(input, []);
    expect(check.blocked('nobody', DATES[0], 'E')).toBe(true);
    expect(check.blocked('a', '2031-01-01', 'E')).toBe(true);
    expect(check.blocked('a', DATES[0], 'X')).toBe(true);
    expect(check.blocked('a', DATES[0], 'E')).toBe(false);
  });
});
