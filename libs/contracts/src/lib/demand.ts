/**
 * From demand to cover: a unit's workload forecast (contact-centre contacts per interval, ward
 * patients per shift), the staff requirement computed from it, the covering plan (how many people
 * start each shift type each day) and the step that accepts the plan into the period's cover needs.
 * Plain types, route paths and constants shared by the API and the web app. See docs/demand.md.
 */

// ---------------------------------------------------------------- constants

/** Interval lengths a contact-centre forecast may use, in minutes. */
export const DEMAND_INTERVAL_MINUTES = [15, 30, 60] as const;
export type DemandIntervalMinutes = (typeof DEMAND_INTERVAL_MINUTES)[number];

/** Acuity levels of ward patients (how much nursing care a patient needs), lowest first. */
export const ACUITY_LEVELS = ['low', 'medium', 'high'] as const;
export type AcuityLevel = (typeof ACUITY_LEVELS)[number];

/** Columns of the contact forecast CSV: day (Mon … Sun, 0-6 with 0 = Sunday, or YYYY-MM-DD), start "HH:mm". */
export const DEMAND_CSV_COLUMNS = ['day', 'start', 'contacts', 'aht'] as const;

/** Limits the API enforces (400 beyond them). */
export const DEMAND_LIMITS = {
  /** Contacts offered in one interval. */
  maxContacts: 100_000,
  /** Average handle time, seconds. */
  minAhtSeconds: 1,
  maxAhtSeconds: 7_200,
  /** Service target: answered within this many seconds. */
  maxTargetSeconds: 3_600,
  /** Dated forecast rows (whole file or request). */
  maxDateRows: 84 * 96,
  /** Patients per shift of one acuity level. */
  maxPatients: 1_000,
  /** Patients one person cares for at once (a ratio 1:n). */
  maxPatientsPerStaff: 50,
  /** People available per day (the covering cap). */
  maxPeoplePerDay: 5_000,
} as const;

// ---------------------------------------------------------------- cautions (shown where the decision is made)

/** Shown with every ward requirement and every accepted ward plan. */
export const RATIO_CAUTION =
  'A nurse-to-patient ratio is a floor set by local law and professional staffing standards, not a target Rotaplex decides. Check the numbers against your local rules and clinical judgement; a qualified person signs the roster off.';

/** Shown with every contact-centre requirement. */
export const ERLANG_CAUTION =
  'Erlang C assumes contacts arrive at random, callers wait without hanging up, and every agent handles any contact. Real service levels are usually somewhat better with abandonment and worse with peaks inside an interval; treat the requirement as an estimate.';

/** Shown when contacts fall in intervals that no allowed shift type covers. */
export const OUTSIDE_SHIFTS_CAUTION =
  'Some contacts fall outside the hours of every shift type the plan may open, so no plan can answer them. Add or allow a shift type that covers those hours, or move the forecast.';

/** Shown when the plan leaves intervals short (the available people cannot meet the requirement). */
export const UNDER_COVER_CAUTION =
  'Some intervals stay below the requirement because not enough people are available. Short cover means longer waits for callers and more pressure on the people at work.';

// ---------------------------------------------------------------- the forecast (what the manager enters)

/** Service target of a contact centre, e.g. 80% of contacts answered within 20 seconds. */
export interface ServiceTargetDto {
  /** Share of contacts answered within targetSeconds, percent (1-99.9). */
  targetPercent: number;
  /** Seconds (0-3600). */
  targetSeconds: number;
  /** Highest occupancy allowed (busy time of an agent), percent (50-100). 100 = no cap. */
  maxOccupancyPercent: number;
  /** Time paid but away from contacts (breaks, training, absence), percent (0-80). Scheduled = required / (1 - s). */
  shrinkagePercent: number;
}

/** Contacts expected in one interval. */
export interface ContactIntervalDto {
  /** Wall-clock start "HH:mm" in the unit's time zone; a multiple of intervalMinutes after midnight. */
  start: string;
  /** Contacts offered in the interval (may be fractional, as forecasts are). */
  contacts: number;
  /** Average handle time in seconds (talk + hold + after-contact work). */
  ahtSeconds: number;
}

