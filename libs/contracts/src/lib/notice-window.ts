import { type RosterChangeKind } from './publishing';

const e = encodeURIComponent;

/**
 * Changes to a published roster made with short notice. US predictive scheduling ("fair workweek")
 * laws ask for schedules 14 days ahead and attach predictability pay to later changes, for example
 * Seattle SMC 14.22, Oregon SB 828, the Chicago Fair Workweek Ordinance, Philadelphia ch. 9-4600 and
 * New York City's fast-food law (all 14 days). The laws, their exceptions and their pay differ: the
 * product records and shows, local law and agreements decide what is owed.
 */
export const NOTICE_WINDOW_DAYS_DEFAULT = 14;
export const NOTICE_WINDOW_DAYS_MIN = 0;
export const NOTICE_WINDOW_DAYS_MAX = 60;
/** Hours of pay recorded per late change: 0 to this, in quarter hours. */
export const PREDICTABILITY_PAY_HOURS_MAX = 24;
export const PREDICTABILITY_PAY_HOURS_DEFAULT = 1;
export const PREDICTABILITY_PAY_RULE_MAX_LENGTH = 500;

/**
 * Who a change came from. Changes a person asked for themselves (their own swap or give-away, a
 * claim of an open shift, a shift taken off for their own approved leave) are commonly exempt from
 * predictability pay under these laws (Seattle SMC 14.22 lists employee-requested changes and
 * mutually agreed shift trades among its exceptions, from memory); the rest come from the employer.
 */
export const CHANGE_INITIATORS = ['employer', 'employee'] as const;
export type ChangeInitiator = (typeof CHANGE_INITIATORS)[number];

/** What the product says wherever it shows late changes or predictability pay. */
export const NOTICE_WINDOW_CAUTION =
  'Rotaplex only records changes made inside the notice window. Whether a notice window applies, ' +
  'which changes are exempt and what, if anything, is owed are for local law and agreements to decide; ' +
  'check them with your payroll or HR team.';

/** The organisation's notice window and whether predictability pay is recorded. */
export interface NoticeWindowSettingsDto {
  /** Changes to a published roster less than this many days before the shift are late (0: none). */
  noticeWindowDays: number;
  /** Record a predictability-pay entry for each late change the employer made. Off by default. */
  recordPredictabilityPay: boolean;
  /** Hours of pay recorded per late change made by the employer. */
  predictabilityPayHours: number;
  /** The organisation's own rule in words (its law or agreement), kept with each entry. */
  predictabilityPayRule: string;
}

export type UpdateNoticeWindowSettingsRequest = NoticeWindowSettingsDto;

/** One cell of a published roster changed inside the notice window. */
export interface LateChangeDto {
  id: string;
  /** The period's version this change made. */
  version: number;
  kind: RosterChangeKind;
  initiatedBy: ChangeInitiator;
  staffMemberId: string;
  staffName: string;
  /** The shift's day (the unit's calendar). */
  date: string;
  /** Shift names before and after (null: day off). */
  shiftBefore: string | null;
  shiftAfter: string | null;
  /** Whole days between the change (unit's calendar) and the shift's day. */
  daysNotice: number;
  /** The notice window in force when the change was made. */
  noticeWindowDays: number;
  /** Hours of predictability pay recorded; null when none was recorded (exempt or setting off). */
  payHours: number | null;
  /** The organisation's rule in words when the entry was recorded. */
  payRule: string | null;
  /** Why it is late, and why it is exempt when it is, in words. */
  reason: string;
  actorName: string;
  at: string;
}

/** Predictability pay recorded for one person in a period. */
export interface PredictabilityPayOwedDto {
  staffMemberId: string;
  staffName: string;
  changes: number;
  hours: number;
}

export interface LateChangesDto {
  rosterPeriodId: string;
  settings: NoticeWindowSettingsDto;
  /** Every late change of the period, newest first. */
  changes: LateChangeDto[];
  /** Pay recorded per person (employer-initiated late changes only), most hours first. */
  owed: PredictabilityPayOwedDto[];
  caution: string;
}

export const NOTICE_WINDOW_ROUTES = {
  settings: '/organisation/notice-window',
  lateChanges: (periodId: string) => `/roster-periods/${e(periodId)}/late-changes`,
} as const;
