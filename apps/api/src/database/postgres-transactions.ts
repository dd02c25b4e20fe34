import { setTimeout as sleep } from 'node:timers/promises';
import { type DataSource, QueryFailedError } from 'typeorm';

/** SQLSTATE codes after which a transaction may simply run again: serialization failure, deadlock. */
export const RETRYABLE_SQLSTATES = new Set(['40001', '40P01']);

/** Attempts of one transaction before its serialization failure goes to the caller. */
export const SERIALIZABLE_ATTEMPTS = 8;

export function isRetryableConflict(err: unknown): boolean {
  const code =
    err instanceof QueryFailedError ? (err.driverError as { code?: string } | undefined)?.code : undefined;
  return code !== undefined && RETRYABLE_SQLSTATES.has(code);
}

/**
 * PostgreSQL's stand-in for SQLite's single writer. On SQLite one transaction runs at a time
 * (serialised-transactions.ts), so a transaction that reads, checks and writes (a period's
 * version, a request limit, a swap's cells) never interleaves with another. On PostgreSQL each
 * transaction has its own pooled connection, so `dataSource.transaction(...)` runs at
 * SERIALIZABLE isolation: PostgreSQL aborts one of two transactions whose interleaving differs
 * from every serial order (SQLSTATE 40001) or that deadlock (40P01), and the aborted one runs
 * again from the start, up to {@link SERIALIZABLE_ATTEMPTS} times, after a short random pause.
 * The outcome is that of some serial order, as on SQLite.
 *
 * The transaction's callback may therefore run more than once: it must do nothing outside the
 * database that it cannot repeat (queue mail through the outbox, in the same transaction).
 * A caller that names an isolation level keeps it and gets no retries. Writes outside a
 * transaction (a single `save`) are single statements at READ COMMITTED.
 */
export function serialisableTransactions(dataSource: DataSource): void {
  const manager = dataSource.manager;
  const transaction = manager.transaction.bind(manager) as (...args: unknown[]) => Promise<unknown>;
  (manager as { transaction: (...args: unknown[]) => Promise<unknown> }).transaction = async (
    ...args: unknown[]
  ) => {
    if (typeof args[0] !== 'function') return transaction(...args);
    for (let attempt = 1; ; attempt++) {
      try {
        return await transaction('SERIALIZABLE', args[0]);
      } catch (err) {
        if (!isRetryableConflict(err) || attempt >= SERIALIZABLE_ATTEMPTS) throw err;
        await sleep(Math.random() * 10 * 2 ** Math.min(attempt, 5));
      }
    }
  };
}
