/**
 * Roles and permissions. One table, read by the server guards and by the web navigation,
 * so the two can never disagree about who may do what.
 */
export const ROLES = ['admin', 'manager', 'staff'] as const;
export type Role = (typeof ROLES)[number];

export const PERMISSIONS = [
  /** Read and change the organisation (name) and every unit. */
  'organisation:manage',
  /** Read the units the caller may see (all for admins, own for others). */
  'units:read',
  /** Create, rename and re-zone units. */
  'units:write',
  /** Read users (admins: all; managers: people in their units). */
  'users:read',
  /** Invite, change role or units of, and deactivate users. */
  'users:write',
  /** Read the local mail catcher's mailbox and the outbox. */
  'mailbox:read',
  /** Plan rosters of own units: shift types, needs, contracts, generate, publish, repair. */
  'rosters:plan',
  /** Read published rosters of own units. */
  'rosters:read',
  /** Enter own availability, requests and leave; propose and accept swaps. */
  'requests:own',
  /** Approve or decline leave, swaps and open-shift claims in own units. */
  'requests:approve',
  /** Read reports of own units. */
  'reports:read',
] as const;
export type Permission = (typeof PERMISSIONS)[number];

export const ROLE_PERMISSIONS: Readonly<Record<Role, readonly Permission[]>> = {
  admin: [
    'organisation:manage',
    'units:read',
    'units:write',
    'users:read',
    'users:write',
    'mailbox:read',
    'rosters:plan',
    'rosters:read',
    'requests:approve',
    'reports:read',
  ],
  manager: ['units:read', 'users:read', 'rosters:plan', 'rosters:read', 'requests:approve', 'reports:read'],
  staff: ['units:read', 'rosters:read', 'requests:own'],
};

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

export function hasPermission(role: Role, permission: Permission): boolean {
  return ROLE_PERMISSIONS[role].includes(permission);
}

export function permissionsOf(role: Role): readonly Permission[] {
  return ROLE_PERMISSIONS[role];
}

/** Whether the role is scoped to units (managers and staff) rather than the whole organisation. */
export function isUnitScoped(role: Role): boolean {
  return role !== 'admin';
}
