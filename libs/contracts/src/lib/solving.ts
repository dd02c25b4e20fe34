/**
 * Solving: solve runs (one generation of a roster by the integer program) and the assignments of a
 * roster period (the grid of people by days), with the checker's findings. Plain types, route paths
 * and constants shared by the API and the web app.
 */

// ---------------------------------------------------------------- solve runs

export const SOLVE_RUN_STATUSES = ['queued', 'running', 'finished', 'failed', 'cancelled'] as const;
export type SolveRunStatus = (typeof SOLVE_RUN_STATUSES)[number];
/** Statuses of a run that has not ended yet; a period has at most one such run. */
export const ACTIVE_SOLVE_RUN_STATUSES = ['queued', 'running'] as const satisfies readonly SolveRunStatus[];
/** Statuses of a run that has ended: its result (or failure) is final. */
export const SOLVE_RUN_ENDED_STATUSES = [
  'finished',
  'failed',
  'cancelled',
] as const satisfies readonly SolveRunStatus[];
export function isSolveRunEnded(status: string): boolean {
  return (SOLVE_RUN_ENDED_STATUSES as readonly string[]).includes(status);
}

export const SOLVE_TIME_LIMIT_MIN_SECONDS = 1;
export const SOLVE_TIME_LIMIT_MAX_SECONDS = 600;

/** Names of the objective weights a run may override (same names as the roster model's goals). */
export const SOLVE_WEIGHT_NAMES = [
  'coverUnderMin',
  'coverUnderTarget',
  'coverOver',
  'requests',
  'fairNights',
  'fairWeekends',
  'hoursDeviation',
  'labourCost',
] as const;
export type SolveWeightName = (typeof SOLVE_WEIGHT_NAMES)[number];
export type SolveWeights = Partial<Record<SolveWeightName, number>>;
/** Largest accepted weight (keeps the objective's numbers in a range the solver handles well). */
export const SOLVE_WEIGHT_MAX = 1_000_000;

export interface StartSolveRunRequest {
  timeLimitSeconds: number;
  weights?: SolveWeights;
}

export interface SolveRunStartedDto {
  id: string;
}

export interface SolveProgressDto {
  elapsedSeconds: number;
  /** Best objective so far, null before the first roster. */
  objective: number | null;
  /** Proven lower bound, null while unknown. */
  bound: number | null;
  /** Relative gap (0.012 = 1.2%), null while unknown. */
  gap: number | null;
}

export interface UnmetNeedExplanationDto {
  date: string;
  shiftTypeId: string;
  skillId: string | null;
  short: number;
  reasons: string[];
}

export interface RequestExplanationDto {
  staffMemberId: string;
  date: string;
  kind: string;
  reasons: string[];
}

export interface SolveExplanationsDto {
  unmetNeeds: UnmetNeedExplanationDto[];
  requestsNotHonoured: RequestExplanationDto[];
  conflicts: { rules: string[]; summary: string } | null;
}

export interface SolveRunResultDto {
  /** Solver status, e.g. optimal, feasible, timeLimit, interrupted, infeasible. */
  solverStatus: string;
  objective: number | null;
  bound: number | null;
  gap: number | null;
  /** One sentence for the manager on how good the roster is. */
  quality: string;
  explanations: SolveExplanationsDto;
  /** Weighted value of each goal of the saved roster. */
  terms: Record<string, number> | null;
  /**
   * Shortfall below minimum cover of the saved roster and the fewest any roster could have with these
   * people, leave and rules (null for runs without a roster, and for runs saved before it existed).
   */
  staffing?: StaffingSafetyDto | null;
  /** The staffing safety in plain words with the usual advice; '' when every minimum is met. */
  staffingStatement?: string;
}

export interface StaffingSafetyDto {
  /** People short of a need's minimum, summed over the needs. */
  peopleShort: number;
  /** Shifts (date and shift type) with any need below its minimum. */
  shiftsShort: number;
  /** Needs with a required skill that have nobody with it. */
  noneOfSkill: number;
  /** Fewest people short any roster can have; null when not proved in time. */
  fewestPossible: number | null;
  /** Whether fewestPossible is proved. */
  proven: boolean;
}

/** What a run does: generate a draft's roster, or repair a published one (fewest changes). */
export const SOLVE_RUN_MODES = ['generate', 'repair'] as const;
export type SolveRunModeName = (typeof SOLVE_RUN_MODES)[number];

