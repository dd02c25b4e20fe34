import { Body, Controller, HttpCode, Post, Req, Res, UnauthorizedException, UseGuards } from '@nestjs/common';
import {
  ApiAcceptedResponse,
  ApiBadRequestResponse,
  ApiCookieAuth,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
  ApiTooManyRequestsResponse,
  ApiUnauthorizedResponse,
} from '@nestjs/swagger';
import { API_PREFIX, REFRESH_COOKIE, type TokenResponse } from '@rotaplex/contracts';
import { type CookieOptions, type Request, type Response } from 'express';
import { Public } from '../common/decorators/public.decorator';
import { AppConfig } from '../config/app-config';
import { ApiErrorResponse } from '../common/api-error.dto';
import { AuthThrottlerGuard } from './auth-throttler.guard';
import { TokenResponseDto } from './dto/token-response.dto';
import { AuthService, type SessionTokens } from './auth.service';
import { SignInAddressLimiter } from './sign-in-address-limiter';
import {
  AcceptInvitationDto,
  ConfirmPasswordResetDto,
  LoginDto,
  RequestPasswordResetDto,
} from './dto/auth.dto';

/** The refresh cookie is sent only to the auth routes and never readable by scripts. */
export const REFRESH_COOKIE_PATH = `${API_PREFIX}/auth`;

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly config: AppConfig,
    private readonly addressLimiter: SignInAddressLimiter,
  ) {}

  @Post('login')
  @Public()
  @HttpCode(200)
  @UseGuards(AuthThrottlerGuard)
  @ApiOkResponse({ type: TokenResponseDto, description: 'The refresh token is set as an httpOnly cookie' })
  @ApiUnauthorizedResponse({
    type: ApiErrorResponse,
    description: 'Wrong e-mail or password, or account deactivated',
  })
  @ApiTooManyRequestsResponse({
    type: ApiErrorResponse,
    description:
      'Too many attempts for this e-mail (from this address or from any), or too many failed sign-ins from this address; Retry-After says when to try again',
  })
  async login(
    @Body() body: LoginDto,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ): Promise<TokenResponse> {
    const address = req.ip ?? 'unknown';
    this.addressLimiter.assertAllowed(address, res);
    try {
      return this.answer(res, await this.auth.login(body.email, body.password));
    } catch (err) {
      if (err instanceof UnauthorizedException) this.addressLimiter.recordFailure(address);
      throw err;
    }
  }

  @Post('refresh')
  @Public()
  @HttpCode(200)
  @ApiCookieAuth(REFRESH_COOKIE)
  @ApiOkResponse({ type: TokenResponseDto, description: 'A new access token; the refresh cookie is rotated' })
  @ApiUnauthorizedResponse({
    type: ApiErrorResponse,
    description: 'Missing, expired, revoked or reused refresh token',
  })
  async refresh(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<TokenResponse> {
    try {
      return this.answer(res, await this.auth.refresh(readRefreshCookie(req)));
    } catch (err) {
      res.clearCookie(REFRESH_COOKIE, this.cookieOptions());
      throw err;
    }
  }

  @Post('logout')
  @Public()
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'The refresh token family is revoked and the cookie cleared' })
  async logout(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<void> {
    await this.auth.logout(readRefreshCookie(req));
    res.clearCookie(REFRESH_COOKIE, this.cookieOptions());
  }

  @Post('invitations/accept')
  @Public()
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'Password set; the user can now sign in' })
  @ApiBadRequestResponse({
    type: ApiErrorResponse,
    description: 'Invalid, used or expired link, or a too short password',
  })
  acceptInvitation(@Body() body: AcceptInvitationDto): Promise<void> {
    return this.auth.acceptInvitation(body.token, body.password);
  }

  @Post('password-reset/request')
  @Public()
  @HttpCode(202)
  @UseGuards(AuthThrottlerGuard)
  @ApiAcceptedResponse({ description: 'Always 202: if the account exists, a reset link is e-mailed' })
  requestPasswordReset(@Body() body: RequestPasswordResetDto): Promise<void> {
    return this.auth.requestPasswordReset(body.email);
  }

  @Post('password-reset/confirm')
  @Public()
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'Password changed; every session of the user has ended' })
  confirmPasswordReset(@Body() body: ConfirmPasswordResetDto): Promise<void> {
    return this.auth.confirmPasswordReset(body.token, body.password);
  }

  private answer(res: Response, session: SessionTokens): TokenResponse {
    res.cookie(REFRESH_COOKIE, session.refreshToken, {
      ...this.cookieOptions(),
      expires: session.refreshExpiresAt,
    });
    res.setHeader('Cache-Control', 'no-store');
    return session.body;
  }

  private cookieOptions(): CookieOptions {
    return {
      httpOnly: true,
      sameSite: 'strict',
      secure: this.config.cookieSecure,
      path: REFRESH_COOKIE_PATH,
    };
  }
}

export function readRefreshCookie(req: Request): string | undefined {
  const value = (req.cookies as Record<string, unknown> | undefined)?.[REFRESH_COOKIE];
  return typeof value === 'string' && value.length > 0 ? value : undefined;
}
