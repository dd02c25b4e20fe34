const dayFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  timeZone: 'UTC',
});
const weekdayFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'short', timeZone: 'UTC' });

/** "Mon 7 Dec" for "2026-12-07". */
export const formatDay = (date: string) => dayFormat.format(new Date(`${date}T00:00:00Z`));
/** "Mon" for "2026-12-07". */
export const formatWeekday = (date: string) => weekdayFormat.format(new Date(`${date}T00:00:00Z`));
/** Day of the month, "7" for "2026-12-07". */
export const dayOfMonth = (date: string) => String(Number(date.slice(8, 10)));
