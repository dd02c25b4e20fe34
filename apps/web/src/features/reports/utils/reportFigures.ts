import type { CoverDayReportDto, CoverReportRowDto, PersonReportDto } from '@rotaplex/contracts';

const dayFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  timeZone: 'UTC',
});
const moneyFormat = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const hoursFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 });

/** "Mon 7 Jan" for "2030-01-07". */
export const formatDate = (date: string) => dayFormat.format(new Date(`${date}T00:00:00Z`));

/** Minutes as hours with up to two decimals: 990 → "16.5". */
export const formatHours = (minutes: number) => hoursFormat.format(minutes / 60);

/** An amount with two decimals and thousands separators: 1032.45 → "1,032.45". */
export const formatMoney = (value: number) => moneyFormat.format(value);

/**
 * An amount of labour cost: the hourly rates carry no currency (the organisation has no currency
 * setting), so the amount says plainly that it is in the rates' units: "1,032.45 cost units".
 */
export const formatCost = (value: number) => `${formatMoney(value)} cost units`;

/**
 * Shifts (a date and a shift type) with at least one need below its minimum, and the people missing
 * on them: a shift short of two nurses and one healthcare assistant is one shift, three people.
 */
export function shiftsBelowMinimum(cover: readonly CoverReportRowDto[]): { shifts: number; missing: number } {
  const short = cover.filter((c) => c.shortOfMin > 0);
  return {
    shifts: new Set(short.map((c) => `${c.date}|${c.shiftTypeId}`)).size,
    missing: short.reduce((total, c) => total + c.shortOfMin, 0),
  };
}

/** Minutes to hours rounded to two decimals, for chart values. */
export const toHours = (minutes: number) => Math.round((minutes / 60) * 100) / 100;

export type HoursStatus = 'belowMin' | 'aboveMax' | 'underTarget' | 'overTarget' | 'onTarget' | 'noContract';

/** Where a person's paid hours stand against their contract: hard limits first, then the target. */
export function hoursStatus(p: PersonReportDto): HoursStatus {
  if (p.minPaidMinutes !== null && p.paidMinutes < p.minPaidMinutes) return 'belowMin';
  if (p.maxPaidMinutes !== null && p.paidMinutes > p.maxPaidMinutes) return 'aboveMax';
  if (p.deviationMinutes === null)
    return p.minPaidMinutes === null && p.maxPaidMinutes === null ? 'noContract' : 'onTarget';
  if (p.deviationMinutes < 0) return 'underTarget';
  if (p.deviationMinutes > 0) return 'overTarget';
  return 'onTarget';
}

export const HOURS_STATUS_TEXT: Record<HoursStatus, string> = {
  belowMin: 'Below the contract minimum',
  aboveMax: 'Above the contract maximum',
  underTarget: 'Under the contracted hours',
  overTarget: 'Over the contracted hours',
  onTarget: 'On the contracted hours',
  noContract: 'No contract hours',
};

export interface HoursRow {
  name: string;
  worked: number;
  target: number | null;
  min: number | null;
  max: number | null;
}

/** Paid hours against the contract per person, for the hours chart. */
export function hoursRows(people: PersonReportDto[]): HoursRow[] {
  return people.map((p) => ({
    name: p.name,
    worked: toHours(p.paidMinutes),
    target: p.targetPaidMinutes === null ? null : toHours(p.targetPaidMinutes),
    min: p.minPaidMinutes === null ? null : toHours(p.minPaidMinutes),
    max: p.maxPaidMinutes === null ? null : toHours(p.maxPaidMinutes),
  }));
}

export interface CoverDayRow {
  date: string;
  label: string;
  needs: number;
  /** Needs at or above the target, at or above the minimum only, and below the minimum. */
  metTarget: number;
  metMinOnly: number;
  belowMin: number;
  shortOfMin: number;
  shortOfTarget: number;
}

/** Needs of each day split into met (target), met (minimum only) and short, for the stacked cover chart. */
export function coverDayRows(days: CoverDayReportDto[]): CoverDayRow[] {
  return days.map((d) => ({
    date: d.date,
    label: formatDate(d.date),
    needs: d.needs,
    metTarget: d.needsMetTarget,
    metMinOnly: d.needsMetMin - d.needsMetTarget,
    belowMin: d.needs - d.needsMetMin,
    shortOfMin: d.shortOfMin,
    shortOfTarget: d.shortOfTarget,
  }));
}

/**
 * The file name in a Content-Disposition header (RFC 6266): filename*=UTF-8''… wins over filename="…".
 * Path parts are dropped. Null when there is none.
 */
export function fileNameFromDisposition(header: string | null): string | null {
  if (!header) return null;
  const extended = /filename\*\s*=\s*(?:UTF-8|utf-8)''([^;]+)/.exec(header);
  let name: string | null = null;
  if (extended) {
    try {
      name = decodeURIComponent(extended[1].trim());
    } catch {
      name = null;
    }
  }
  if (!name) {
    const plain = /filename\s*=\s*(?:"([^"]*)"|([^;\s]+))/.exec(header);
    name = plain ? (plain[1] ?? plain[2]) : null;
  }
  if (!name) return null;
  const base = name.split(/[\\/]/).pop()?.trim() ?? '';
  return base || null;
}
