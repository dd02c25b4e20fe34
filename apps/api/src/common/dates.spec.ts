import { DateUtils } from 'typeorm/util/DateUtils';
import { localDate, sqliteUtc } from './dates';

describe('localDate', () => {
  // Offsets from the IANA time zone database (tzdata), as published for 2026-2027.
  it('gives the calendar day in the zone, not in UTC', () => {
    const instant = new Date('2027-01-04T23:30:00Z');
    expect(localDate(instant, 'UTC')).toBe('2027-01-04');
    // Europe/Berlin is UTC+1 in winter (tzdata): already the 5th there.
    expect(localDate(instant, 'Europe/Berlin')).toBe('2027-01-05');
    // America/New_York is UTC-5 in winter (tzdata): still the 4th.
    expect(localDate(instant, 'America/New_York')).toBe('2027-01-04');
    // Pacific/Kiritimati is UTC+14 (tzdata).
    expect(localDate(new Date('2027-01-04T10:00:00Z'), 'Pacific/Kiritimati')).toBe('2027-01-05');
  });

  it('agrees with the platform Intl formatter (ECMA-402) across a daylight-saving change', () => {
    const intl = (d: Date, timeZone: string) =>
      new Intl.DateTimeFormat('en-CA', {
        timeZone,
        year: 'numeric',
        month: '2-digit',
        day: '2-digit',
      }).format(d);
    // Europe/London changes clocks on 2027-03-28 at 01:00 UTC (tzdata, last Sunday of March).
    for (let h = -30; h <= 30; h += 1) {
      const d = new Date(Date.UTC(2027, 2, 28, 1) + h * 3_600_000);
      for (const zone of ['Europe/London', 'Australia/Sydney', 'Asia/Kolkata']) {
        expect(localDate(d, zone)).toBe(intl(d, zone));
      }
    }
  });
});

describe('sqliteUtc', () => {
  it("writes an instant as TypeORM stores datetime columns on SQLite (TypeORM's DateUtils)", () => {
    for (const iso of ['2027-01-04T23:30:00.000Z', '2030-03-31T00:30:00.123Z', '1999-12-31T23:59:59.999Z']) {
      const at = new Date(iso);
      expect(sqliteUtc(at)).toBe(DateUtils.mixedDateToUtcDatetimeString(at));
    }
  });
});
