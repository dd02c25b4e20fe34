/**
 * Staff input: recurring weekly availability, date requests (shift on, shift off, day off) and leave.
 * Plain types, route paths and constants shared by the API and the web app.
 *
 * How the roster model reads them (apps/api/src/roster-input):
 * - availability "unavailable" is hard: an absence of the shift types of that part of the day on
 *   every date of that weekday; "prefer-not" is soft: a shift-off request with PREFER_NOT_WEIGHT;
 * - a date request is a shift-on / shift-off / day-off request with DATE_REQUEST_WEIGHT;
 * - approved leave is an absence (kind "leave") on every day of the period inside its range.
 */
import type { Page, PageQuery } from './dto';

// ---------------------------------------------------------------- parts of the day

/**
 * Parts of the day. A shift belongs to the part in which it STARTS, by its wall-clock start time in
 * the unit's time zone (a night shift starting 22:00 on Monday is Monday's night):
 * - early: starts 05:00-07:59
 * - day:   starts 08:00-11:59
 * - late:  starts 12:00-19:59
 * - night: starts 20:00-04:59 (across midnight)
 */
export const DAY_PARTS = ['early', 'day', 'late', 'night'] as const;
export type DayPart = (typeof DAY_PARTS)[number];

/** First minute of each part (minutes since midnight); a part runs until the next part starts. */
export const DAY_PART_STARTS: Readonly<Record<DayPart, number>> = {
  early: 5 * 60,
  day: 8 * 60,
  late: 12 * 60,
  night: 20 * 60,
};

export const DAY_PART_LABELS: Readonly<Record<DayPart, string>> = {
  early: 'Early (starts 05:00-07:59)',
  day: 'Day (starts 08:00-11:59)',
  late: 'Late (starts 12:00-19:59)',
  night: 'Night (starts 20:00-04:59)',
};

/** The part of the day a shift starting at "HH:mm" belongs to. */
export function dayPartOf(start: string): DayPart {
  const [h, m] = start.split(':').map(Number);
  const minute = h * 60 + m;
  if (minute >= DAY_PART_STARTS.night || minute < DAY_PART_STARTS.early) return 'night';
  if (minute >= DAY_PART_STARTS.late) return 'late';
  if (minute >= DAY_PART_STARTS.day) return 'day';
  return 'early';
}

// ---------------------------------------------------------------- availability

export const AVAILABILITY_STATUSES = ['available', 'prefer-not', 'unavailable'] as const;
export type AvailabilityStatus = (typeof AVAILABILITY_STATUSES)[number];

/** One cell of the weekly grid. Weekday as in JavaScript: 0 = Sunday … 6 = Saturday. */
export interface AvailabilityCellDto {
  weekday: number;
  part: DayPart;
  status: AvailabilityStatus;
}

/** A staff member's weekly availability. Cells not listed are "available". */
export interface AvailabilityDto {
  staffMemberId: string;
  cells: AvailabilityCellDto[];
}

/** Replaces the whole weekly grid (cells not listed become "available"). */
export interface ReplaceAvailabilityRequest {
  cells: AvailabilityCellDto[];
}

// ---------------------------------------------------------------- date requests

export const DATE_REQUEST_KINDS = ['shiftOn', 'shiftOff', 'dayOff'] as const;
export type DateRequestKind = (typeof DATE_REQUEST_KINDS)[number];

export const DATE_REQUEST_KIND_LABELS: Readonly<Record<DateRequestKind, string>> = {
  shiftOn: 'Shift on',
  shiftOff: 'Shift off',
  dayOff: 'Day off',
};

/** Weight of one date request in the model's objective (per request not honoured). */
export const DATE_REQUEST_WEIGHT = 10;
/** Weight of one "prefer not" availability cell on one date (per shift assigned in it). */
export const PREFER_NOT_WEIGHT = 3;
/** Date requests a staff member may make in one period unless the manager sets another limit. */
export const DEFAULT_REQUEST_LIMIT = 5;
export const MAX_REQUEST_LIMIT = 100;
export const REQUEST_NOTE_MAX_LENGTH = 500;

