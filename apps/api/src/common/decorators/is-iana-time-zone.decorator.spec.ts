import { isIanaTimeZone } from './is-iana-time-zone.decorator';

describe('isIanaTimeZone', () => {
  // Zone names from the IANA time zone database (tzdata zone1970.tab / backward), from memory.
  it.each([
    'Europe/London',
    'Europe/Dublin',
    'America/Argentina/Buenos_Aires',
    'Asia/Kolkata',
    'Etc/GMT+5',
    'UTC',
    'America/Port-au-Prince',
  ])('accepts %s', (tz) => expect(isIanaTimeZone(tz)).toBe(true));

  it.each([
    'Mars/Olympus_Mons',
    '+01:00',
    'GMT+1',
    'Europe/',
    '/London',
    'Europe London',
    '',
    'a'.repeat(65),
  ])('refuses %j', (tz) => expect(isIanaTimeZone(tz)).toBe(false));

  it('refuses non-strings', () => {
    expect(isIanaTimeZone(1)).toBe(false);
    expect(isIanaTimeZone(null)).toBe(false);
  });
});
