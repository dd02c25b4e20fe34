/**
 * Reports of a roster period: hours against contract, nights and weekends per person, cover met
 * against needs, requests honoured, labour cost; and the payroll CSV. Figures come from the
 * period's current roster (its stored assignments) and the same problem the solver sees.
 */
import type { RosterPeriodStatus } from './planning';

/** One person's figures for the period. */
export interface PersonReportDto {
  staffMemberId: string;
  name: string;
  /** Shifts worked. */
  shifts: number;
  /** Paid minutes of the shifts worked. */
  paidMinutes: number;
  /**
   * The contract's limits for the period exactly as the solver sees them: scaled from per week to the
   * period's length, with any credit for approved leave (null: the contract sets none, or no contract).
   */
  minPaidMinutes: number | null;
  maxPaidMinutes: number | null;
  targetPaidMinutes: number | null;
  /** paidMinutes − targetPaidMinutes (null without a target). */
  deviationMinutes: number | null;
  /** Night shifts worked (night as the shift type says, or derived from its times). */
  nights: number;
  /** Weekends with any work (a weekend cut by the period's edge counts with its days inside). */
  weekendsWorked: number;
  /** Weekend days worked. */
  weekendDaysWorked: number;
  hourlyCost: number | null;
  /** hourlyCost × paid hours, rounded to cents (null when the hourly cost is unknown). */
  labourCost: number | null;
  /** This person's requests in the period and how many the roster honours. */
  requests: number;
  requestsHonoured: number;
}

/** One cover need (date, shift type, skill) against the people counted towards it. */
export interface CoverReportRowDto {
  date: string;
  shiftTypeId: string;
  shiftCode: string;
  /** null: anyone on the shift counts. */
  skillId: string | null;
  skillCode: string | null;
  min: number;
  target: number;
  /** People on the shift who count towards the need (who have the skill). */
  assigned: number;
  /** Persons short of the minimum. */
  shortOfMin: number;
  /** Persons short of the target beyond the minimum shortfall. */
  shortOfTarget: number;
  /** Persons above the target. */
  over: number;
}

/** Cover of one date, summed over its needs. */
export interface CoverDayReportDto {
  date: string;
  needs: number;
  /** Needs with at least their minimum. */
  needsMetMin: number;
  /** Needs with at least their target. */
  needsMetTarget: number;
  shortOfMin: number;
  shortOfTarget: number;
  over: number;
}

/** A request the roster does not honour, with the checker's reasons. */
export interface RequestNotHonouredDto {
  staffMemberId: string;
  name: string;
  date: string;
  kind: string;
  reasons: string[];
}

export interface ReportTotalsDto {
  people: number;
  shifts: number;
  paidMinutes: number;
  nights: number;
  weekendDaysWorked: number;
  /** Sum of the known labour costs, rounded to cents. */
  labourCost: number;
  /** People whose hourly cost is unknown (their hours are not in labourCost). */
  peopleWithoutCost: number;
  needs: number;
  needsMetMin: number;
  needsMetTarget: number;
  shortOfMin: number;
  shortOfTarget: number;
  over: number;
  requests: number;
  requestsHonoured: number;
  /** Hard-rule findings of the independent checker on this roster. */
  violations: number;
}

export interface PeriodReportDto {
  periodId: string;
  unitId: string;
  unitName: string;
  startDate: string;
  days: number;
  status: RosterPeriodStatus;
  dates: string[];
  people: PersonReportDto[];
  cover: CoverReportRowDto[];
  coverByDay: CoverDayReportDto[];
  requestsNotHonoured: RequestNotHonouredDto[];
  totals: ReportTotalsDto;
  /** The checker's weighted objective terms for this roster, with the solver's default weights. */
  objectiveTerms: Record<string, number>;
  objective: number;
}

export interface ReportQuery {
  periodId: string;
}

/**
 * Columns of the payroll CSV: one row per person and shift worked (a timesheet line).
 * start and end are local "YYYY-MM-DD HH:mm" in the unit's time zone; paid_hours and cost have two
 * decimals; night and weekend are "yes" or "no".
 */
export const PAYROLL_CSV_COLUMNS = [
  'staff_id',
  'name',
  'date',
  'shift_code',
  'shift_name',
  'start',
  'end',
  'paid_hours',
  'night',
  'weekend',
  'hourly_cost',
  'cost',
] as const;

/** Paths of the report resources, relative to API_PREFIX. */
export const REPORTS_ROUTES = {
  report: '/reports',
  payrollCsv: '/reports/payroll.csv',
} as const;
export * from './notice-window';
