import type { MyRosterShiftDto } from '@rotaplex/contracts';
import { wallClock } from './rosterEvents';

/** My own shifts that have not ended at `now`, soonest first. */
export function nextShifts(shifts: readonly MyRosterShiftDto[], now: Date): MyRosterShiftDto[] {
  const at = now.getTime();
  return shifts
    .filter((s) => s.mine && Date.parse(s.end) > at)
    .sort((a, b) => Date.parse(a.start) - Date.parse(b.start));
}

const dayFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  timeZone: 'UTC',
});
const dayOf = (wall: string) => dayFormat.format(new Date(`${wall.slice(0, 10)}T12:00:00Z`));

/**
 * When a shift runs, in its unit's local time: "Mon 7 Dec, 07:00–15:00", or across midnight
 * "Mon 7 Dec, 22:00 to Tue 8 Dec, 07:30" (one shift, never split at midnight).
 */
export function shiftWhen(s: Pick<MyRosterShiftDto, 'start' | 'end' | 'timeZone'>): string {
  const start = wallClock(s.start, s.timeZone);
  const end = wallClock(s.end, s.timeZone);
  const from = `${dayOf(start)}, ${start.slice(11, 16)}`;
  return start.slice(0, 10) === end.slice(0, 10)
    ? `${from}–${end.slice(11, 16)}`
    : `${from} to ${dayOf(end)}, ${end.slice(11, 16)}`;
}

/** My shifts grouped by their roster day, in order, for an agenda list. */
export function agendaDays(
  shifts: readonly MyRosterShiftDto[],
): { date: string; shifts: MyRosterShiftDto[] }[] {
  const days = new Map<string, MyRosterShiftDto[]>();
  for (const s of [...shifts].sort((a, b) => Date.parse(a.start) - Date.parse(b.start))) {
    days.set(s.date, [...(days.get(s.date) ?? []), s]);
  }
  return [...days].map(([date, list]) => ({ date, shifts: list }));
}
