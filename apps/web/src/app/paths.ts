import { WEB_PATHS } from '@rotaplex/contracts';

/** Every path of the web app. Links and the router use these, never string literals. */
export const PATHS = {
  signIn: '/sign-in',
  acceptInvitation: WEB_PATHS.acceptInvitation,
  resetPassword: WEB_PATHS.resetPassword,
  forgotPassword: '/forgot-password',
  home: '/',
  profile: '/profile',
  users: '/admin/users',
  units: '/admin/units',
  organisation: '/admin/organisation',
  mailbox: '/admin/mailbox',
  mailboxMessage: (id: string) => `/admin/mailbox/${encodeURIComponent(id)}`,
  shiftTypes: '/planning/shift-types',
  skills: '/planning/skills',
  contracts: '/planning/contracts',
  staff: '/planning/staff',
  coverNeeds: '/planning/cover-needs',
  rosterPeriods: '/planning/periods',
  planningBoard: (periodId: string) => `/planning/periods/${encodeURIComponent(periodId)}/board`,
} as const;

/** Route patterns for parameterised paths (the router's side of PATHS). */
export const ROUTE_PATTERNS = {
  mailboxMessage: '/admin/mailbox/:messageId',
  planningBoard: '/planning/periods/:periodId/board',
} as const;
