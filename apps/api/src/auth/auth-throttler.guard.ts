import { type ExecutionContext, Injectable } from '@nestjs/common';
import { ThrottlerGuard, type ThrottlerLimitDetail, type ThrottlerOptions } from '@nestjs/throttler';
import { type Response } from 'express';

type Req = Record<string, unknown>;

const emailOf = (req: Req): string => {
  const body = req['body'] as { email?: unknown } | undefined;
  return typeof body?.email === 'string' ? body.email.trim().toLowerCase() : '';
};
const addressOf = (req: Req): string => String(req['ip'] ?? 'unknown');

/**
 * Rate limits for sign-in and password-reset requests, each per minute (LOGIN_RATE_LIMIT = n):
 *
 * - `auth`: n attempts for each pair of client address and e-mail, so guessing one account's
 *   password from one address is slowed without locking out other people on that address;
 * - `account`: 2n attempts for one e-mail from any number of addresses (guessing spread over many
 *   machines).
 *
 * Failed sign-ins per address, whatever the e-mail, are limited by SignInAddressLimiter. A refused
 * attempt answers 429 with Retry-After (seconds until the limit that refused it resets).
 */
export function authThrottlers(loginRateLimit: number): ThrottlerOptions[] {
  return [
    {
      name: 'auth',
      ttl: 60_000,
      limit: loginRateLimit,
      getTracker: (req) => `${addressOf(req)}|${emailOf(req)}`,
    },
    { name: 'account', ttl: 60_000, limit: 2 * loginRateLimit, getTracker: (req) => emailOf(req) },
  ];
}

@Injectable()
export class AuthThrottlerGuard extends ThrottlerGuard {
  protected override async throwThrottlingException(
    context: ExecutionContext,
    detail: ThrottlerLimitDetail,
  ): Promise<void> {
    const res = context.switchToHttp().getResponse<Response>();
    res.setHeader('Retry-After', String(Math.max(1, detail.timeToBlockExpire)));
    return super.throwThrottlingException(context, detail);
  }
}