export interface DateRequestDto {
  id: string;
  rosterPeriodId: string;
  staffMemberId: string;
  /** Name of the staff member (shown to the person themselves and to managers only). */
  staffName: string;
  unitId: string;
  /** "YYYY-MM-DD", a day of the period. */
  date: string;
  kind: DateRequestKind;
  /** Shift type id for shiftOn and shiftOff; null for dayOff. */
  shiftTypeId: string | null;
  /** Code of that shift type (e.g. "E"), or null. */
  shiftTypeCode: string | null;
  note: string | null;
  createdAt: string;
}

export interface CreateDateRequestRequest {
  rosterPeriodId: string;
  date: string;
  kind: DateRequestKind;
  /** Required for shiftOn and shiftOff; must be absent or null for dayOff. */
  shiftTypeId?: string | null;
  note?: string | null;
}

export type UpdateDateRequestRequest = Partial<Omit<CreateDateRequestRequest, 'rosterPeriodId'>>;

/** GET /date-requests: filters and paging (by date, oldest first; a Page of DateRequestDto). */
export interface DateRequestListQuery extends Pick<PageQuery, 'page' | 'pageSize'> {
  rosterPeriodId?: string;
  unitId?: string;
  staffMemberId?: string;
}

// ---------------------------------------------------------------- leave

export const LEAVE_TYPES = ['annual', 'sick', 'other'] as const;
export type LeaveType = (typeof LEAVE_TYPES)[number];

export const LEAVE_TYPE_LABELS: Readonly<Record<LeaveType, string>> = {
  annual: 'Annual leave',
  sick: 'Sick leave',
  other: 'Other leave',
};

/** pending → approved | declined (by a manager); pending or approved → cancelled (by the staff member). */
export const LEAVE_STATUSES = ['pending', 'approved', 'declined', 'cancelled'] as const;
export type LeaveStatus = (typeof LEAVE_STATUSES)[number];

/** Longest leave request in days (inclusive range). */
export const MAX_LEAVE_DAYS = 366;

export interface LeaveDto {
  id: string;
  staffMemberId: string;
  staffName: string;
  unitId: string;
  /** First day of leave, "YYYY-MM-DD". */
  startDate: string;
  /** Last day of leave (inclusive), "YYYY-MM-DD". */
  endDate: string;
  type: LeaveType;
  status: LeaveStatus;
  note: string | null;
  /** The manager's note on approval or decline. */
  decisionNote: string | null;
  decidedAt: string | null;
  /** Display name of the manager who decided, or null. */
  decidedBy: string | null;
  createdAt: string;
}

export interface CreateLeaveRequest {
  /** The staff member the leave is for; may be omitted when the caller is staff in one unit only. */
  staffMemberId?: string;
  startDate: string;
  endDate: string;
  type: LeaveType;
  note?: string | null;
}

export interface DecideLeaveRequest {
  note?: string | null;
}

// ---------------------------------------------------------------- the caller's own input

/** A staff membership of the signed-in user (one per unit they are rostered in). */
export interface MyStaffMemberDto {
  id: string;
  name: string;
  unitId: string;
  unitName: string;
  timeZone: string;
}

/** A period that takes date requests (draft) or shows them (published), with the caller's usage. */
export interface RequestPeriodDto {
  id: string;
  unitId: string;
  startDate: string;
  days: number;
  status: 'draft' | 'published' | 'archived';
  /** Date requests one staff member may make in this period. */
  requestLimit: number;
}

/**
 * Everything the "My requests" and "My availability" pages need, for the signed-in user only.
 * `dateRequests` and `leave` are one page each (MyRequestsQuery), oldest first, with their totals.
 */
export interface MyRequestsDto {
  staffMembers: MyStaffMemberDto[];
  periods: RequestPeriodDto[];
  dateRequests: DateRequestDto[];
  leave: LeaveDto[];
  /** All of the caller's date requests, of which `dateRequests` is page `page`. */
  dateRequestsTotal: number;
  /** All of the caller's leave, of which `leave` is page `page`. */
  leaveTotal: number;
  page: number;
  pageSize: number;
}

