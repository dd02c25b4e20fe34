import type { RosterPeriodDto } from '@rotaplex/contracts';
import { addDays, lastDay, mondayOnOrAfter, suggestedStart } from './periodDates';

const period = (startDate: string, days: number, status: RosterPeriodDto['status']): RosterPeriodDto => ({
  id: startDate,
  unitId: 'u',
  startDate,
  days,
  status,
  createdAt: '2026-01-01T00:00:00Z',
  publishedAt: null,
  version: 1,
});

describe('roster period dates', () => {
  it('ends a four-week period from Monday 4 January 2027 on Sunday 31 January', () => {
    // Gregorian calendar: 4 January 2027 is a Monday (ISO 8601 week 1); January has 31 days.
    expect(lastDay({ startDate: '2027-01-04', days: 28 })).toBe('2027-01-31');
  });

  it('counts 29 February in a leap year and ignores the clock change', () => {
    // Gregorian leap-year rule: 2028 is divisible by 4 and not by 100. UK clocks go forward on the
    // last Sunday of March (28 March 2027); calendar days do not change length here.
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2027-03-27', 2)).toBe('2027-03-29');
  });

  it('finds the Monday on or after a date', () => {
    expect(mondayOnOrAfter('2026-12-02')).toBe('2026-12-07'); // a Wednesday
    expect(mondayOnOrAfter('2027-01-04')).toBe('2027-01-04'); // already a Monday
  });

  it('suggests the day after the latest live period, ignoring archived ones', () => {
    const periods = [
      period('2027-01-04', 28, 'published'),
      period('2027-02-01', 28, 'draft'),
      period('2027-06-07', 28, 'archived'),
    ];
    expect(suggestedStart(periods, '2026-12-02')).toBe('2027-03-01');
    expect(suggestedStart([], '2026-12-02')).toBe('2026-12-07');
  });
});
