import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';

/**
 * Today's date (or the date of `now`) as "YYYY-MM-DD" in an IANA time zone, the calendar day the
 * people of a unit live in. The one place production code turns an instant into a local date.
 */
export function localDate(now: Date, timeZone: string): string {
  return format(new TZDate(now.getTime(), timeZone), 'yyyy-MM-dd');
}
