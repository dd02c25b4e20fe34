import type { RosterPeriodDto } from '@rotaplex/contracts';

/** "YYYY-MM-DD" plus n calendar days (dates as UTC midnights, so no time zone or DST shift). */
export function addDays(date: string, n: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
}

/** The last day of a period, inclusive. */
export const lastDay = (p: Pick<RosterPeriodDto, 'startDate' | 'days'>) => addDays(p.startDate, p.days - 1);

/** The Monday on or after a date (ISO 8601 weeks start on Monday). */
export function mondayOnOrAfter(date: string): string {
  const weekday = new Date(`${date}T00:00:00Z`).getUTCDay();
  return addDays(date, (8 - weekday) % 7);
}

/**
 * Where a new period would naturally start: the day after the latest draft or published period of the
 * unit, or else the Monday on or after `today`.
 */
export function suggestedStart(periods: readonly RosterPeriodDto[], today: string): string {
  const live = periods.filter((p) => p.status !== 'archived');
  if (live.length === 0) return mondayOnOrAfter(today);
  const ends = live.map((p) => addDays(p.startDate, p.days)).sort();
  return ends[ends.length - 1];
}

/** Whole calendar days from `from` to `to` ("YYYY-MM-DD"; negative when `to` is earlier). */
export function daysFrom(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

export interface PublishDeadline {
  /** The last day to publish with the unit's lead time: the period's start minus the lead days. */
  publishBy: string;
  /** Days left until publishBy (negative: that many days late). */
  daysLeft: number;
  late: boolean;
}

/**
 * When a draft should be published: `leadDays` before it starts (the unit's publish lead time; six
 * weeks is a common hospital aim, Drake, J Adv Nurs 2018;74(8):1831-38). Late once today is past it.
 */
export function publishDeadline(
  p: Pick<RosterPeriodDto, 'startDate'>,
  leadDays: number,
  today: string,
): PublishDeadline {
  const publishBy = addDays(p.startDate, -leadDays);
  const daysLeft = daysFrom(today, publishBy);
  return { publishBy, daysLeft, late: daysLeft < 0 };
}
