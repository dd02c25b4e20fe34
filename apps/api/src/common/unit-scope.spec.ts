import { ForbiddenException } from '@nestjs/common';
import { type AuthUser } from './auth-user';
import { assertUnitAccess, canAccessUnit, canSeeUser, visibleUnitIds } from './unit-scope';

const user = (role: AuthUser['role'], unitIds: string[], id = `${role}-1`): AuthUser => ({
  id,
  email: `${id}@example.com`,
  displayName: id,
  role,
  organisationId: 'org',
  unitIds,
});

describe('unit limits (PRODUCT.md: a manager sees only the units they manage; staff see themselves)', () => {
  it('admins see every unit, others only their own', () => {
    expect(visibleUnitIds(user('admin', []))).toBeNull();
    expect(visibleUnitIds(user('manager', ['a']))).toEqual(['a']);
    expect(canAccessUnit(user('admin', []), 'z')).toBe(true);
    expect(canAccessUnit(user('manager', ['a']), 'b')).toBe(false);
    expect(canAccessUnit(user('staff', ['a']), 'a')).toBe(true);
    expect(() => assertUnitAccess(user('staff', ['a']), 'b')).toThrow(ForbiddenException);
  });

  it('managers see people sharing a unit; staff only themselves', () => {
    const mgr = user('manager', ['a', 'b']);
    expect(canSeeUser(mgr, { id: 'x', unitIds: ['b'] })).toBe(true);
    expect(canSeeUser(mgr, { id: 'x', unitIds: ['c'] })).toBe(false);
    expect(canSeeUser(mgr, { id: 'x', unitIds: [] })).toBe(false);
    const staff = user('staff', ['a']);
    expect(canSeeUser(staff, { id: 'colleague', unitIds: ['a'] })).toBe(false);
    expect(canSeeUser(staff, { id: staff.id, unitIds: ['a'] })).toBe(true);
    expect(canSeeUser(user('admin', []), { id: 'x', unitIds: ['q'] })).toBe(true);
  });
});
