/**
 * Publishing: the e-mail outbox (every message the product sends, with retries), publishing and
 * repairing a roster period, and the audit trail of changes to published rosters. Plain types
 * shared by the API and the web app.
 */
import type { RedFlagDto } from './safe-staffing';
import type { RosterViolationDto } from './solving';

// ---------------------------------------------------------------- outbox

/**
 * pending: waiting for its next attempt; sending: claimed by the delivery loop (sent at most once);
 * sent: accepted by the SMTP server; failed: given up after the last attempt (an admin may retry).
 */
export const OUTBOX_STATUSES = ['pending', 'sending', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];

export interface OutboxMessageDto {
  id: string;
  to: string;
  subject: string;
  status: OutboxStatus;
  attempts: number;
  nextAttemptAt: string | null;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
}

// ---------------------------------------------------------------- audit

export const AUDIT_KINDS = [
  'publish',
  'repair',
  'swap',
  'open-shift-claim',
  'manual-edit',
  'open-shift-outside',
] as const;
export type AuditKind = (typeof AUDIT_KINDS)[number];

export interface AuditEntryDto {
  id: string;
  rosterPeriodId: string;
  actorUserId: string | null;
  actorName: string;
  kind: AuditKind;
  at: string;
  summary: string;
  before: unknown;
  after: unknown;
}

// ---------------------------------------------------------------- publish and repair

export interface PublishRequest {
  /** The period's version as last read (optimistic lock). */
  version: number;
  /**
   * Required (true) when any shift is below its minimum cover (red flags of safe staffing among
   * them); then `reason` is required too.
   */
  acknowledgeBelowMinimum?: boolean;
  /** Why the roster is published below minimum cover; kept in the audit entry of the publish. */
  reason?: string;
}

export const PUBLISH_REASON_MAX_LENGTH = 500;

/** A shift of the roster below its minimum cover (one cover need: date, shift type, skill). */
export interface BelowMinimumShiftDto {
  date: string;
  shiftTypeId: string;
  shiftCode: string;
  shiftName: string;
  /** Skill the counted people must have, or null for anyone. */
  skillId: string | null;
  skillCode: string | null;
  min: number;
  /** People on the shift who count towards the need. */
  onShift: number;
  /** Nobody of the required skill (or nobody at all) is on the shift: the most serious case. */
  none: boolean;
  /** Why it is short, in plain words (from the roster model's explanations). */
  reasons: string[];
}

/** A shift on a day of approved leave. */
export interface UnhonouredLeaveDto {
  staffMemberId: string;
  name: string;
  date: string;
  shiftTypeId: string;
  shiftCode: string;
}

/**
 * What a manager should see before publishing: shifts below minimum cover (worst first: none of the
 * required skill, then the largest shortfall), the checker's rule findings, approved leave the
 * roster does not honour, and cautions on the settings it uses.
 */
export interface PublishCheckDto {
  rosterPeriodId: string;
  /** The period's version the check was made on (send it with the publish). */
  version: number;
  /** Worked shifts on the roster (0: nothing to publish). */
  shifts: number;
  people: number;
  /**
   * Red flags of safe staffing on shifts needing a registered skill (NICE SG1 2014; see
   * safe-staffing.ts), by date: shown first. Each is also below minimum cover.
   */
  redFlags: RedFlagDto[];
  belowMinimum: BelowMinimumShiftDto[];
  ruleFindings: RosterViolationDto[];
  unhonouredLeave: UnhonouredLeaveDto[];
  /**
   * Less notice than the unit's publish lead time: the caution in words (days of notice, the unit's
   * lead time, what late rosters cost, and that local law decides on notice windows); null when the
   * roster goes out in time.
   */
  lateNotice: string | null;
  /** Settings the roster uses beyond the guard rails (contracts outside the presets, long shifts). */
  cautions: string[];
  /** Why it cannot be published at all (an empty roster, not a draft); empty when it can. */
  blockers: string[];
  /** Publishing needs acknowledgeBelowMinimum and a reason. */
  needsAcknowledgement: boolean;
}

export interface PublishResultDto {
  rosterPeriodId: string;
  status: 'published';
  publishedAt: string;
  version: number;
  /** People e-mailed their shifts (queued in the outbox). */
  emailed: number;
}

/** What changed the cells of a period: each change raises the period's version by one. */
export const ROSTER_CHANGE_KINDS = [
  'edit',
  'pin',
  'unpin',
  'generate',
  'repair',
  'swap',
  'open-shift-claim',
] as const;
export type RosterChangeKind = (typeof ROSTER_CHANGE_KINDS)[number];

/** One change of a period's cells: the version it made, what, how many cells, by whom, when. */
export interface RosterPeriodChangeDto {
  version: number;
  kind: RosterChangeKind;
  /** Cells whose shift or pin changed. */
  cells: number;
  /** The user's name at the time; "Rotaplex (system)" when nobody asked for it. */
  actorName: string;
  at: string;
}

/** The body of a 409 from publish when the version sent is not the period's current one. */
export interface StaleVersionDto {
  statusCode: 409;
  error: 'Conflict';
  message: string;
  /** The period's current version (publish with it after checking the roster again). */
  version: number;
  /** The cell changes since the version sent, oldest first (changes of settings are not listed). */
  changes: RosterPeriodChangeDto[];
}

export const REPAIR_TIME_LIMIT_MIN_SECONDS = 1;
export const REPAIR_TIME_LIMIT_MAX_SECONDS = 600;

export interface RepairRequest {
  timeLimitSeconds: number;
}

/** One changed cell of a roster: the shift type id before and after (null: day off). */
export interface RosterCellChangeDto {
  staffMemberId: string;
  date: string;
  before: string | null;
  after: string | null;
}

const e = encodeURIComponent;

/** API paths of publishing, repair, audit and the outbox (relative to API_PREFIX). */
export const PUBLISHING_ROUTES = {
  outbox: '/outbox',
  outboxRetry: (id: string) => `/outbox/${e(id)}/retry`,
  publish: (periodId: string) => `/roster-periods/${e(periodId)}/publish`,
  publishCheck: (periodId: string) => `/roster-periods/${e(periodId)}/publish-check`,
  repair: (periodId: string) => `/roster-periods/${e(periodId)}/repair`,
  audit: (periodId: string) => `/roster-periods/${e(periodId)}/audit`,
  export: (periodId: string) => `/roster-periods/${e(periodId)}/export`,
} as const;
