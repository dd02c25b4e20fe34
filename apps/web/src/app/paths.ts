import { SWAP_DECISION_WEB_PATH, WEB_PATHS } from '@rotaplex/contracts';

/** Every path of the web app. Links and the router use these, never string literals. */
export const PATHS = {
  signIn: '/sign-in',
  acceptInvitation: WEB_PATHS.acceptInvitation,
  resetPassword: WEB_PATHS.resetPassword,
  forgotPassword: '/forgot-password',
  home: '/',
  profile: '/profile',
  myRoster: '/my-roster',
  swaps: '/swaps',
  openShifts: '/open-shifts',
  swapApprovals: '/approvals/swaps',
  myAvailability: '/my-availability',
  myRequests: '/my-requests',
  requests: '/approvals/requests',
  swapDecision: SWAP_DECISION_WEB_PATH,
  users: '/admin/users',
  units: '/admin/units',
  organisation: '/admin/organisation',
  mailbox: '/admin/mailbox',
  mailboxMessage: (id: string) => `/admin/mailbox/${encodeURIComponent(id)}`,
  outbox: '/admin/outbox',
  shiftTypes: '/planning/shift-types',
  skills: '/planning/skills',
  contracts: '/planning/contracts',
  staff: '/planning/staff',
  coverNeeds: '/planning/cover-needs',
  demand: '/planning/demand',
  rosterPeriods: '/planning/periods',
  planningBoard: (periodId: string) => `/planning/periods/${encodeURIComponent(periodId)}/board`,
  periodReports: (periodId: string) => `/planning/periods/${encodeURIComponent(periodId)}/reports`,
  periodAudit: (periodId: string) => `/planning/periods/${encodeURIComponent(periodId)}/audit`,
  demandPlan: (periodId: string) => `/planning/periods/${encodeURIComponent(periodId)}/demand`,
} as const;

/** Route patterns for parameterised paths (the router's side of PATHS). */
export const ROUTE_PATTERNS = {
  mailboxMessage: '/admin/mailbox/:messageId',
  planningBoard: '/planning/periods/:periodId/board',
  periodReports: '/planning/periods/:periodId/reports',
  periodAudit: '/planning/periods/:periodId/audit',
  demandPlan: '/planning/periods/:periodId/demand',
} as const;
