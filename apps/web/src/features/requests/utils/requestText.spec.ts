import { cellsFromGrid, dateLabel, gridFromCells, periodDates } from './requestText';

describe('availability grid state', () => {
  it('fills missing cells as available and sends back only the others', () => {
    const grid = gridFromCells([
      { weekday: 0, part: 'night', status: 'unavailable' },
      { weekday: 5, part: 'late', status: 'prefer-not' },
    ]);
    expect(Object.keys(grid)).toHaveLength(7 * 4);
    expect(grid['1|early']).toBe('available');
    expect(cellsFromGrid({ ...grid, '3|day': 'unavailable', '0|night': 'available' })).toEqual([
      { weekday: 3, part: 'day', status: 'unavailable' },
      { weekday: 5, part: 'late', status: 'prefer-not' },
    ]);
  });
});

describe('period dates', () => {
  // Gregorian calendar: 2028 is a leap year (divisible by 4, not by 100), so February has 29 days.
  it('counts across the end of February in a leap year', () => {
    expect(periodDates('2028-02-27', 4)).toEqual(['2028-02-27', '2028-02-28', '2028-02-29', '2028-03-01']);
  });

  // Weekdays checked with GNU date +%A: 2035-01-01 is a Monday, 2028-02-29 a Tuesday.
  it('labels calendar dates with their weekday', () => {
    expect([dateLabel('2035-01-01'), dateLabel('2028-02-29')]).toEqual(['Mon 1 Jan 2035', 'Tue 29 Feb 2028']);
  });
});
