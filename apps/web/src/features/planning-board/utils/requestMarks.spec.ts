import type { AssignmentGridDto, DateRequestDto, LeaveDto, PeriodRequestsDto } from '@rotaplex/contracts';
import { honours, marksText, requestMarks } from './requestMarks';

const request = (over: Partial<DateRequestDto>): DateRequestDto => ({
  id: 'r',
  rosterPeriodId: 'p',
  staffMemberId: 's1',
  staffName: 'Ada Byrne',
  unitId: 'u',
  date: '2027-01-30',
  kind: 'dayOff',
  shiftTypeId: null,
  shiftTypeCode: null,
  note: null,
  createdAt: '2026-12-01T00:00:00Z',
  ...over,
});

const leave = (over: Partial<LeaveDto>): LeaveDto => ({
  id: 'l',
  staffMemberId: 's1',
  staffName: 'Ada Byrne',
  unitId: 'u',
  startDate: '2027-01-31',
  endDate: '2027-02-01',
  type: 'annual',
  status: 'approved',
  note: null,
  decisionNote: null,
  decidedAt: null,
  decidedBy: null,
  createdAt: '2026-12-01T00:00:00Z',
  ...over,
});

// Three days across a month end (Gregorian calendar: January has 31 days).
const grid: AssignmentGridDto = {
  rosterPeriodId: 'p',
  dates: ['2027-01-30', '2027-01-31', '2027-02-01'],
  rows: [
    {
      staffMemberId: 's1',
      name: 'Ada Byrne',
      cells: [
        { shiftTypeId: 'E', pinned: false },
        { shiftTypeId: null, pinned: false },
        { shiftTypeId: 'N', pinned: false },
      ],
    },
    {
      staffMemberId: 's2',
      name: 'Ben Cole',
      cells: [
        { shiftTypeId: null, pinned: false },
        { shiftTypeId: null, pinned: false },
        { shiftTypeId: null, pinned: false },
      ],
    },
  ],
  check: { violations: [], terms: {}, objective: 0 },
};

const input = (dateRequests: DateRequestDto[], leaves: LeaveDto[]): PeriodRequestsDto => ({
  period: { id: 'p', unitId: 'u', startDate: '2027-01-30', days: 3, status: 'draft', requestLimit: 5 },
  dateRequests,
  leave: leaves,
  availability: [],
});

// What "honoured" means follows the roster model's reading of requests (libs/contracts requests.ts,
// common practice in rostering): shift on = works that shift; shift off = not that shift; day off = no shift.
describe('whether a cell honours a date request', () => {
  it('reads shift on, shift off and day off against the cell', () => {
    expect(honours({ kind: 'shiftOn', shiftTypeId: 'E' }, 'E')).toBe(true);
    expect(honours({ kind: 'shiftOn', shiftTypeId: 'E' }, 'L')).toBe(false);
    expect(honours({ kind: 'shiftOn', shiftTypeId: 'E' }, null)).toBe(false);
    expect(honours({ kind: 'shiftOff', shiftTypeId: 'N' }, 'N')).toBe(false);
    expect(honours({ kind: 'shiftOff', shiftTypeId: 'N' }, 'E')).toBe(true);
    expect(honours({ kind: 'shiftOff', shiftTypeId: 'N' }, null)).toBe(true);
    expect(honours({ kind: 'dayOff', shiftTypeId: null }, null)).toBe(true);
    expect(honours({ kind: 'dayOff', shiftTypeId: null }, 'E')).toBe(false);
  });
});

describe('request and leave marks on the board', () => {
  it('puts each request on its cell with honoured or not, and skips people and dates outside the grid', () => {
    const marks = requestMarks(
      grid,
      input(
        [
          request({ id: 'a', date: '2027-01-30', kind: 'dayOff' }),
          request({ id: 'b', date: '2027-02-01', kind: 'shiftOn', shiftTypeId: 'N', shiftTypeCode: 'N' }),
          request({ id: 'c', staffMemberId: 'gone', date: '2027-01-30' }),
          request({ id: 'd', date: '2027-02-02' }),
        ],
        [],
      ),
    );
    expect(marks.get('s1|2027-01-30')?.requests.map((r) => [r.request.id, r.honoured])).toEqual([
      ['a', false],
    ]);
    expect(marks.get('s1|2027-02-01')?.requests.map((r) => [r.request.id, r.honoured])).toEqual([
      ['b', true],
    ]);
    expect([...marks.keys()].sort()).toEqual(['s1|2027-01-30', 's1|2027-02-01']);
  });

  it('marks every day of pending and approved leave inclusive of both ends, approved over pending', () => {
    const marks = requestMarks(
      grid,
      input(
        [],
        [
          leave({ id: 'x', startDate: '2027-01-31', endDate: '2027-02-01', status: 'approved' }),
          leave({
            id: 'y',
            startDate: '2027-01-20',
            endDate: '2027-01-31',
            status: 'pending',
            type: 'other',
          }),
          leave({
            id: 'z',
            staffMemberId: 's2',
            startDate: '2027-01-30',
            endDate: '2027-02-01',
            status: 'declined',
          }),
          leave({
            id: 'w',
            staffMemberId: 's2',
            startDate: '2027-02-01',
            endDate: '2027-02-05',
            status: 'pending',
          }),
        ],
      ),
    );
    expect(marks.get('s1|2027-01-30')?.leave).toEqual({ type: 'other', status: 'pending' });
    expect(marks.get('s1|2027-01-31')?.leave).toEqual({ type: 'annual', status: 'approved' });
    expect(marks.get('s1|2027-02-01')?.leave).toEqual({ type: 'annual', status: 'approved' });
    // Declined leave leaves no mark; pending leave beyond the period marks only the period's days.
    expect(marks.get('s2|2027-01-30')).toBeUndefined();
    expect(marks.get('s2|2027-02-01')?.leave).toEqual({ type: 'annual', status: 'pending' });
  });

  it('says the marks in words', () => {
    const marks = requestMarks(
      grid,
      input(
        [request({ date: '2027-02-01', kind: 'shiftOff', shiftTypeId: 'N', shiftTypeCode: 'N' })],
        [leave({ startDate: '2027-02-01', endDate: '2027-02-01' })],
      ),
    );
    expect(marksText(marks.get('s1|2027-02-01'), new Map([['N', 'N']]))).toEqual([
      'annual leave',
      'request shift off N not honoured',
    ]);
    expect(marksText(undefined, new Map())).toEqual([]);
  });
});
