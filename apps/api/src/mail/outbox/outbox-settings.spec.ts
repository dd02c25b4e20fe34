import { ConfigValidationError, loadConfig } from '../../config/app-config';
import { backoffDelayMs } from './outbox-settings';

describe('outbox settings and backoff', () => {
  it('doubles the delay after each failure and caps it (binary exponential backoff, common practice; RFC 5321 §4.5.4.1 asks for growing retry intervals)', () => {
    const s = { maxAttempts: 8, baseDelayMs: 5000, maxDelayMs: 60_000 };
    expect([1, 2, 3, 4, 5, 6].map((n) => backoffDelayMs(n, s))).toEqual([
      5000, 10_000, 20_000, 40_000, 60_000, 60_000,
    ]);
  });

  it('reads the OUTBOX_* variables with the other settings and names a bad one', () => {
    expect(loadConfig({}).outbox).toEqual({
      maxAttempts: 8,
      baseDelayMs: 5000,
      maxDelayMs: 900_000,
      retentionSeconds: 30 * 86_400,
    });
    expect(loadConfig({ OUTBOX_RETENTION: '7d' }).outbox.retentionSeconds).toBe(7 * 86_400);
    expect(() => loadConfig({ OUTBOX_RETENTION: 'forever' })).toThrow(/OUTBOX_RETENTION/);
    expect(() => loadConfig({ OUTBOX_RETENTION: '0' })).toThrow(/OUTBOX_RETENTION/);
    expect(loadConfig({ OUTBOX_MAX_ATTEMPTS: '3', OUTBOX_BASE_DELAY_MS: '50' }).outbox).toMatchObject({
      maxAttempts: 3,
      baseDelayMs: 50,
    });
    // The longest delay is never shorter than the first one.
    expect(loadConfig({ OUTBOX_BASE_DELAY_MS: '9000', OUTBOX_MAX_DELAY_MS: '10' }).outbox.maxDelayMs).toBe(
      9000,
    );
    expect(() => loadConfig({ OUTBOX_MAX_ATTEMPTS: 'lots' })).toThrow(ConfigValidationError);
    expect(() => loadConfig({ OUTBOX_MAX_ATTEMPTS: 'lots' })).toThrow(/OUTBOX_MAX_ATTEMPTS/);
    expect(() => loadConfig({ OUTBOX_BASE_DELAY_MS: '0' })).toThrow(/OUTBOX_BASE_DELAY_MS/);
  });
});
