/**
 * Publishing: the e-mail outbox (every message the product sends, with retries), publishing and
 * repairing a roster period, and the audit trail of changes to published rosters. Plain types
 * shared by the API and the web app.
 */

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

export const AUDIT_KINDS = ['publish', 'repair', 'swap', 'open-shift-claim', 'manual-edit'] as const;
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
}

export interface PublishResultDto {
  rosterPeriodId: string;
  status: 'published';
  publishedAt: string;
  version: number;
  /** People e-mailed their shifts (queued in the outbox). */
  emailed: number;
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
  repair: (periodId: string) => `/roster-periods/${e(periodId)}/repair`,
  audit: (periodId: string) => `/roster-periods/${e(periodId)}/audit`,
  export: (periodId: string) => `/roster-periods/${e(periodId)}/export`,
} as const;
