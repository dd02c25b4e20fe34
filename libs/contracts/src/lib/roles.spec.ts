import { hasPermission, isRole, permissionsOf, PERMISSIONS, ROLES, ROLE_PERMISSIONS } from './roles';

describe('roles and permissions', () => {
  it('gives every role only known permissions, without duplicates', () => {
    for (const role of ROLES) {
      const perms = ROLE_PERMISSIONS[role];
      expect(new Set(perms).size).toBe(perms.length);
      for (const p of perms) expect(PERMISSIONS).toContain(p);
    }
  });

  it('keeps staff away from planning, user admin and the mailbox', () => {
    expect(hasPermission('staff', 'rosters:plan')).toBe(false);
    expect(hasPermission('staff', 'users:write')).toBe(false);
    expect(hasPermission('staff', 'mailbox:read')).toBe(false);
    expect(hasPermission('staff', 'requests:own')).toBe(true);
  });

  it('lets managers plan but not administer users or units', () => {
    expect(hasPermission('manager', 'rosters:plan')).toBe(true);
    expect(hasPermission('manager', 'users:write')).toBe(false);
    expect(hasPermission('manager', 'units:write')).toBe(false);
  });

  it('gives admins every administrative permission', () => {
    for (const p of ['organisation:manage', 'units:write', 'users:write', 'mailbox:read'] as const) {
      expect(permissionsOf('admin')).toContain(p);
    }
  });

  it('recognises role names strictly', () => {
    expect(isRole('admin')).toBe(true);
    expect(isRole('Admin')).toBe(false);
    expect(isRole(undefined)).toBe(false);
  });
});
