import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';

/**
 * Today's date (or the date of `now`) as "YYYY-MM-DD" in an IANA time zone, the calendar day the
 * people of a unit live in. The one place production code turns an instant into a local date.
 */
export function localDate(now: Date, timeZone: string): string {
  return format(new TZDate(now.getTime(), timeZone), 'yyyy-MM-dd');
}

/** A real calendar date "YYYY-MM-DD" (not 2030-02-30). */
export function isRealDate(date: string): boolean {
  const d = new Date(`${date}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === date;
}

/**
 * "YYYY-MM-DD HH:MM:SS.SSS" in UTC, the form TypeORM stores datetime columns in on SQLite, for
 * comparisons in hand-written conditions. On PostgreSQL the sessions run in UTC
 * (database/data-source-options.ts), so the text means the same instant.
 */
export function sqliteUtc(date: Date): string {
  return date.toISOString().replace('T', ' ').replace('Z', '');
}

/**
 * "YYYY-MM-DD" plus n days (n may be negative). Plain UTC arithmetic on purpose: date-fns' addDays
 * counts in the server's own time zone, and where a zone skipped a day (Pacific/Apia on 2011-12-30)
 * that gives the wrong date text; a calendar date has no zone.
 */
export function addDays(date: string, n: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
}

/** Days from `a` to `b` ("YYYY-MM-DD"), b - a. */
export function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}
