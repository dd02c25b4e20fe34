/**
 * The roster problem: everything the model needs to build a roster for one period of one unit.
 *
 * Conventions used throughout the library:
 * - Days are indexed 0 … days-1 from `startDate` (a calendar date in the unit's time zone).
 * - A roster gives each person, for each day, one shift type id or null (a day off).
 * - Shift times are wall-clock times in `timeZone`; a shift whose end is not after its start
 *   ends on the next calendar day. Rest between shifts is measured between real instants,
 *   so it is right across midnight and across daylight-saving changes.
 * - Runs of work or days off that touch the first or last day of the period are "border runs":
 *   minimum-length rules do not apply to them (the days outside the period are unknown), while
 *   maximum-length rules count the days outside the period as days off. This is the same
 *   border convention as the published shift scheduling benchmark.
 */

/** A skill id, e.g. "rn" for registered nurse or "fr" for French speakers. */
export type SkillId = string;
export type ShiftTypeId = string;
export type PersonId = string;

export interface ShiftType {
  id: ShiftTypeId;
  /** Display name, e.g. "Early". */
  name: string;
  /** Start time "HH:mm" (24-hour), wall clock in the problem's time zone. */
  start: string;
  /** End time "HH:mm"; not after `start` means the shift ends the next day. */
  end: string;
  /** Paid minutes (the length minus unpaid breaks). Counted against contract hours. */
  paidMinutes: number;
  /**
   * Whether this shift counts as a night shift (for max consecutive nights and night fairness).
   * When omitted it is derived from the times: a shift is a night shift if at least 3 hours of
   * it fall between 00:00 and 05:00 (EU Working Time Directive 2003/88/EC, Art. 2: night time
   * includes 00:00–05:00 and a night worker works at least 3 hours of it).
   */
  night?: boolean;
}

/** Work rules of a contract. Every field is optional; an absent field means "no such rule". */
export interface Contract {
  /** Max number of shifts of each type per period (0 = never this type). */
  maxShiftsPerType?: Record<ShiftTypeId, number>;
  /** Min and max paid minutes per period (contract hours). */
  minPaidMinutes?: number;
  maxPaidMinutes?: number;
  /** Contracted paid minutes for the period; the distance from it is a soft goal. */
  targetPaidMinutes?: number;
  maxConsecutiveWorkDays?: number;
  minConsecutiveWorkDays?: number;
  minConsecutiveDaysOff?: number;
  /** Max weekends with any work (a weekend is worked if any weekend day is worked). */
  maxWeekends?: number;
  maxConsecutiveNights?: number;
  /** Minimum rest in minutes between the end of one shift and the start of the next. */
  minRestMinutes?: number;
}

export interface Person {
  id: PersonId;
  name: string;
  skills: SkillId[];
  contract: Contract;
  /** Cost of one paid hour, in the unit's currency (for the labour-cost goal). */
  hourlyCost?: number;
}

/** A cover need for one day, one shift type and (optionally) one skill. */
export interface CoverNeed {
  day: number;
  shiftTypeId: ShiftTypeId;
  /**
   * Skill the counted people must have, or null for anyone on the shift.
   * A person counts towards every need whose skill they have ("at least k with skill s").
   */
  skillId: SkillId | null;
  /** Minimum headcount; each person short of it costs `weightUnderMin` (default weights.coverUnderMin). */
  min: number;
  /** Target headcount (≥ min); each person short of it costs `weightUnderTarget`, each above it `weightOver`. */
  target: number;
  weightUnderMin?: number;
  weightUnderTarget?: number;
  weightOver?: number;
}

export type RequestKind = 'shiftOn' | 'shiftOff' | 'dayOff';

/**
 * A wish of one person for one day.
 * - shiftOn: wants to work `shiftTypeId` that day (penalty if not assigned exactly that shift);
 * - shiftOff: does not want `shiftTypeId` that day (penalty if assigned it);
 * - dayOff: wants no shift that day (penalty if assigned any).
 */
export interface ShiftRequest {
  personId: PersonId;
  day: number;
  kind: RequestKind;
  /** Required for shiftOn and shiftOff; ignored for dayOff. */
  shiftTypeId?: ShiftTypeId;
  weight: number;
}

/** Why a person cannot work: approved leave, declared unavailability or a fixed day off. */
export type AbsenceKind = 'leave' | 'unavailable' | 'fixedDayOff';

export interface Absence {
  personId: PersonId;
  day: number;
  kind: AbsenceKind;
  /** Only these shift types are blocked (e.g. unavailable in the evening); absent = the whole day. */
  shiftTypeIds?: ShiftTypeId[];
}

/** A cell fixed by the manager: this shift type (or null: a day off) on this day. */
export interface Pin {
  personId: PersonId;
  day: number;
  shiftTypeId: ShiftTypeId | null;
}

/** Shift type `to` may not be worked on the day after shift type `from`. */
export interface ForbiddenSuccession {
  from: ShiftTypeId;
  to: ShiftTypeId;
}

/** Weights of the soft goals; every goal is reported separately in the result. */
export interface ObjectiveWeights {
  /** Per person short of a need's minimum (default when the need has none). */
  coverUnderMin: number;
  /** Per person short of a need's target above the minimum. */
  coverUnderTarget: number;
  /** Per person above a need's target. */
  coverOver: number;
  /** Multiplies every request's own weight (1 = use request weights as they are). */
  requests: number;
  /** Per night shift of spread between the person with most and fewest nights (among night-eligible people). */
  fairNights: number;
  /** Per weekend of spread between the person with most and fewest worked weekends. */
  fairWeekends: number;
  /** Per hour of deviation from targetPaidMinutes, summed over people. */
  hoursDeviation: number;
  /** Per unit of labour cost (hourlyCost × paid hours). */
  labourCost: number;
  /** Repair mode: per cell that differs from the published roster. */
  changes: number;
}

export const DEFAULT_WEIGHTS: ObjectiveWeights = {
  coverUnderMin: 1000,
  coverUnderTarget: 100,
  coverOver: 1,
  requests: 1,
  fairNights: 5,
  fairWeekends: 5,
  hoursDeviation: 1,
  labourCost: 0,
  changes: 50,
};

/** A roster: for each person, one entry per day, a shift type id or null for a day off. */
export type Roster = Record<PersonId, (ShiftTypeId | null)[]>;

export interface RosterProblem {
  /** First day of the period, "YYYY-MM-DD" in `timeZone`. */
  startDate: string;
  /** Number of days in the period. */
  days: number;
  /** IANA time zone of the unit, e.g. "Europe/London". */
  timeZone: string;
  shiftTypes: ShiftType[];
  people: Person[];
  coverNeeds: CoverNeed[];
  requests: ShiftRequest[];
  absences: Absence[];
  forbiddenSuccessions: ForbiddenSuccession[];
  pins: Pin[];
  /** Partial weights are merged over DEFAULT_WEIGHTS. */
  weights?: Partial<ObjectiveWeights>;
  /**
   * Weekend days as JavaScript weekday numbers (0 = Sunday … 6 = Saturday), default [6, 0].
   * Consecutive weekend days form one weekend.
   */
  weekendDays?: number[];
  /** Repair mode: the published roster to stay close to (weighted by weights.changes). */
  published?: Roster;
  /** Display names of skills for explanations (e.g. { "3f2a…": "RN" }); the id is shown when absent. */
  skillNames?: Record<SkillId, string>;
}
