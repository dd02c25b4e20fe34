/**
 * Planning data: skills, shift types, contracts (work rules) and their presets, staff members,
 * cover needs and roster periods. Plain types, route paths and constants shared by the API and the web app.
 */
import type { PageQuery } from './dto';

// ---------------------------------------------------------------- colours

/** Rotaplex's own palette for shift types. The web theme maps each key to its colours. */
export const SHIFT_COLOURS = ['teal', 'amber', 'plum', 'slate', 'moss', 'coral', 'sky', 'sand'] as const;
export type ShiftColour = (typeof SHIFT_COLOURS)[number];

// ---------------------------------------------------------------- skills

export interface SkillDto {
  id: string;
  /** Short code, upper case letters, digits, '-' or '_' (e.g. "RN", "FR"). Unique in the organisation. */
  code: string;
  name: string;
  /**
   * A registered (licensed) professional skill, such as registered nurse: its shortfalls are checked
   * for the red flags of safe staffing (see safe-staffing.ts). Default false.
   */
  registered: boolean;
}

export interface CreateSkillRequest {
  code: string;
  name: string;
  registered?: boolean;
}
export type UpdateSkillRequest = Partial<CreateSkillRequest>;

export const SKILL_CODE_PATTERN = /^[A-Z0-9_-]{1,16}$/;

// ---------------------------------------------------------------- shift types

/** "HH:mm", 24-hour clock. */
export const TIME_OF_DAY_PATTERN = /^([01]\d|2[0-3]):[0-5]\d$/;
export const SHIFT_CODE_PATTERN = /^[A-Z0-9]{1,4}$/;

export interface ShiftTypeDto {
  id: string;
  unitId: string;
  /** 1-4 upper-case letters or digits, unique in the unit (e.g. "E", "L", "N"). */
  code: string;
  name: string;
  /** Wall-clock start "HH:mm" in the unit's time zone. */
  start: string;
  /** Wall-clock end "HH:mm"; not after start means the shift ends the next day. */
  end: string;
  /** Paid minutes (length minus unpaid breaks), at most the length. */
  paidMinutes: number;
  colour: ShiftColour;
  /** Night shift or not; null: derived from the times (see {@link isNightByTimes}). */
  night: boolean | null;
  /** Guard-rail cautions (a shift over 12 hours; see shiftTypeCautions), in every answer of the API. */
  cautions?: string[];
}

export interface CreateShiftTypeRequest {
  code: string;
  name: string;
  start: string;
  end: string;
  paidMinutes: number;
  colour: ShiftColour;
  night?: boolean | null;
}
export type UpdateShiftTypeRequest = Partial<CreateShiftTypeRequest>;

/** Minutes since midnight of "HH:mm". */
export function minutesOfDay(time: string): number {
  const [h, m] = time.split(':').map(Number);
  return h * 60 + m;
}

/** Length in minutes of a shift from start to end (an end not after the start is on the next day). */
export function shiftLengthMinutes(start: string, end: string): number {
  const s = minutesOfDay(start);
  const e = minutesOfDay(end);
  return e > s ? e - s : e + 1440 - s;
}

/**
 * Whether a shift counts as a night shift by its times: at least 3 hours of it fall between 00:00
 * and 05:00 (EU Working Time Directive 2003/88/EC, Art. 2: night time includes 00:00-05:00 and a
 * night worker works at least 3 hours of it). Same rule as the roster model.
 */
export function isNightByTimes(start: string, end: string): boolean {
  const s = minutesOfDay(start);
  const length = shiftLengthMinutes(start, end);
  let inNight = 0;
  // The shift covers [s, s + length) on a two-day axis; night windows are [0, 300) and [1440, 1740).
  for (const w of [0, 1440]) {
    inNight += Math.max(0, Math.min(s + length, w + 300) - Math.max(s, w));
  }
  return inNight >= 180;
}

// ---------------------------------------------------------------- contracts

/**
 * Work rules of a contract. Every rule is optional (null: no such rule).
 *
 * Quantities are stated PER WEEK (7 days) so one contract fits any period length: paid minutes and
 * shifts per type. Weekends are stated per 4 weeks (28 days), as "at most 2 weekends in 4" is how
 * rosters usually state it. {@link contractForPeriod} scales them to a period: maxima round down,
 * minima round up, the target to the nearest minute. Run lengths and rest are not scaled.
 *
 * maxShiftsPerType is keyed by shift type CODE (not id), because a contract may serve the whole
 * organisation and each unit has its own shift types; a code absent from the map has no limit.
 */
