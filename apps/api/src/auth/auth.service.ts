import { BadRequestException, Injectable, Logger, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import { type MeResponse, permissionsOf, type TokenResponse, WEB_PATHS } from '@rotaplex/contracts';
import { DataSource } from 'typeorm';
import { type AccessTokenPayload, type AuthUser } from '../common/auth-user';
import { AppConfig } from '../config/app-config';
import { MailService } from '../mail/mail.service';
import { passwordResetMail } from '../mail/templates';
import { OrganisationService } from '../organisation/organisation.service';
import { toUserDto, UsersService } from '../users/users.service';
import { type UserEntity } from '../users/user.entity';
import { OneTimeTokensService } from '../users/credentials/one-time-tokens.service';
import { PasswordService } from '../users/credentials/password.service';
import { RefreshTokensService } from '../users/credentials/refresh-tokens.service';

/** What the controller needs to answer a sign-in or refresh: the body and the new refresh cookie. */
export interface SessionTokens {
  body: TokenResponse;
  refreshToken: string;
  refreshExpiresAt: Date;
}

@Injectable()
export class AuthService {
  private readonly logger = new Logger(AuthService.name);

  constructor(
    private readonly config: AppConfig,
    private readonly dataSource: DataSource,
    private readonly users: UsersService,
    private readonly passwords: PasswordService,
    private readonly refreshTokens: RefreshTokensService,
    private readonly oneTimeTokens: OneTimeTokensService,
    private readonly organisation: OrganisationService,
    private readonly jwt: JwtService,
    private readonly mail: MailService,
  ) {}

  async login(email: string, password: string): Promise<SessionTokens> {
    const user = await this.users.byEmail(email, true);
    const ok =
      user?.passwordHash != null
        ? await this.passwords.verify(user.passwordHash, password)
        : await this.passwords.verifyNothing(password);
    if (!user || !ok) throw new UnauthorizedException('Wrong e-mail or password');
    if (!user.active) throw new UnauthorizedException('This account is deactivated');
    const refresh = await this.refreshTokens.issue(user.id);
    return this.session(user, refresh.token, refresh.expiresAt);
  }

  async refresh(token: string | undefined): Promise<SessionTokens> {
    if (!token) throw new UnauthorizedException('No refresh token');
    const next = await this.refreshTokens.rotate(token, async (userId) => this.users.isActive(userId));
    const user = await this.users.withUnitsOrFail(next.userId);
    return this.session(user, next.token, next.expiresAt);
  }

  async logout(token: string | undefined): Promise<void> {
    if (token) await this.refreshTokens.revokeByToken(token);
  }

  async me(caller: AuthUser): Promise<MeResponse> {
    const user = await this.users.withUnitsOrFail(caller.id);
    return this.toMe(user);
  }

  /** Changes the caller's password and ends their other sessions (the current one stays signed in). */
  async changePassword(
    caller: AuthUser,
    current: string,
    next: string,
    refreshCookie: string | undefined,
  ): Promise<void> {
    const user = await this.users.byIdOrFail(caller.id);
    if (!user.passwordHash || !(await this.passwords.verify(user.passwordHash, current))) {
      // 400, not 401: the caller is signed in; the field is wrong.
      throw new BadRequestException('currentPassword is not your current password');
    }
    const hash = await this.passwords.hash(next);
    const keep = await this.refreshTokens.familyOf(refreshCookie);
    await this.users.setPasswordHash(user.id, hash);
    await this.refreshTokens.revokeAllForUser(user.id, keep);
  }

  /** Sets the first password from an invitation link (single use). */
  async acceptInvitation(token: string, password: string): Promise<void> {
    const hash = await this.passwords.hash(password);
    await this.dataSource.transaction(async (em) => {
      const userId = await this.oneTimeTokens.consume(em, token, 'invitation');
      const user = await this.users.byIdOrFail(userId, em);
      if (!user.active) throw new UnauthorizedException('This account is deactivated');
      await this.users.setPasswordHash(userId, hash, em);
    });
  }

  /** Always succeeds from the caller's point of view: whether the e-mail exists is not revealed. */
  async requestPasswordReset(email: string): Promise<void> {
    const user = await this.users.byEmail(email);
    if (!user || !user.active) return;
    const token = await this.dataSource.transaction((em) =>
      this.oneTimeTokens.create(em, user.id, 'password-reset'),
    );
    const link = `${this.config.publicUrl}${WEB_PATHS.resetPassword}?token=${encodeURIComponent(token)}`;
    const content = passwordResetMail({
      displayName: user.displayName,
      link,
      validMinutes: Math.round(this.oneTimeTokens.ttlSeconds('password-reset') / 60),
    });
    try {
      await this.mail.send({ to: user.email, ...content });
    } catch (err) {
      // Not reported to the caller (that would reveal the account exists).
      this.logger.error(`Password reset e-mail to ${user.email} failed: ${(err as Error).message}`);
    }
  }

  /** Sets a new password from a reset link (single use) and ends every session of the user. */
  async confirmPasswordReset(token: string, password: string): Promise<void> {
    const hash = await this.passwords.hash(password);
    const userId = await this.dataSource.transaction(async (em) => {
      const id = await this.oneTimeTokens.consume(em, token, 'password-reset');
      const user = await this.users.byIdOrFail(id, em);
      if (!user.active) throw new UnauthorizedException('This account is deactivated');
      await this.users.setPasswordHash(id, hash, em);
      return id;
    });
    await this.refreshTokens.revokeAllForUser(userId);
  }

  private async session(
    user: UserEntity,
    refreshToken: string,
    refreshExpiresAt: Date,
  ): Promise<SessionTokens> {
    const payload: AccessTokenPayload = { sub: user.id, role: user.role };
    const accessToken = await this.jwt.signAsync(payload);
    return {
      body: { accessToken, expiresIn: this.config.jwtAccessTtl, user: await this.toMe(user) },
      refreshToken,
      refreshExpiresAt,
    };
  }

  private async toMe(user: UserEntity): Promise<MeResponse> {
    return {
      ...toUserDto(user),
      permissions: [...permissionsOf(user.role)],
      organisation: await this.organisation.get(user.organisationId),
    };
  }
}