/** A weekday of the weekly pattern. Intervals absent from the list have no contacts. */
export interface ContactWeekdayDto {
  /** 0 = Sunday … 6 = Saturday. */
  weekday: number;
  intervals: ContactIntervalDto[];
}

/** A date that replaces the weekly pattern's weekday as a whole (a holiday, a campaign). */
export interface ContactDateDto {
  /** "YYYY-MM-DD". */
  date: string;
  intervals: ContactIntervalDto[];
}

export interface ContactCentreDemandDto {
  intervalMinutes: DemandIntervalMinutes;
  /** The skill every agent on these contacts needs (cover needs are written for it); null = anyone. */
  skillId: string | null;
  service: ServiceTargetDto;
  /** Up to 7 weekdays; a weekday left out has no contacts. */
  pattern: ContactWeekdayDto[];
  dates: ContactDateDto[];
  /**
   * Shift types the covering may open (ids of the unit's shift types); empty = all of them.
   * A shift that crosses midnight covers the next morning.
   */
  shiftTypeIds: string[];
  /** People available per day; null = no cap. With a cap, intervals may stay short (priced as under-cover). */
  maxPeoplePerDay: number | null;
}

/** Patients of one acuity level. */
export type AcuityMixDto = Record<AcuityLevel, number>;

/** Expected patients on one shift type of a weekday (pattern) or a date (replaces the pattern's row). */
export interface WardPatientsDto {
  /** 0 = Sunday … 6 = Saturday, for the weekly pattern; null when `date` is given. */
  weekday: number | null;
  /** "YYYY-MM-DD", for one date; null for the pattern. */
  date: string | null;
  shiftTypeId: string;
  patients: AcuityMixDto;
}

/**
 * Ratio of one skill: how many patients of each acuity level one person with the skill cares for
 * (1:n), and the floor per shift (e.g. never fewer than 2 registered nurses).
 */
export interface WardRatioDto {
  skillId: string;
  /** Patients per person, per acuity level (each 1-50; e.g. low 8, medium 5, high 2). */
  patientsPerStaff: AcuityMixDto;
  /** At least this many people with the skill on every shift, whatever the patients (0-50). */
  minimumPerShift: number;
  /** Where the ratio and the floor come from, in the manager's words (a law, a standard, a policy). */
  source: string;
}

export interface WardDemandDto {
  patients: WardPatientsDto[];
  ratios: WardRatioDto[];
}

/** GET /units/:unitId/demand. Either part may be null (a unit without that kind of demand). */
export interface UnitDemandDto {
  unitId: string;
  contactCentre: ContactCentreDemandDto | null;
  ward: WardDemandDto | null;
  /** ISO instant of the last write, null when never saved. */
  updatedAt: string | null;
  /** After a write, and on reads of a ward part: cautions (see RATIO_CAUTION). */
  cautions?: string[];
}

/** PUT /units/:unitId/demand: replaces both parts (null clears a part). */
export interface PutUnitDemandRequest {
  contactCentre: ContactCentreDemandDto | null;
  ward: WardDemandDto | null;
}

// ---------------------------------------------------------------- requirement (computed)

/** The requirement of one contact-centre interval of the period. */
export interface IntervalRequirementDto {
  /** Local wall-clock start "YYYY-MM-DDTHH:mm". */
  start: string;
  contacts: number;
  ahtSeconds: number;
  /** Offered traffic A = contacts x AHT / interval length, in Erlangs. */
  trafficErlangs: number;
  /** Fewest agents on contacts meeting the service target and the occupancy cap (0 when no contacts). */
  agents: number;
  /** Agents to schedule: ceil(agents / (1 - shrinkage)). */
  scheduled: number;
  /** Service level with `agents` answering, percent (null when no contacts). */
  serviceLevelPercent: number | null;
  /** Average speed of answer with `agents`, seconds (null when no contacts). */
  asaSeconds: number | null;
  /** Occupancy A / agents, percent (null when no contacts). */
  occupancyPercent: number | null;
}

/** The requirement of one ward shift for one skill. */
export interface WardShiftRequirementDto {
  date: string;
  shiftTypeId: string;
  skillId: string;
  patients: AcuityMixDto;
  /** ceil(sum over levels of patients / patients-per-staff), before the floor. */
  byRatio: number;
  /** The floor of the skill per shift. */
  floor: number;
  /** max(byRatio, floor). */
  required: number;
}

