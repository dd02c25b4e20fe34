import { type ExecutionContext, Injectable, UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator';

/** Global guard: every route needs a valid access token unless marked @Public(). */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  override canActivate(context: ExecutionContext) {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (isPublic) return true;
    return super.canActivate(context);
  }

  override handleRequest<TUser>(err: unknown, user: TUser | false, info: unknown): TUser {
    if (err instanceof UnauthorizedException) throw err;
    if (err || !user) {
      const reason =
        info instanceof Error && info.name === 'TokenExpiredError'
          ? 'Access token expired'
          : info instanceof Error && /No auth token/i.test(info.message)
            ? 'Sign in required'
            : 'Invalid access token';
      throw new UnauthorizedException(reason);
    }
    return user;
  }
}
