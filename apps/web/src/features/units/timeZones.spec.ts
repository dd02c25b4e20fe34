import { allTimeZones, filterTimeZones, isValidTimeZone, localTime, utcOffset } from './timeZones';

describe('time zones', () => {
  it('lists IANA names the unit form can offer', () => {
    const zones = allTimeZones();
    // IANA tz database zone names (tzdata "zone1970.tab"), a few stable ones.
    for (const zone of ['Europe/London', 'Europe/Dublin', 'America/New_York', 'Asia/Kolkata', 'UTC']) {
      expect(zones).toContain(zone);
    }
    expect(zones.length).toBeGreaterThan(300);
  });

  it('offers current names, not the old ones some engines still list', () => {
    // IANA tzdata "backward" file: Asia/Calcutta links to Asia/Kolkata, Europe/Kiev to Europe/Kyiv (2022).
    const zones = allTimeZones();
    expect(zones).not.toContain('Asia/Calcutta');
    expect(zones).not.toContain('Europe/Kiev');
    expect(filterTimeZones(zones, 'kyiv')).toEqual(['Europe/Kyiv']);
  });

  it('finds zones by words typed with spaces for underscores', () => {
    expect(filterTimeZones(allTimeZones(), 'new york')).toContain('America/New_York');
    expect(filterTimeZones(allTimeZones(), 'europe lond')).toEqual(['Europe/London']);
    expect(filterTimeZones(allTimeZones(), 'zzzz')).toEqual([]);
  });

  it('rejects names that are not time zones', () => {
    expect(isValidTimeZone('Europe/London')).toBe(true);
    expect(isValidTimeZone('Mars/Olympus_Mons')).toBe(false);
    expect(isValidTimeZone('')).toBe(false);
  });

  it('follows the EU summer-time change in the offset it shows', () => {
    // Directive 2000/84/EC, Art. 2: summer time begins at 01:00 GMT on the last Sunday in March
    // (29 March in 2026); the UK follows the same rule (Summer Time Order 2002).
    expect(utcOffset('Europe/London', new Date('2026-03-29T00:59:00Z'))).toBe('UTC+00:00');
    expect(utcOffset('Europe/London', new Date('2026-03-29T01:00:00Z'))).toBe('UTC+01:00');
    expect(localTime('Europe/London', new Date('2026-03-29T01:00:00Z'))).toBe('02:00');
    // Art. 3: it ends at 01:00 GMT on the last Sunday in October (25 October 2026).
    expect(utcOffset('Europe/Dublin', new Date('2026-10-25T01:00:00Z'))).toBe('UTC+00:00');
  });

  it('shows half-hour offsets', () => {
    // India Standard Time is UTC+05:30 all year (IANA tzdata, Asia/Kolkata).
    expect(utcOffset('Asia/Kolkata', new Date('2026-01-15T12:00:00Z'))).toBe('UTC+05:30');
  });
});