export interface SolveRunDto {
  id: string;
  rosterPeriodId: string;
  status: SolveRunStatus;
  /** Stored with the run, so it is known after a restart. */
  mode: SolveRunModeName;
  /** User who started the run (null when that user was deleted). */
  requestedById: string | null;
  timeLimitSeconds: number;
  weights: SolveWeights;
  progress: SolveProgressDto | null;
  result: SolveRunResultDto | null;
  /** Why the run failed, in plain words. */
  errorMessage: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/**
 * A run in the list of a period's runs (GET /roster-periods/:id/solve-runs, newest first, paged):
 * everything but the result, which GET /solve-runs/:id gives.
 */
export type SolveRunSummaryDto = Omit<SolveRunDto, 'result'>;

/**
 * Server-sent events of GET /solve-runs/:id/events (read with fetch and the Authorization header;
 * the stream ends after the `end` event):
 * - `status`: the run as it is when the stream opens;
 * - `progress`: a SolveProgressDto while the solver works;
 * - `end`: the run once it has finished, failed or been cancelled.
 */
export type SolveRunEventName = 'status' | 'progress' | 'end';

// ---------------------------------------------------------------- assignments

/** A finding of the checker on the current roster, in the roster's own dates and ids. */
export interface RosterViolationDto {
  rule: string;
  staffMemberId: string;
  dates: string[];
  message: string;
  /** Set for rest-rule findings: the fatigue caution shown beside the cell. */
  warning: string | null;
}

/** Shown beside any rest-rule violation (PRODUCT.md: overriding a rest rule carries a fatigue risk). */
export const REST_RULE_WARNING =
  'Fatigue risk: this leaves less rest than the contract requires, and tired staff make more mistakes. ' +
  'Local law and collective agreements decide what rest is allowed; check it with the person before you keep it.';

/**
 * Hard rules whose breach by a manual edit needs a written reason (kept in the audit trail): the
 * working-time limits that protect rest and health, and work on a day of leave or unavailability.
 * The other rules (minimum hours and runs, shifts per type, weekends, which a short period scales
 * down to 0) are reported as findings on the board and before publishing, but need no reason.
 */
export const OVERRIDE_REASON_RULES = [
  'minRest',
  'forbiddenSuccession',
  'maxConsecutiveWorkDays',
  'maxConsecutiveNights',
  'maxPaidMinutes',
  'absence',
] as const;

export const OVERRIDE_REASON_MAX_LENGTH = 500;

export interface AssignmentCellDto {
  /** Shift type id, or null for a day off. */
  shiftTypeId: string | null;
  pinned: boolean;
}

export interface AssignmentRowDto {
  staffMemberId: string;
  name: string;
  /** One cell per day of the period, in date order. */
  cells: AssignmentCellDto[];
}

export interface RosterCheckDto {
  violations: RosterViolationDto[];
  terms: Record<string, number>;
  objective: number;
}

export interface AssignmentGridDto {
  rosterPeriodId: string;
  /** The period's dates, "YYYY-MM-DD", in order. */
  dates: string[];
  rows: AssignmentRowDto[];
  check: RosterCheckDto;
}

export interface AssignmentCellRequest {
  staffMemberId: string;
  /** "YYYY-MM-DD", a day of the period. */
  date: string;
  /** Shift type id, or null for a day off. */
  shiftTypeId: string | null;
  /**
   * Why the edit may break a rule of OVERRIDE_REASON_RULES; without it such an edit is refused (422).
   * Kept in the audit trail. An edit whose shifts overlap is refused whatever the reason.
   */
  overrideReason?: string;
}

export type PinCellRequest = Pick<AssignmentCellRequest, 'staffMemberId' | 'date'>;

// ---------------------------------------------------------------- routes

const e = encodeURIComponent;

/** Paths of the solving resources, relative to API_PREFIX. */
export const SOLVING_ROUTES = {
  periodSolveRuns: (periodId: string) => `/roster-periods/${e(periodId)}/solve-runs`,
  solveRun: (id: string) => `/solve-runs/${e(id)}`,
  solveRunEvents: (id: string) => `/solve-runs/${e(id)}/events`,
  solveRunCancel: (id: string) => `/solve-runs/${e(id)}/cancel`,
  assignments: (periodId: string) => `/roster-periods/${e(periodId)}/assignments`,
  assignmentCell: (periodId: string) => `/roster-periods/${e(periodId)}/assignments/cell`,
  assignmentPin: (periodId: string) => `/roster-periods/${e(periodId)}/assignments/pin`,
  assignmentUnpin: (periodId: string) => `/roster-periods/${e(periodId)}/assignments/unpin`,
} as const;
