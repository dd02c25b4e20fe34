import { ForbiddenException, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { type AuthUser } from '../auth-user';
import { Authenticated, RequirePermissions } from '../decorators/access.decorator';
import { Public } from '../decorators/public.decorator';
import { PermissionsGuard } from './permissions.guard';

class Routes {
  @Public() open() {}
  @Authenticated() signedIn() {}
  @RequirePermissions('users:write') writeUsers() {}
  @RequirePermissions('units:read', 'reports:read') twoPermissions() {}
  forgotten() {}
}

const user = (role: AuthUser['role']): AuthUser => ({
  id: 'u',
  email: 'u@example.com',
  displayName: 'U',
  role,
  organisationId: 'o',
  unitIds: [],
});

/** A real handler and class with their real metadata, and a request carrying `caller`. */
function context(handler: keyof Routes, caller?: AuthUser): ExecutionContext {
  return {
    getHandler: () => Routes.prototype[handler],
    getClass: () => Routes,
    switchToHttp: () => ({ getRequest: () => ({ user: caller }) }),
  } as unknown as ExecutionContext;
}

describe('PermissionsGuard (checks ROLE_PERMISSIONS from contracts)', () => {
  const guard = new PermissionsGuard(new Reflector());

  it('lets public routes through without a user', () => {
    expect(guard.canActivate(context('open'))).toBe(true);
  });

  it('fails closed: a route without an access rule is refused even to an admin', () => {
    expect(() => guard.canActivate(context('forgotten', user('admin')))).toThrow(/no access rule/);
  });

  it('Authenticated admits every role', () => {
    for (const role of ['admin', 'manager', 'staff'] as const) {
      expect(guard.canActivate(context('signedIn', user(role)))).toBe(true);
    }
  });

  it('RequirePermissions admits only roles holding every permission', () => {
    expect(guard.canActivate(context('writeUsers', user('admin')))).toBe(true);
    expect(() => guard.canActivate(context('writeUsers', user('manager')))).toThrow(ForbiddenException);
    expect(guard.canActivate(context('twoPermissions', user('manager')))).toBe(true);
    expect(() => guard.canActivate(context('twoPermissions', user('staff')))).toThrow(/reports:read/);
  });
});
