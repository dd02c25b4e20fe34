import { HttpException, HttpStatus, Injectable } from '@nestjs/common';
import { type Response } from 'express';
import { AppConfig } from '../config/app-config';

const WINDOW_MS = 60_000;
/** Addresses remembered at most; beyond it the oldest entries go first (bounded memory under a flood). */
const MAX_ADDRESSES = 50_000;

/**
 * Failed sign-ins per client address: 4 × LOGIN_RATE_LIMIT a minute, whatever the e-mail, so one
 * address trying a few common passwords against many accounts (password spraying) is slowed.
 * Successful sign-ins do not count: many people behind one office address can all sign in.
 * In memory, per process, like the other sign-in limits.
 */
@Injectable()
export class SignInAddressLimiter {
  private readonly failures = new Map<string, number[]>();
  readonly limit: number;

  constructor(config: AppConfig) {
    this.limit = 4 * config.loginRateLimit;
  }

  /** Throws 429 with Retry-After (seconds) when the address has used up its failed sign-ins. */
  assertAllowed(address: string, res: Response, now = Date.now()): void {
    const recent = this.recent(address, now);
    if (recent.length < this.limit) return;
    const retryAfter = Math.max(1, Math.ceil((recent[0] + WINDOW_MS - now) / 1000));
    res.setHeader('Retry-After', String(retryAfter));
    throw new HttpException(
      `Too many failed sign-ins from this address: try again in ${retryAfter} seconds`,
      HttpStatus.TOO_MANY_REQUESTS,
    );
  }

  recordFailure(address: string, now = Date.now()): void {
    const recent = this.recent(address, now);
    recent.push(now);
    this.failures.delete(address); // re-insert: the map stays ordered by last failure
    this.failures.set(address, recent);
    if (this.failures.size > MAX_ADDRESSES) {
      this.failures.delete(this.failures.keys().next().value as string);
    }
  }

  private recent(address: string, now: number): number[] {
    const all = this.failures.get(address) ?? [];
    const recent = all.filter((t) => t > now - WINDOW_MS);
    if (recent.length === 0) this.failures.delete(address);
    return recent;
  }
}
