import { HttpException } from '@nestjs/common';
import { type Response } from 'express';
import { type AppConfig } from '../config/app-config';
import { SignInAddressLimiter } from './sign-in-address-limiter';

/** Collects the headers the limiter sets (an Express response carries many more). */
function response(): Response & { headers: Record<string, string> } {
  const headers: Record<string, string> = {};
  return { headers, setHeader: (k: string, v: string) => (headers[k] = v) } as never;
}

describe('SignInAddressLimiter', () => {
  const limiter = () => new SignInAddressLimiter({ loginRateLimit: 2 } as AppConfig); // 8 failures a minute

  it('refuses an address after 4 × LOGIN_RATE_LIMIT failures in a minute, with Retry-After', () => {
    const l = limiter();
    const t0 = 1_000_000;
    for (let i = 0; i < 8; i++) {
      l.assertAllowed('198.51.100.1', response(), t0 + i * 1000);
      l.recordFailure('198.51.100.1', t0 + i * 1000);
    }
    const res = response();
    let error: unknown;
    try {
      l.assertAllowed('198.51.100.1', res, t0 + 10_000);
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(HttpException);
    expect((error as HttpException).getStatus()).toBe(429);
    expect(res.headers['Retry-After']).toBe('50'); // the first failure leaves the window at t0 + 60 s
    expect(() => l.assertAllowed('198.51.100.2', response(), t0 + 10_000)).not.toThrow();
    // a minute after the first failure, one more attempt is allowed again
    expect(() => l.assertAllowed('198.51.100.1', response(), t0 + 60_001)).not.toThrow();
  });
});
