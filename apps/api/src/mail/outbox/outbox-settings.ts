import type { OutboxSettings } from '../../config/app-config';

/**
 * Wait after the n-th failed attempt (n = 1, 2, ...): base, 2 x base, 4 x base, ... capped at the
 * maximum (exponential backoff, common practice for SMTP retries; RFC 5321 §4.5.4.1 asks senders to
 * retry with growing intervals). The settings come from AppConfig (OUTBOX_* variables).
 */
export function backoffDelayMs(
  failedAttempts: number,
  settings: Pick<OutboxSettings, 'baseDelayMs' | 'maxDelayMs'>,
): number {
  const exp = Math.min(Math.max(failedAttempts - 1, 0), 30);
  return Math.min(settings.baseDelayMs * 2 ** exp, settings.maxDelayMs);
}
