/**
 * Request and response shapes shared by the API and the web app.
 * Plain types only: the server validates requests with its own class-validator DTOs that
 * implement these interfaces.
 */
import type { Permission, Role } from './roles';

export interface ApiError {
  statusCode: number;
  /** Short machine-readable reason, e.g. "Bad Request". */
  error: string;
  /** Human-readable messages; validation errors name the field first ("email must be an email"). */
  message: string | string[];
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export interface PageQuery {
  page?: number;
  pageSize?: number;
  sort?: string;
  order?: 'asc' | 'desc';
  q?: string;
}

export interface HealthResponse {
  status: 'ok' | 'error';
  database: 'up' | 'down';
  version: string;
  /**
   * Where solves run: this process's worker pool (`in-process`), or the Redis queue (`redis`,
   * REDIS_URL set) with its state, jobs waiting and running, and solver worker processes connected.
   */
  queue: QueueHealthDto;
}

export type QueueHealthDto =
  | { kind: 'in-process'; state: 'up'; waiting: number; active: number; workers: number }
  | { kind: 'redis'; state: 'up' | 'down'; waiting: number; active: number; workers: number };

export interface LoginRequest {
  email: string;
  password: string;
}

/** Returned by login and refresh. The refresh token travels only in an httpOnly cookie. */
export interface TokenResponse {
  accessToken: string;
  /** Seconds until the access token expires. */
  expiresIn: number;
  user: MeResponse;
}

export interface UserDto {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  unitIds: string[];
  active: boolean;
  /** True once the person has accepted the invitation and set a password. */
  activated: boolean;
  createdAt: string;
}

export interface MeResponse extends UserDto {
  permissions: Permission[];
  organisation: OrganisationDto;
}

export interface InviteUserRequest {
  email: string;
  displayName: string;
  role: Role;
  unitIds: string[];
}

export interface UpdateUserRequest {
  displayName?: string;
  role?: Role;
  unitIds?: string[];
}

export interface AcceptInvitationRequest {
  token: string;
  password: string;
}

export interface RequestPasswordResetRequest {
  email: string;
}

export interface ConfirmPasswordResetRequest {
  token: string;
  password: string;
}

export interface ChangePasswordRequest {
  currentPassword: string;
  newPassword: string;
}

/** Minimum password length (NIST SP 800-63B asks for at least 8 characters). */
export const PASSWORD_MIN_LENGTH = 8;
export const PASSWORD_MAX_LENGTH = 128;

export interface OrganisationDto {
  id: string;
  name: string;
}

export interface UpdateOrganisationRequest {
  name: string;
}

export interface UnitDto {
  id: string;
  name: string;
  /** IANA time zone, e.g. "Europe/London". */
  timeZone: string;
  /** Days before a period starts by which its roster should be published (default 42, six weeks). */
  publishLeadDays: number;
  createdAt: string;
}

export interface CreateUnitRequest {
  name: string;
  timeZone: string;
  /** Days of notice the unit aims to give (0 to PUBLISH_LEAD_DAYS_MAX; default PUBLISH_LEAD_DAYS_DEFAULT). */
  publishLeadDays?: number;
}

/**
 * Publish lead time: many hospitals aim to approve a roster 6 weeks before it starts; late approval
 * drives temporary-staff use (Drake, J Adv Nurs 2018;74(8):1831-38). New South Wales health guidance
 * sets at least 2 weeks (same source). Fair-workweek laws (e.g. Seattle SMC 14.22, Chicago) ask for
 * 14 days. Local law and agreements decide; this is the unit's own aim.
 */
export const PUBLISH_LEAD_DAYS_DEFAULT = 42;
export const PUBLISH_LEAD_DAYS_MAX = 365;

export type UpdateUnitRequest = Partial<CreateUnitRequest>;

export interface MailMessageSummaryDto {
  id: string;
  from: string;
  to: string[];
  subject: string;
  receivedAt: string;
}

export interface MailMessageDto extends MailMessageSummaryDto {
  text: string;
  /** HTML body, if the message had one. Shown sandboxed. */
  html: string | null;
}