export interface ContractRules {
  /** Max shifts of each type per week, keyed by shift type code (0 = never this type). */
  maxShiftsPerType: Record<string, number> | null;
  /** Min paid minutes per week. */
  minPaidMinutes: number | null;
  /** Max paid minutes per week. */
  maxPaidMinutes: number | null;
  /** Contracted paid minutes per week (the distance from it is a soft goal). */
  targetPaidMinutes: number | null;
  maxConsecutiveWorkDays: number | null;
  minConsecutiveWorkDays: number | null;
  minConsecutiveDaysOff: number | null;
  /** Max weekends with any work per 4 weeks. */
  maxWeekends: number | null;
  maxConsecutiveNights: number | null;
  /** Min rest in minutes between the end of one shift and the start of the next. */
  minRestMinutes: number | null;
}

export const CONTRACT_RULE_FIELDS = [
  'maxShiftsPerType',
  'minPaidMinutes',
  'maxPaidMinutes',
  'targetPaidMinutes',
  'maxConsecutiveWorkDays',
  'minConsecutiveWorkDays',
  'minConsecutiveDaysOff',
  'maxWeekends',
  'maxConsecutiveNights',
  'minRestMinutes',
] as const satisfies readonly (keyof ContractRules)[];

export interface ContractDto extends ContractRules {
  id: string;
  /** The unit the contract belongs to, or null for the whole organisation. */
  unitId: string | null;
  name: string;
  /** Limits beyond the working-time presets (see contractCautions), in every answer of the API. */
  cautions?: string[];
}

export type CreateContractRequest = { unitId?: string | null; name: string } & Partial<ContractRules>;
export type UpdateContractRequest = { name?: string } & Partial<ContractRules>;

/** The caution every working-time preset carries (PRODUCT.md, "Cautions shown in the product"). */
export const WORKING_TIME_CAUTION =
  'These rules reflect common working-time limits. They are not legal advice: local law, collective ' +
  'agreements and professional staffing standards come first, and a qualified person signs the roster off. ' +
  'Overriding a rest rule carries a fatigue risk.';

export interface ContractPresetDto {
  key: string;
  name: string;
  /** Where each limit comes from, in plain words. */
  basis: string;
  rules: ContractRules;
  caution: string;
}

/** Every contract rule off: the base each preset (and any generated contract) spreads its rules over. */
export const NO_RULES: ContractRules = {
  maxShiftsPerType: null,
  minPaidMinutes: null,
  maxPaidMinutes: null,
  targetPaidMinutes: null,
  maxConsecutiveWorkDays: null,
  minConsecutiveWorkDays: null,
  minConsecutiveDaysOff: null,
  maxWeekends: null,
  maxConsecutiveNights: null,
  minRestMinutes: null,
};

/**
 * Presets of common working-time limits. Values and articles are from PRODUCT.md "Trade facts"
 * (EU Working Time Directive 2003/88/EC; UK Working Time Regulations 1998). The average-week limit
 * is applied per week of the roster, which is stricter than an average over months.
 */
export const CONTRACT_PRESETS: readonly ContractPresetDto[] = [
  {
    key: 'eu-wtd',
    name: 'EU Working Time Directive limits',
    basis:
      'Directive 2003/88/EC: 11 consecutive hours of daily rest (Art. 3); 24 hours of weekly rest plus the ' +
      '11 hours in each 7 days, so at most 6 working days in a row (Art. 5); at most 48 hours a week on ' +
      'average including overtime (Art. 6).',
    rules: {
      ...NO_RULES,
      minRestMinutes: 11 * 60,
      maxConsecutiveWorkDays: 6,
      maxPaidMinutes: 48 * 60,
    },
    caution: WORKING_TIME_CAUTION,
  },
  {
    key: 'uk-wtr',
    name: 'UK Working Time Regulations 1998 limits',
    basis:
      'Working Time Regulations 1998: at most 48 hours a week averaged over 17 weeks by default; 11 hours of ' +
      'daily rest; 24 hours of rest in each 7 days. Applied here per week.',
    rules: {
      ...NO_RULES,
      minRestMinutes: 11 * 60,
      maxConsecutiveWorkDays: 6,
      maxPaidMinutes: 48 * 60,
    },
    caution: WORKING_TIME_CAUTION,
  },
  {
    key: 'part-time',
    name: 'Part-time, 22.5 hours a week (example)',
    basis:
      'An example part-time contract of 22.5 paid hours a week (three 7.5-hour shifts), inside the EU ' +
      'Working Time Directive limits: 11 hours of daily rest, at most 5 working days in a row.',
    rules: {
      ...NO_RULES,
      minRestMinutes: 11 * 60,
      maxConsecutiveWorkDays: 5,
      minPaidMinutes: 15 * 60,
      targetPaidMinutes: 22.5 * 60,
      maxPaidMinutes: 30 * 60,
      maxWeekends: 2,
    },
    caution: WORKING_TIME_CAUTION,
  },
];

