import { dateInWords, dateRangeInWords } from './date-words';

describe('dateInWords', () => {
  it('writes a calendar date with its weekday (28 Dec 2026 is a Monday)', () => {
    expect(dateInWords('2026-12-28')).toBe('Mon 28 Dec 2026');
    expect(dateInWords('2027-01-03')).toBe('Sun 3 Jan 2027');
  });

  it('keeps the day on a daylight-saving change (29 Mar 2026, Europe)', () => {
    expect(dateInWords('2026-03-29')).toBe('Sun 29 Mar 2026');
  });

  it('writes a range', () => {
    expect(dateRangeInWords('2026-12-28', '2027-01-24')).toBe('Mon 28 Dec 2026 to Sun 24 Jan 2027');
  });
});
