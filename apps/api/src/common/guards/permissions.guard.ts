import { type CanActivate, type ExecutionContext, ForbiddenException, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { hasPermission } from '@rotaplex/contracts';
import { type Request } from 'express';
import { type AuthUser } from '../auth-user';
import { ACCESS_KEY, type AccessRule } from '../decorators/access.decorator';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator';

/**
 * Global guard after the JWT guard: checks the route's access rule against the caller's role.
 * Fails closed: a non-public route without an access rule is refused for everyone.
 */
@Injectable()
export class PermissionsGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, targets)) return true;
    const rule = this.reflector.getAllAndOverride<AccessRule | undefined>(ACCESS_KEY, targets);
    if (!rule) throw new ForbiddenException('This route has no access rule');
    const user = context.switchToHttp().getRequest<Request & { user?: AuthUser }>().user;
    if (!user) throw new ForbiddenException();
    const missing = rule.permissions.filter((p) => !hasPermission(user.role, p));
    if (missing.length)
      throw new ForbiddenException(`Your role (${user.role}) may not do this: needs ${missing.join(', ')}`);
    return true;
  }
}