/** The same rules as the roster model's Contract for a period of `days` days (absent = no rule). */
export interface PeriodContractRules {
  maxShiftsPerType?: Record<string, number>;
  minPaidMinutes?: number;
  maxPaidMinutes?: number;
  targetPaidMinutes?: number;
  maxConsecutiveWorkDays?: number;
  minConsecutiveWorkDays?: number;
  minConsecutiveDaysOff?: number;
  maxWeekends?: number;
  maxConsecutiveNights?: number;
  minRestMinutes?: number;
}

/** Scales per-week (and per-4-week weekend) rules to a period of `days` days; see {@link ContractRules}. */
export function contractForPeriod(rules: ContractRules, days: number): PeriodContractRules {
  const weeks = days / 7;
  const out: PeriodContractRules = {};
  if (rules.maxShiftsPerType) {
    out.maxShiftsPerType = Object.fromEntries(
      Object.entries(rules.maxShiftsPerType).map(([code, n]) => [code, Math.floor(n * weeks + 1e-9)]),
    );
  }
  if (rules.minPaidMinutes !== null) out.minPaidMinutes = Math.ceil(rules.minPaidMinutes * weeks - 1e-9);
  if (rules.maxPaidMinutes !== null) out.maxPaidMinutes = Math.floor(rules.maxPaidMinutes * weeks + 1e-9);
  if (rules.targetPaidMinutes !== null) out.targetPaidMinutes = Math.round(rules.targetPaidMinutes * weeks);
  if (rules.maxWeekends !== null) out.maxWeekends = Math.floor((rules.maxWeekends * days) / 28 + 1e-9);
  for (const key of [
    'maxConsecutiveWorkDays',
    'minConsecutiveWorkDays',
    'minConsecutiveDaysOff',
    'maxConsecutiveNights',
    'minRestMinutes',
  ] as const) {
    const v = rules[key];
    if (v !== null) out[key] = v;
  }
  return out;
}

// ---------------------------------------------------------------- staff

export interface StaffMemberDto {
  id: string;
  unitId: string;
  /** The sign-in user this staff member is, or null. */
  userId: string | null;
  name: string;
  email: string | null;
  /** Skill codes, sorted. */
  skills: string[];
  contractId: string | null;
  /** Cost of one paid hour in the unit's currency; null: unknown. */
  hourlyCost: number | null;
  active: boolean;
}

export interface CreateStaffMemberRequest {
  unitId: string;
  userId?: string | null;
  name: string;
  email?: string | null;
  /** Skill codes. */
  skills: string[];
  contractId?: string | null;
  hourlyCost?: number | null;
  active?: boolean;
}
export type UpdateStaffMemberRequest = Partial<Omit<CreateStaffMemberRequest, 'unitId'>>;

export const STAFF_SORT_FIELDS = ['name', 'email', 'active', 'hourlyCost'] as const;
export type StaffSortField = (typeof STAFF_SORT_FIELDS)[number];

export interface StaffListQuery extends PageQuery {
  sort?: StaffSortField;
  unitId?: string;
  /** Skill code. */
  skill?: string;
  active?: boolean;
}

/**
 * Columns of the staff CSV (upload and export), in this order. skills: codes separated by spaces or
 * semicolons; contract: the contract's name; active: true/false (default true).
 */
export const STAFF_CSV_COLUMNS = ['name', 'email', 'skills', 'contract', 'hourlyCost', 'active'] as const;

export interface CsvRowError {
  /** Line of the CSV file, 1-based, counting the header line. */
  line: number;
  /** Column name, or "file" for a problem with the file as a whole. */
  field: string;
  message: string;
}

export interface CsvImportResult {
  dryRun: boolean;
  /** Data rows read. */
  rows: number;
  /** Rows saved (0 on a dry run or when any row is bad). */
  saved: number;
  errors: CsvRowError[];
  /** Guard-rail cautions of what the file sets (a cover minimum lowered to 0), also on a dry run. */
  cautions?: string[];
}

// ---------------------------------------------------------------- cover needs

