import { offsetChanges, offsetMinutes } from './time-zone-rules';

// Offsets and change instants from the IANA tz database rules (from memory):
// - Europe/London (EU rule since 1996): UTC+1 from 01:00 UTC on the last Sunday of March to
//   01:00 UTC on the last Sunday of October; in 2030 those are 31 March and 27 October.
// - Australia/Sydney (since 2008): summer time (UTC+11) ends on the first Sunday of April at
//   03:00 local (16:00 UTC the day before) and starts on the first Sunday of October at 02:00 local
//   (16:00 UTC the day before); in 2030: 7 April and 6 October.
// - Asia/Tokyo: UTC+9 all year, no summer time since 1951.
describe('time zone rules from the runtime tz data', () => {
  const year2030 = [Date.UTC(2030, 0, 1), Date.UTC(2031, 0, 1)] as const;

  it('finds the two Europe/London changes of 2030 to the minute', () => {
    expect(
      offsetChanges('Europe/London', ...year2030).map((c) => [new Date(c.at).toISOString(), c.from, c.to]),
    ).toEqual([
      ['2030-03-31T01:00:00.000Z', 0, 60],
      ['2030-10-27T01:00:00.000Z', 60, 0],
    ]);
    expect(offsetMinutes(Date.parse('2030-03-31T00:59:00Z'), 'Europe/London')).toBe(0);
    expect(offsetMinutes(Date.parse('2030-03-31T01:00:00Z'), 'Europe/London')).toBe(60);
  });

  it('finds the southern-hemisphere changes of Australia/Sydney', () => {
    expect(
      offsetChanges('Australia/Sydney', ...year2030).map((c) => [new Date(c.at).toISOString(), c.from, c.to]),
    ).toEqual([
      ['2030-04-06T16:00:00.000Z', 660, 600],
      ['2030-10-05T16:00:00.000Z', 600, 660],
    ]);
  });

  it('finds no change in a zone without summer time', () => {
    expect(offsetChanges('Asia/Tokyo', ...year2030)).toEqual([]);
    expect(offsetMinutes(Date.UTC(2030, 6, 1), 'Asia/Tokyo')).toBe(540);
    expect(offsetChanges('UTC', ...year2030)).toEqual([]);
  });
});
