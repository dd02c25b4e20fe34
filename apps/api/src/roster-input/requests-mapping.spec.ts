import { DATE_REQUEST_WEIGHT, dayPartOf, PREFER_NOT_WEIGHT } from '@rotaplex/contracts';
import { creditLeave } from '@rotaplex/roster-model';
import { mapRequestsAndAbsences, type StaffInputRows } from './requests-mapping';

// Calendar facts (ISO 8601 weekdays, checked with GNU `date -d 2030-01-07 +%A`): 2030-01-07 is a Monday,
// so 2030-01-07 … 2030-01-13 run Monday … Sunday.
const DATES = [
  '2030-01-07',
  '2030-01-08',
  '2030-01-09',
  '2030-01-10',
  '2030-01-11',
  '2030-01-12',
  '2030-01-13',
];
// Shift times of a common three-shift hospital pattern (common practice): early 07:00, late 14:30, night 22:00.
const SHIFTS = [
  { id: 'E', start: '07:00' },
  { id: 'L', start: '14:30' },
  { id: 'N', start: '22:00' },
];

const rows = (over: Partial<StaffInputRows>): StaffInputRows => ({
  dates: DATES,
  shiftTypes: SHIFTS,
  personIds: ['ann', 'bo'],
  availability: [],
  dateRequests: [],
  leave: [],
  ...over,
});

describe('parts of the day', () => {
  it('puts a shift in the part where it starts, with the night running across midnight', () => {
    expect(
      ['04:59', '05:00', '07:59', '08:00', '11:59', '12:00', '19:59', '20:00', '00:00'].map(dayPartOf),
    ).toEqual(['night', 'early', 'early', 'day', 'day', 'late', 'late', 'night', 'night']);
  });
});

describe('requests and absences for the model', () => {
  it('turns approved leave into a whole-day absence on each day of the period inside the range', () => {
    // Leave from before the period into its second day, and a range that ends before the period.
    const out = mapRequestsAndAbsences(
      rows({
        leave: [
          { staffMemberId: 'ann', startDate: '2030-01-01', endDate: '2030-01-08' },
          { staffMemberId: 'bo', startDate: '2029-12-01', endDate: '2030-01-06' },
          { staffMemberId: 'stranger', startDate: '2030-01-07', endDate: '2030-01-13' },
        ],
      }),
    );
    expect(out.absences).toEqual([
      { personId: 'ann', day: 0, kind: 'leave' },
      { personId: 'ann', day: 1, kind: 'leave' },
    ]);
    expect(out.requests).toEqual([]);
  });

  it('maps unavailable to an absence of the shift types of that part on every date of that weekday', () => {
    const out = mapRequestsAndAbsences(
      rows({
        availability: [
          { staffMemberId: 'ann', weekday: 1, part: 'night', status: 'unavailable' }, // Mondays
          { staffMemberId: 'ann', weekday: 0, part: 'early', status: 'unavailable' }, // Sundays, whole day:
          { staffMemberId: 'ann', weekday: 0, part: 'late', status: 'unavailable' },
          { staffMemberId: 'ann', weekday: 0, part: 'night', status: 'unavailable' },
          { staffMemberId: 'bo', weekday: 3, part: 'day', status: 'unavailable' }, // no shift starts 08-12
          { staffMemberId: 'bo', weekday: 4, part: 'early', status: 'available' },
        ],
      }),
    );
    expect(out.absences).toEqual([
      { personId: 'ann', day: 0, kind: 'unavailable', shiftTypeIds: ['N'] },
      { personId: 'ann', day: 6, kind: 'unavailable' },
    ]);
  });

  it('maps prefer-not to weighted shift-off requests, and a date request that day replaces them', () => {
    const out = mapRequestsAndAbsences(
      rows({
        availability: [
          { staffMemberId: 'bo', weekday: 2, part: 'late', status: 'prefer-not' }, // Tuesday 2030-01-08
          { staffMemberId: 'bo', weekday: 3, part: 'late', status: 'prefer-not' }, // Wednesday 2030-01-09
        ],
        dateRequests: [{ staffMemberId: 'bo', date: '2030-01-09', kind: 'shiftOn', shiftTypeId: 'L' }],
      }),
    );
    expect(out.requests).toEqual([
      { personId: 'bo', day: 2, kind: 'shiftOn', shiftTypeId: 'L', weight: DATE_REQUEST_WEIGHT },
      { personId: 'bo', day: 1, kind: 'shiftOff', shiftTypeId: 'L', weight: PREFER_NOT_WEIGHT },
    ]);
    expect(out.absences).toEqual([]);
  });

  it('maps date requests by kind and drops requests outside the period or on a leave day', () => {
    const out = mapRequestsAndAbsences(
      rows({
        dateRequests: [
          { staffMemberId: 'ann', date: '2030-01-10', kind: 'dayOff', shiftTypeId: null },
          { staffMemberId: 'ann', date: '2030-01-11', kind: 'shiftOff', shiftTypeId: 'N' },
          { staffMemberId: 'ann', date: '2030-01-20', kind: 'dayOff', shiftTypeId: null }, // outside
          { staffMemberId: 'bo', date: '2030-01-12', kind: 'shiftOn', shiftTypeId: 'E' }, // on leave
        ],
        leave: [{ staffMemberId: 'bo', startDate: '2030-01-12', endDate: '2030-01-12' }],
        availability: [{ staffMemberId: 'bo', weekday: 6, part: 'early', status: 'unavailable' }],
      }),
    );
    expect(out.requests).toEqual([
      { personId: 'ann', day: 3, kind: 'dayOff', weight: DATE_REQUEST_WEIGHT },
      { personId: 'ann', day: 4, kind: 'shiftOff', shiftTypeId: 'N', weight: DATE_REQUEST_WEIGHT },
    ]);
    // Leave wins over the Saturday unavailability: one absence, of kind leave.
    expect(out.absences).toEqual([{ personId: 'bo', day: 5, kind: 'leave' }]);
  });
});

describe('leave credited against contract hours', () => {
  it('lowers min and target by a fifth of their weekly value per weekday of leave, never the max', () => {
    // A 37.5-hour week (common practice for a full-time contract), over a 14-day period: 2 × 2250 = 4500.
    const ann = {
      id: 'ann',
      name: 'Ann',
      skills: [],
      contract: { minPaidMinutes: 3600, targetPaidMinutes: 4500, maxPaidMinutes: 5760 },
    };
    const bo = { id: 'bo', name: 'Bo', skills: [], contract: { targetPaidMinutes: 4500 } };
    const dates = [
      ...DATES,
      '2030-01-14',
      '2030-01-15',
      '2030-01-16',
      '2030-01-17',
      '2030-01-18',
      '2030-01-19',
      '2030-01-20',
    ];
    const out = creditLeave(
      [ann, bo],
      [
        // Monday to Sunday of the first week: five weekdays are credited, the weekend is not.
        ...[0, 1, 2, 3, 4, 5, 6].map((day) => ({ personId: 'ann', day, kind: 'leave' as const })),
        { personId: 'bo', day: 1, kind: 'unavailable' }, // not leave: no credit
        { personId: 'bo', day: 2, kind: 'leave', shiftTypeIds: ['N'] }, // part of a day: no credit
      ],
      dates,
    );
    // A week of leave takes one week's minutes off: 3600 - 1800 and 4500 - 2250 (37.5 h = 2250 min).
    expect(out[0].contract).toEqual({ minPaidMinutes: 1800, targetPaidMinutes: 2250, maxPaidMinutes: 5760 });
    expect(out[1]).toBe(bo);
  });
});
