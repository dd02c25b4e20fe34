import { daysInsideNoticeWindow, NOTICE_WINDOW_DAYS } from './noticeWindow';

describe('changes inside the notice window', () => {
  // Fair-workweek laws give 14 days' notice (Seattle SMC 14.22; Chicago Fair Workweek Ordinance).
  const entry = (kind: 'swap' | 'publish', dates: string[]) => ({
    kind,
    at: '2027-01-04T10:00:00.000Z',
    before: dates.map((date) => ({ staffMemberId: 'a', date, shiftTypeId: null })),
    after: dates.map((date) => ({ staffMemberId: 'a', date, shiftTypeId: 'E' })),
  });
  it('marks shifts changed 0 to 13 days ahead, not 14 days ahead or in the past', () => {
    expect(NOTICE_WINDOW_DAYS).toBe(14);
    // Gregorian calendar: 13 days after 4 January 2027 is 17 January, 14 days after is 18 January.
    expect(
      daysInsideNoticeWindow(entry('swap', ['2027-01-18', '2027-01-17', '2027-01-04', '2027-01-03'])),
    ).toEqual(['2027-01-04', '2027-01-17']);
  });
  it('never marks the publish itself, nor an entry without cells', () => {
    expect(daysInsideNoticeWindow(entry('publish', ['2027-01-05']))).toEqual([]);
    expect(
      daysInsideNoticeWindow({ kind: 'swap', at: '2027-01-04T10:00:00Z', before: null, after: {} }),
    ).toEqual([]);
  });
});
