import {
  checkRoster,
  type ObjectiveWeights,
  type Roster,
  type RosterProblem,
  type ShiftTypeId,
} from '@rotaplex/roster-model';
import fc from 'fast-check';
import { cents, coverGaps, periodFigures } from './period-figures';

// A hand-made week (invented data). 2030-01-07 is a Monday, so days 5 and 6 are the weekend.
const DATES = [
  '2030-01-07',
  '2030-01-08',
  '2030-01-09',
  '2030-01-10',
  '2030-01-11',
  '2030-01-12',
  '2030-01-13',
];
const WEIGHTS: ObjectiveWeights = {
  coverUnderMin: 1000,
  coverUnderTarget: 100,
  coverOver: 1,
  requests: 1,
  fairNights: 0,
  fairWeekends: 0,
  hoursDeviation: 1,
  labourCost: 1,
  changes: 0,
};

function problem(overrides: Partial<RosterProblem> = {}): RosterProblem {
  return {
    startDate: DATES[0],
    days: 7,
    timeZone: 'Europe/London',
    shiftTypes: [
      { id: 'e', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 450 },
      // No night flag: derived from the times (at least 3 h inside 00:00-05:00, EU Directive 2003/88/EC Art. 2).
      { id: 'n', name: 'Night', start: '22:00', end: '07:30', paidMinutes: 540 },
    ],
    people: [
      {
        id: 'a',
        name: 'Ada',
        skills: ['rn'],
        hourlyCost: 20,
        contract: { minPaidMinutes: 1800, targetPaidMinutes: 2250, maxPaidMinutes: 2880 },
      },
      { id: 'b', name: 'Ben', skills: ['hca'], contract: {} },
      { id: 'c', name: 'Cai', skills: ['rn'], hourlyCost: 30, contract: { targetPaidMinutes: 900 } },
    ],
    coverNeeds: [
      { day: 0, shiftTypeId: 'e', skillId: 'rn', min: 1, target: 2 },
      { day: 5, shiftTypeId: 'n', skillId: null, min: 1, target: 1 },
      { day: 6, shiftTypeId: 'e', skillId: null, min: 1, target: 1 },
    ],
    requests: [
      { personId: 'a', day: 0, kind: 'dayOff', weight: 3 },
      { personId: 'c', day: 5, kind: 'shiftOn', shiftTypeId: 'n', weight: 2 },
      { personId: 'b', day: 3, kind: 'dayOff', weight: 1 },
    ],
    absences: [],
    forbiddenSuccessions: [],
    pins: [],
    weights: WEIGHTS,
    skillNames: { rn: 'RN', hca: 'HCA' },
    ...overrides,
  };
}

const ROSTER: Roster = {
  a: ['e', 'e', null, null, null, 'n', null],
  b: ['e', null, null, null, null, null, 'e'],
  c: [null, null, null, null, null, null, null],
};
const CODES = { e: 'E', n: 'N' };

