import { ForbiddenException } from '@nestjs/common';
import { isUnitScoped } from '@rotaplex/contracts';
import { type AuthUser } from './auth-user';

/**
 * Unit limits. Admins see the whole organisation; managers and staff only the units they belong to
 * (staff additionally only themselves where personal data is concerned).
 * Returns null for "every unit".
 */
export function visibleUnitIds(user: AuthUser): string[] | null {
  return isUnitScoped(user.role) ? user.unitIds : null;
}

export function canAccessUnit(user: AuthUser, unitId: string): boolean {
  const visible = visibleUnitIds(user);
  return visible === null || visible.includes(unitId);
}

export function assertUnitAccess(user: AuthUser, unitId: string): void {
  if (!canAccessUnit(user, unitId)) throw new ForbiddenException('You do not have access to this unit');
}

/** Whether the caller may see another user who belongs to `unitIds`. */
export function canSeeUser(caller: AuthUser, target: { id: string; unitIds: string[] }): boolean {
  if (caller.id === target.id) return true;
  if (caller.role === 'admin') return true;
  if (caller.role === 'manager') return target.unitIds.some((u) => caller.unitIds.includes(u));
  return false;
}