// ---------------------------------------------------------------- covering plan (computed)

/** People starting one shift type on one day. */
export interface ShiftStartDto {
  date: string;
  shiftTypeId: string;
  /** People with the plan's skill (or anyone) starting this shift: the target of the cover need. */
  people: number;
  /** The same plan computed without shrinkage (agents on contacts only): the minimum of the cover need. */
  minimum: number;
}

/** What the plan puts on each interval (same order and length as `requirement`). */
export interface IntervalCoverDto {
  start: string;
  /** People the plan has on shift (target). */
  planned: number;
  /** scheduled - planned when positive. */
  short: number;
  /** People on shift in the period's current roster (assignments), for the board's chart. */
  rostered: number;
  /** Service level of the rostered people after shrinkage, percent (null when no contacts). */
  rosteredServiceLevelPercent: number | null;
}

/** GET /roster-periods/:periodId/demand-plan: requirement and covering plan for the period (nothing saved). */
export interface DemandPlanDto {
  rosterPeriodId: string;
  unitId: string;
  /** "YYYY-MM-DD" of each day of the period. */
  dates: string[];
  contactCentre: {
    intervalMinutes: DemandIntervalMinutes;
    skillId: string | null;
    service: ServiceTargetDto;
    requirement: IntervalRequirementDto[];
    cover: IntervalCoverDto[];
    starts: ShiftStartDto[];
    /** Paid hours of the plan (people x paid minutes of their shift / 60). */
    paidHours: number;
    /** Sum over intervals of people short (0 without a cap on people per day). */
    underCoverPersonIntervals: number;
    /** The part of it in intervals that no allowed shift covers (contacts outside every shift's hours). */
    outsideShiftsPersonIntervals: number;
    /** Solver outcome of the covering MIP: 'optimal', or 'time-limit' with the best plan found. */
    solverStatus: string;
    /** Seconds for requirement + covering. */
    seconds: number;
  } | null;
  ward: {
    requirement: WardShiftRequirementDto[];
  } | null;
  /** ERLANG_CAUTION, RATIO_CAUTION, UNDER_COVER_CAUTION and others as they apply. */
  cautions: string[];
}

// ---------------------------------------------------------------- accept

/** One cover need the plan sets for a date of the period (written as a cover-need override). */
export interface AcceptedCoverRowDto {
  date: string;
  shiftTypeId: string;
  skillId: string | null;
  min: number;
  /** At least min. */
  target: number;
}

/**
 * POST /roster-periods/:periodId/demand-plan/accept. The rows (usually the plan's starts and ward
 * requirement as the manager left them) become date overrides of the unit's cover needs, each
 * replacing one with the same date, shift type and skill. All in one transaction.
 */
export interface AcceptDemandPlanRequest {
  rows: AcceptedCoverRowDto[];
}

export interface AcceptDemandPlanResultDto {
  rosterPeriodId: string;
  /** Overrides written. */
  written: number;
  /** Id of the acceptance record (who, when, before and after). */
  acceptanceId: string;
  /** Cautions of the change (minimums lowered to 0, ratio caution for ward skills). */
  cautions: string[];
}

/** GET /roster-periods/:periodId/demand-plan/acceptances: who accepted which plan when (newest first). */
export interface DemandAcceptanceDto {
  id: string;
  rosterPeriodId: string;
  actorUserId: string | null;
  actorName: string;
  at: string;
  written: number;
  summary: string;
}

// ---------------------------------------------------------------- routes

const e = encodeURIComponent;

/** Paths of the demand resources, relative to API_PREFIX. */
export const DEMAND_ROUTES = {
  demand: (unitId: string) => `/units/${e(unitId)}/demand`,
  contactsImport: (unitId: string) => `/units/${e(unitId)}/demand/contacts/import`,
  plan: (periodId: string) => `/roster-periods/${e(periodId)}/demand-plan`,
  accept: (periodId: string) => `/roster-periods/${e(periodId)}/demand-plan/accept`,
  acceptances: (periodId: string) => `/roster-periods/${e(periodId)}/demand-plan/acceptances`,
} as const;