describe('periodFigures', () => {
  const figures = periodFigures({ problem: problem(), roster: ROSTER, dates: DATES, shiftCodes: CODES });
  const person = (id: string) => figures.people.find((p) => p.staffMemberId === id)!;

  it('sums hours, nights, weekends and cost per person by hand', () => {
    // Ada: Early 450 + Early 450 + Night 540 = 1440 paid minutes (24 h); 24 h × 20 = 480.00;
    // 1440 − 2250 = −810 minutes against the target; one night; Saturday worked = 1 weekend, 1 weekend day.
    expect(person('a')).toMatchObject({
      shifts: 3,
      paidMinutes: 1440,
      minPaidMinutes: 1800,
      maxPaidMinutes: 2880,
      targetPaidMinutes: 2250,
      deviationMinutes: -810,
      nights: 1,
      weekendsWorked: 1,
      weekendDaysWorked: 1,
      labourCost: 480,
      requests: 1,
      requestsHonoured: 0,
    });
    // Ben: two Earlies = 900 minutes, no hourly cost known, Sunday worked; his day-off request on day 3 is honoured.
    expect(person('b')).toMatchObject({
      shifts: 2,
      paidMinutes: 900,
      deviationMinutes: null,
      nights: 0,
      weekendsWorked: 1,
      weekendDaysWorked: 1,
      hourlyCost: null,
      labourCost: null,
      requests: 1,
      requestsHonoured: 1,
    });
    expect(person('c')).toMatchObject({ shifts: 0, paidMinutes: 0, deviationMinutes: -900, labourCost: 0 });
    expect(figures.totals).toMatchObject({
      people: 3,
      shifts: 5,
      paidMinutes: 2340,
      nights: 1,
      weekendDaysWorked: 2,
      labourCost: 480,
      peopleWithoutCost: 1,
      requests: 3,
      requestsHonoured: 1,
    });
  });

  it('counts cover per need with skills, and per day', () => {
    // Monday Early RN: Ada is an RN, Ben is not → 1 of min 1, target 2: 1 short of the target.
    expect(figures.cover.find((c) => c.date === DATES[0])).toMatchObject({
      shiftCode: 'E',
      skillCode: 'RN',
      assigned: 1,
      shortOfMin: 0,
      shortOfTarget: 1,
      over: 0,
    });
    expect(figures.cover.filter((c) => c.date !== DATES[0]).every((c) => c.assigned === 1)).toBe(true);
    expect(figures.coverByDay[0]).toMatchObject({
      needs: 1,
      needsMetMin: 1,
      needsMetTarget: 0,
      shortOfTarget: 1,
    });
    expect(figures.coverByDay[1]).toMatchObject({ needs: 0, needsMetMin: 0 });
    expect(figures.totals).toMatchObject({ needs: 3, needsMetMin: 3, needsMetTarget: 2, shortOfMin: 0 });
  });

  it('lists requests not honoured with dates and reasons', () => {
    expect(figures.requestsNotHonoured.map((r) => [r.name, r.date, r.kind])).toEqual([
      ['Ada', DATES[0], 'dayOff'],
      ['Cai', DATES[5], 'shiftOn'],
    ]);
    expect(figures.requestsNotHonoured[0].reasons[0]).toMatch(/Ada asked for a day off/);
  });

  it('agrees with the independent checker on the example (weights as above)', () => {
    // coverUnderTarget: 1 person × 100; requests: weights 3 + 2; hours: |1440 − 2250| / 60 = 13.5 and
    // |0 − 900| / 60 = 15; labour cost 480 at weight 1.
    expect(figures.objectiveTerms).toMatchObject({
      coverUnderMin: 0,
      coverUnderTarget: 100,
      coverOver: 0,
      requests: 5,
      hoursDeviation: 28.5,
      labourCost: 480,
    });
  });

  it('agrees with the checker on every objective term it reports, for random rosters', () => {
    const cell = fc.constantFrom<ShiftTypeId | null>(null, 'e', 'n');
    const week = fc.array(cell, { minLength: 7, maxLength: 7 });
    const p = problem();
    fc.assert(
      fc.property(fc.record({ a: week, b: week, c: week }), (roster) => {
        const f = periodFigures({ problem: p, roster, dates: DATES, shiftCodes: CODES });
        const terms = checkRoster(p, roster).terms;
        const unhonouredWeight = f.requestsNotHonoured
          .map((r) => p.requests.find((q) => q.personId === r.staffMemberId && DATES[q.day] === r.date)!)
          .reduce((s, q) => s + q.weight, 0);
        const hours = f.people.reduce((s, x) => s + Math.abs(x.deviationMinutes ?? 0) / 60, 0);
        expect(f.totals.shortOfMin * WEIGHTS.coverUnderMin).toBeCloseTo(terms.coverUnderMin, 9);
        expect(f.totals.shortOfTarget * WEIGHTS.coverUnderTarget).toBeCloseTo(terms.coverUnderTarget, 9);
        expect(f.totals.over * WEIGHTS.coverOver).toBeCloseTo(terms.coverOver, 9);
        expect(unhonouredWeight).toBeCloseTo(terms.requests, 9);
        expect(hours).toBeCloseTo(terms.hoursDeviation, 9);
        expect(f.totals.labourCost).toBeCloseTo(terms.labourCost, 2);
        expect(f.objectiveTerms).toEqual(terms);
      }),
      { numRuns: 150 },
    );
  });

  it('takes night shifts from the shift type flag when set', () => {
    const p = problem();
    p.shiftTypes[0] = { ...p.shiftTypes[0], night: true };
    const f = periodFigures({ problem: p, roster: ROSTER, dates: DATES, shiftCodes: CODES });
    expect(f.people.find((x) => x.staffMemberId === 'a')!.nights).toBe(3);
  });

  it('reports the checker violations in the totals', () => {
    // Night Saturday 22:00 to Sunday 07:30, then Early Sunday 07:00: negative rest, under an 11 h minimum.
    const p = problem({
      people: [{ id: 'a', name: 'Ada', skills: ['rn'], contract: { minRestMinutes: 660 } }],
      requests: [],
    });
    const f = periodFigures({
      problem: p,
      roster: { a: [null, null, null, null, null, 'n', 'e'] },
      dates: DATES,
      shiftCodes: CODES,
    });
    expect(f.totals.violations).toBe(1);
  });
});

describe('coverGaps and cents', () => {
  it('splits a shortfall into below-minimum and below-target parts', () => {
    expect(coverGaps(2, 3, 0)).toEqual({ shortOfMin: 2, shortOfTarget: 1, over: 0 });
    expect(coverGaps(2, 3, 2)).toEqual({ shortOfMin: 0, shortOfTarget: 1, over: 0 });
    expect(coverGaps(2, 3, 5)).toEqual({ shortOfMin: 0, shortOfTarget: 0, over: 2 });
  });

  it('rounds money half away from zero to cents', () => {
    // 1.005 is stored as 1.00499999…; a till rounds the written amount 1.005 up to 1.01.
    expect(cents(1.005)).toBe(1.01);
    expect(cents(183.75)).toBe(183.75);
    expect(cents(-2.345)).toBe(-2.35);
  });
});
