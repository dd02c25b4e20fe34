/**
 * Time helpers: shift instants in the problem's IANA time zone, rest between assignments,
 * night shifts, weekdays and weekends.
 *
 * Shift start and end are wall-clock times in the unit's time zone. They are turned into real
 * instants (epoch milliseconds) with @date-fns/tz, so rest between two shifts is right across
 * midnight and across daylight-saving changes. A wall-clock time that does not exist (inside the
 * hour skipped when clocks go forward) is resolved by @date-fns/tz, which moves it forward.
 */
import { TZDate } from '@date-fns/tz';
import type { RosterProblem, ShiftType } from './problem';

const MINUTE_MS = 60_000;
const HM = /^([01]\d|2[0-3]):([0-5]\d)$/;
const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Minutes after midnight of a "HH:mm" time; throws on a malformed time. */
export function parseHm(hm: string): number {
  const m = HM.exec(hm);
  if (!m) throw new Error(`Time "${hm}" is not in HH:mm 24-hour form`);
  return Number(m[1]) * 60 + Number(m[2]);
}

/** Year, month (1-12) and day of month of a "YYYY-MM-DD" date; throws on a malformed or impossible date. */
export function parseDate(date: string): { year: number; month: number; dayOfMonth: number } {
  const m = DATE.exec(date);
  if (!m) throw new Error(`Date "${date}" is not in YYYY-MM-DD form`);
  const year = Number(m[1]);
  const month = Number(m[2]);
  const dayOfMonth = Number(m[3]);
  const probe = new Date(Date.UTC(year, month - 1, dayOfMonth));
  if (
    probe.getUTCFullYear() !== year ||
    probe.getUTCMonth() !== month - 1 ||
    probe.getUTCDate() !== dayOfMonth
  ) {
    throw new Error(`Date "${date}" does not exist`);
  }
  return { year, month, dayOfMonth };
}

/** Whether `timeZone` is an IANA zone known to this runtime. */
export function isValidTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone });
    return true;
  } catch {
    return false;
  }
}

/** Calendar weekday of a day index, JavaScript numbering (0 = Sunday … 6 = Saturday). */
export function weekdayOf(problem: Pick<RosterProblem, 'startDate'>, day: number): number {
  const { year, month, dayOfMonth } = parseDate(problem.startDate);
  return new Date(Date.UTC(year, month - 1, dayOfMonth + day)).getUTCDay();
}

/** Calendar date "YYYY-MM-DD" of a day index. */
export function dateOf(problem: Pick<RosterProblem, 'startDate'>, day: number): string {
  const { year, month, dayOfMonth } = parseDate(problem.startDate);
  return new Date(Date.UTC(year, month - 1, dayOfMonth + day)).toISOString().slice(0, 10);
}

/** Real start and end instants (epoch ms) of a shift type worked on a day of the period. */
export function shiftInterval(
  problem: Pick<RosterProblem, 'startDate' | 'timeZone'>,
  day: number,
  shiftType: Pick<ShiftType, 'start' | 'end'>,
): { start: number; end: number } {
  const { year, month, dayOfMonth } = parseDate(problem.startDate);
  const s = parseHm(shiftType.start);
  const e = parseHm(shiftType.end);
  const endDay = e <= s ? day + 1 : day;
  const start = new TZDate(year, month - 1, dayOfMonth + day, Math.floor(s / 60), s % 60, problem.timeZone);
  const end = new TZDate(year, month - 1, dayOfMonth + endDay, Math.floor(e / 60), e % 60, problem.timeZone);
  return { start: start.getTime(), end: end.getTime() };
}

/** Minutes of real time between the end of shift `a` on day `dayA` and the start of shift `b` on `dayB`. */
export function restMinutes(
  problem: Pick<RosterProblem, 'startDate' | 'timeZone'>,
  dayA: number,
  a: Pick<ShiftType, 'start' | 'end'>,
  dayB: number,
  b: Pick<ShiftType, 'start' | 'end'>,
): number {
  return (shiftInterval(problem, dayB, b).start - shiftInterval(problem, dayA, a).end) / MINUTE_MS;
}

/**
 * Whether a shift type is a night shift: its own flag, or else derived from the wall-clock times:
 * at least 3 hours inside 00:00-05:00 (EU Working Time Directive 2003/88/EC, Art. 2).
 */
export function isNightShift(shiftType: Pick<ShiftType, 'start' | 'end' | 'night'>): boolean {
  if (shiftType.night !== undefined) return shiftType.night;
  const s = parseHm(shiftType.start);
  let e = parseHm(shiftType.end);
  if (e <= s) e += 1440;
  const overlap = (a: number, b: number) => Math.max(0, Math.min(e, b) - Math.max(s, a));
  // Night window 00:00-05:00 of the start day and of the next day.
  return overlap(0, 300) + overlap(1440, 1740) >= 180;
}

/**
 * Weekends of the period: runs of consecutive days whose weekday is a weekend day
 * (default Saturday and Sunday). A weekend cut by the start or end of the period still counts,
 * with only its days inside the period.
 */
export function weekendsOf(problem: Pick<RosterProblem, 'startDate' | 'days' | 'weekendDays'>): number[][] {
  const weekend = new Set(problem.weekendDays ?? [6, 0]);
  const groups: number[][] = [];
  let current: number[] | null = null;
  const first = weekdayOf(problem, 0);
  for (let d = 0; d < problem.days; d++) {
    if (weekend.has((first + d) % 7)) {
      if (!current) {
        current = [];
        groups.push(current);
      }
      current.push(d);
    } else {
      current = null;
    }
  }
  return groups;
}

/** Precomputed real start/end instants of every (day, shift type) of a problem, in minutes since epoch. */
export interface TimeTable {
  /** start[day * S + s], minutes since the epoch. */
  start: Float64Array;
  end: Float64Array;
  shiftCount: number;
}

export function buildTimeTable(
  problem: Pick<RosterProblem, 'startDate' | 'timeZone' | 'days' | 'shiftTypes'>,
): TimeTable {
  const S = problem.shiftTypes.length;
  const start = new Float64Array(problem.days * S);
  const end = new Float64Array(problem.days * S);
  for (let d = 0; d < problem.days; d++) {
    problem.shiftTypes.forEach((st, s) => {
      const iv = shiftInterval(problem, d, st);
      start[d * S + s] = iv.start / MINUTE_MS;
      end[d * S + s] = iv.end / MINUTE_MS;
    });
  }
  return { start, end, shiftCount: S };
}
