import { Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { isRole } from '@rotaplex/contracts';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { type AccessTokenPayload, type AuthUser } from '../common/auth-user';
import { AppConfig } from '../config/app-config';
import { UsersService } from '../users/users.service';

export const JWT_ISSUER = 'rotaplex';
export const JWT_AUDIENCE = 'rotaplex-api';

/**
 * Verifies the bearer token (HS256, issuer, audience, expiry) and then loads the user: a deactivated
 * or deleted user is refused at the next request, and role or unit changes apply at once.
 */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    config: AppConfig,
    private readonly users: UsersService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      secretOrKey: config.jwtSecret!,
      algorithms: ['HS256'],
      issuer: JWT_ISSUER,
      audience: JWT_AUDIENCE,
      ignoreExpiration: false,
    });
  }

  async validate(payload: AccessTokenPayload): Promise<AuthUser> {
    if (typeof payload.sub !== 'string' || !isRole(payload.role))
      throw new UnauthorizedException('Invalid access token');
    const user = await this.users.findActiveAuthUser(payload.sub);
    if (!user) throw new UnauthorizedException('This account is deactivated or no longer exists');
    return user;
  }
}
