import { Injectable } from '@nestjs/common';
import { ThrottlerGuard } from '@nestjs/throttler';

/**
 * Rate limit for sign-in and password-reset requests: LOGIN_RATE_LIMIT attempts per minute for each
 * pair of client address and e-mail, so password guessing against one account is slowed down
 * without locking out other people who share the same address.
 */
@Injectable()
export class AuthThrottlerGuard extends ThrottlerGuard {
  protected override async getTracker(req: Record<string, unknown>): Promise<string> {
    const body = req['body'] as { email?: unknown } | undefined;
    const email = typeof body?.email === 'string' ? body.email.trim().toLowerCase() : '';
    return `${String(req['ip'] ?? 'unknown')}|${email}`;
  }
}
