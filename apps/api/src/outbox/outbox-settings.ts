/** Delivery settings of the outbox, read from the environment once at start. */
export interface OutboxSettings {
  /** Attempts before a message is marked failed (OUTBOX_MAX_ATTEMPTS, default 8). */
  maxAttempts: number;
  /** Delay before the first retry; doubled after each failure (OUTBOX_BASE_DELAY_MS, default 5000). */
  baseDelayMs: number;
  /** Longest delay between two attempts (OUTBOX_MAX_DELAY_MS, default 15 minutes). */
  maxDelayMs: number;
}

type Env = Record<string, string | undefined>;

export class OutboxSettingsError extends Error {}

/** Parses OUTBOX_MAX_ATTEMPTS, OUTBOX_BASE_DELAY_MS and OUTBOX_MAX_DELAY_MS; throws naming a bad one. */
export function outboxSettings(env: Env = process.env): OutboxSettings {
  const int = (name: string, fallback: number, min: number, max: number): number => {
    const raw = env[name]?.trim();
    if (raw === undefined || raw === '') return fallback;
    if (!/^\d+$/.test(raw) || Number(raw) < min || Number(raw) > max) {
      throw new OutboxSettingsError(`${name} must be a whole number from ${min} to ${max} (got "${raw}")`);
    }
    return Number(raw);
  };
  const maxAttempts = int('OUTBOX_MAX_ATTEMPTS', 8, 1, 100);
  const baseDelayMs = int('OUTBOX_BASE_DELAY_MS', 5000, 1, 3_600_000);
  const maxDelayMs = int('OUTBOX_MAX_DELAY_MS', 15 * 60_000, 1, 24 * 3_600_000);
  return { maxAttempts, baseDelayMs, maxDelayMs: Math.max(maxDelayMs, baseDelayMs) };
}

/**
 * Wait after the n-th failed attempt (n = 1, 2, ...): base, 2 x base, 4 x base, ... capped at the
 * maximum (exponential backoff, common practice for SMTP retries; RFC 5321 §4.5.4.1 asks senders to
 * retry with growing intervals).
 */
export function backoffDelayMs(failedAttempts: number, settings: OutboxSettings): number {
  const exp = Math.min(Math.max(failedAttempts - 1, 0), 30);
  return Math.min(settings.baseDelayMs * 2 ** exp, settings.maxDelayMs);
}
