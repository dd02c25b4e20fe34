import { daysFrom, publishDeadline } from './periodDates';

describe('publish deadline from the unit lead time', () => {
  // Six weeks before a roster starts is a common hospital aim (Drake, J Adv Nurs 2018;74(8):1831-38).
  // Gregorian calendar: 42 days before Monday 4 January 2027 is Monday 23 November 2026.
  it('puts the deadline six weeks before the start and counts the days left', () => {
    expect(publishDeadline({ startDate: '2027-01-04' }, 42, '2026-11-20')).toEqual({
      publishBy: '2026-11-23',
      daysLeft: 3,
      late: false,
    });
  });
  it('is late the day after the deadline, and on the deadline itself is not', () => {
    expect(publishDeadline({ startDate: '2027-01-04' }, 42, '2026-11-23').late).toBe(false);
    expect(publishDeadline({ startDate: '2027-01-04' }, 42, '2026-11-24')).toMatchObject({
      daysLeft: -1,
      late: true,
    });
  });
  it('counts calendar days across the end of British summer time without a fraction', () => {
    // 25 October 2026 is the last Sunday of October (clocks go back in the UK); dates carry no zone.
    expect(daysFrom('2026-10-24', '2026-10-26')).toBe(2);
  });
});