/** Weekday as in JavaScript: 0 = Sunday … 6 = Saturday. */
export interface CoverPatternRowDto {
  weekday: number;
  shiftTypeId: string;
  /** Skill the counted people must have, or null for anyone on the shift. */
  skillId: string | null;
  min: number;
  /** At least min. */
  target: number;
}

/** A need for one date that replaces the pattern's row with the same shift type and skill. */
export interface CoverOverrideDto {
  id: string;
  /** After a write: the caution when this override sets a minimum of 0 where the pattern had one. */
  cautions?: string[];
  /** "YYYY-MM-DD". */
  date: string;
  shiftTypeId: string;
  skillId: string | null;
  min: number;
  target: number;
}

export interface CoverNeedsDto {
  unitId: string;
  pattern: CoverPatternRowDto[];
  overrides: CoverOverrideDto[];
  /** After a write: minimums that were above 0 and are now 0 (see loweredToZeroCautions). */
  cautions?: string[];
}

export interface ReplaceCoverPatternRequest {
  rows: CoverPatternRowDto[];
}

export type CreateCoverOverrideRequest = Omit<CoverOverrideDto, 'id'>;

/**
 * Columns of the cover-need CSV. day: a weekday (Sun, Mon, … or 0-6 with 0 = Sunday) for the weekly
 * pattern, or a date YYYY-MM-DD for an override; shift: shift type code; skill: skill code or empty.
 * An upload replaces the whole weekly pattern when it has pattern rows, and adds or replaces the
 * overrides of its date rows.
 */
export const COVER_CSV_COLUMNS = ['day', 'shift', 'skill', 'min', 'target'] as const;
export const WEEKDAY_NAMES = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'] as const;

// ---------------------------------------------------------------- roster periods

export const ROSTER_PERIOD_STATUSES = ['draft', 'published', 'archived'] as const;
export type RosterPeriodStatus = (typeof ROSTER_PERIOD_STATUSES)[number];
export const ROSTER_PERIOD_MIN_DAYS = 7;
export const ROSTER_PERIOD_MAX_DAYS = 84;

export interface RosterPeriodDto {
  id: string;
  unitId: string;
  /** "YYYY-MM-DD", first day. */
  startDate: string;
  days: number;
  status: RosterPeriodStatus;
  createdAt: string;
  publishedAt: string | null;
  /** Increases on every change (optimistic locking). */
  version: number;
}

export interface CreateRosterPeriodRequest {
  unitId: string;
  startDate: string;
  days: number;
}
export type UpdateRosterPeriodRequest = Partial<Pick<CreateRosterPeriodRequest, 'startDate' | 'days'>> & {
  /** When given, the change is refused with 409 unless the period still has this version. */
  version?: number;
};

/** GET /roster-periods: filters and paging (newest first; a Page of RosterPeriodDto). */
export interface RosterPeriodListQuery extends Pick<PageQuery, 'page' | 'pageSize'> {
  unitId?: string;
  status?: RosterPeriodStatus;
}

// ---------------------------------------------------------------- routes

const e = encodeURIComponent;

/** Paths of the planning resources, relative to API_PREFIX. */
export const PLANNING_ROUTES = {
  skills: '/skills',
  skill: (id: string) => `/skills/${e(id)}`,
  shiftTypes: (unitId: string) => `/units/${e(unitId)}/shift-types`,
  shiftType: (unitId: string, id: string) => `/units/${e(unitId)}/shift-types/${e(id)}`,
  contracts: '/contracts',
  contractPresets: '/contracts/presets',
  contract: (id: string) => `/contracts/${e(id)}`,
  staff: '/staff',
  staffMember: (id: string) => `/staff/${e(id)}`,
  staffImport: '/staff/import',
  staffExport: '/staff/export.csv',
  coverNeeds: (unitId: string) => `/units/${e(unitId)}/cover-needs`,
  coverPattern: (unitId: string) => `/units/${e(unitId)}/cover-needs/pattern`,
  coverOverrides: (unitId: string) => `/units/${e(unitId)}/cover-needs/overrides`,
  coverOverride: (unitId: string, id: string) => `/units/${e(unitId)}/cover-needs/overrides/${e(id)}`,
  coverImport: (unitId: string) => `/units/${e(unitId)}/cover-needs/import`,
  rosterPeriods: '/roster-periods',
  rosterPeriod: (id: string) => `/roster-periods/${e(id)}`,
  rosterPeriodArchive: (id: string) => `/roster-periods/${e(id)}/archive`,
} as const;