/** GET /me/requests: page (from 1) and pageSize (1 to MAX_PAGE_SIZE, default MAX_PAGE_SIZE). */
export type MyRequestsQuery = Pick<PageQuery, 'page' | 'pageSize'>;

/** A period's requests for managers (the planning board and the requests table). */
export interface PeriodRequestsDto {
  period: RequestPeriodDto;
  dateRequests: DateRequestDto[];
  /** Leave (any status) that overlaps the period. */
  leave: LeaveDto[];
  availability: AvailabilityDto[];
}

export interface UpdateRequestLimitRequest {
  requestLimit: number;
}

// ---------------------------------------------------------------- the managers' table

export const REQUEST_ROW_TYPES = ['date', 'leave'] as const;
export type RequestRowType = (typeof REQUEST_ROW_TYPES)[number];

/** Status of a row: leave statuses, or "submitted" for date requests (they need no decision). */
export type RequestRowStatus = LeaveStatus | 'submitted';
export const REQUEST_ROW_STATUSES = ['submitted', ...LEAVE_STATUSES] as const;

/** One row of the managers' requests table: a date request or a leave request. */
export interface RequestRowDto {
  id: string;
  type: RequestRowType;
  staffMemberId: string;
  staffName: string;
  unitId: string;
  /** Date requests: their period; leave: null. */
  rosterPeriodId: string | null;
  startDate: string;
  /** Same as startDate for date requests. */
  endDate: string;
  /** Date request kind or leave type. */
  kind: DateRequestKind | LeaveType;
  shiftTypeCode: string | null;
  note: string | null;
  status: RequestRowStatus;
  createdAt: string;
}

export const REQUEST_SORT_FIELDS = ['startDate', 'staffName', 'createdAt', 'status'] as const;
export type RequestSortField = (typeof REQUEST_SORT_FIELDS)[number];

export interface RequestListQuery extends PageQuery {
  sort?: RequestSortField;
  unitId?: string;
  /** Date requests of this period and leave that overlaps it. */
  rosterPeriodId?: string;
  status?: RequestRowStatus;
  type?: RequestRowType;
}

export type RequestPage = Page<RequestRowDto>;

// ---------------------------------------------------------------- routes

const e = encodeURIComponent;

/** Paths of the staff-input resources, relative to API_PREFIX. */
export const REQUESTS_ROUTES = {
  /** GET (MyRequestsQuery): the signed-in user's staff memberships, periods, a page of date requests and leave (MyRequestsDto). */
  mine: '/me/requests',
  /** GET, PUT: a staff member's weekly availability (the person themselves; managers read). */
  availability: (staffMemberId: string) => `/staff/${e(staffMemberId)}/availability`,
  /** GET (list, DateRequestListQuery), POST (create, own only). */
  dateRequests: '/date-requests',
  /** PATCH, DELETE (own only, draft periods only). */
  dateRequest: (id: string) => `/date-requests/${e(id)}`,
  /** GET (list: own for staff, units' for managers), POST (create, own only). */
  leave: '/leave',
  /** DELETE: the staff member cancels their own pending or approved leave. */
  leaveItem: (id: string) => `/leave/${e(id)}`,
  leaveApprove: (id: string) => `/leave/${e(id)}/approve`,
  leaveDecline: (id: string) => `/leave/${e(id)}/decline`,
  /** GET: managers' table of date requests and leave (RequestListQuery → RequestPage). */
  requests: '/requests',
  /** GET: a period's requests, leave and availability for managers (PeriodRequestsDto). */
  periodRequests: (periodId: string) => `/roster-periods/${e(periodId)}/requests`,
  /** PUT: the per-period limit of date requests per staff member (UpdateRequestLimitRequest). */
  periodRequestLimit: (periodId: string) => `/roster-periods/${e(periodId)}/request-limit`,
} as const;
