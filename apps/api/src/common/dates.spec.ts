import { DateUtils } from 'typeorm/util/DateUtils';
import { addDays, daysBetween, localDate, sqliteUtc } from './dates';

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

describe('addDays', () => {
  it('follows the Gregorian calendar across month, year and leap days', () => {
    // Gregorian leap-year rule (ISO 8601 uses the Gregorian calendar): 2028 is a leap year; 2100 is
    // divisible by 100 and not by 400, so it is not; 2000 is divisible by 400, so it is.
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2100-02-28', 1)).toBe('2100-03-01');
    expect(addDays('2000-02-28', 1)).toBe('2000-02-29');
    expect(addDays('2030-12-31', 1)).toBe('2031-01-01');
    expect(addDays('2031-01-01', -1)).toBe('2030-12-31');
    expect(addDays('2030-01-07', 0)).toBe('2030-01-07');
  });

  it("agrees with the platform's day arithmetic (ECMA-262 MakeDay via Date.UTC) and with daysBetween", () => {
    const start = Date.UTC(2026, 0, 1);
    for (let n = -800; n <= 800; n += 7) {
      const expected = new Date(Date.UTC(2026, 0, 1 + n)).toISOString().slice(0, 10);
      expect(addDays('2026-01-01', n)).toBe(expected);
      expect(daysBetween('2026-01-01', addDays('2026-01-01', n))).toBe(n);
      expect(Date.parse(`${expected}T00:00:00Z`) - start).toBe(n * 86_400_000);
    }
  });
});
