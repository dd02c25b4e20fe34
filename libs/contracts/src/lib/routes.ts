/** Every HTTP path of the API, relative to API_PREFIX. Used by the server, the web client and tests. */
export const API_PREFIX = '/api';

export const API_ROUTES = {
  health: '/health',
  docs: '/docs',
  auth: {
    login: '/auth/login',
    refresh: '/auth/refresh',
    logout: '/auth/logout',
    acceptInvitation: '/auth/invitations/accept',
    requestPasswordReset: '/auth/password-reset/request',
    confirmPasswordReset: '/auth/password-reset/confirm',
  },
  me: '/me',
  mePassword: '/me/password',
  users: '/users',
  user: (id: string) => `/users/${encodeURIComponent(id)}`,
  userDeactivate: (id: string) => `/users/${encodeURIComponent(id)}/deactivate`,
  userReactivate: (id: string) => `/users/${encodeURIComponent(id)}/reactivate`,
  userResendInvitation: (id: string) => `/users/${encodeURIComponent(id)}/invitation`,
  organisation: '/organisation',
  units: '/units',
  unit: (id: string) => `/units/${encodeURIComponent(id)}`,
  mailbox: '/mailbox',
  mailboxMessage: (id: string) => `/mailbox/${encodeURIComponent(id)}`,
} as const;

/** Name of the httpOnly cookie that carries the refresh token (path-limited to the auth routes). */
export const REFRESH_COOKIE = 'rotaplex_refresh';

/** Web paths that e-mails link to (the web app defines the same in its router). */
export const WEB_PATHS = {
  acceptInvitation: '/accept-invitation',
  resetPassword: '/reset-password',
} as const;
