import { format } from 'date-fns';

/**
 * A calendar date of the unit ("YYYY-MM-DD", already a day in the unit's time zone) in words:
 * "2026-12-28" → "Mon 28 Dec 2026". The date is built from its parts, so neither the server's
 * zone nor UTC can move it to another day.
 */
export function dateInWords(date: string): string {
  const [y, m, d] = date.split('-').map(Number);
  return format(new Date(y, m - 1, d, 12), 'EEE d MMM yyyy');
}

/** A range of calendar dates in words: "Mon 28 Dec 2026 to Sun 24 Jan 2027". */
export function dateRangeInWords(first: string, last: string): string {
  return `${dateInWords(first)} to ${dateInWords(last)}`;
}
