import { AsyncLocalStorage } from 'node:async_hooks';
import { type DataSource, type QueryRunner } from 'typeorm';

/**
 * TypeORM's better-sqlite3 driver runs every request through ONE shared query runner. Without
 * help, two requests that overlap in time share one SQLite transaction: a second `transaction()`
 * becomes a SAVEPOINT inside the first, and plain queries of other requests land inside whichever
 * transaction happens to be open, so one request's rollback can undo another's committed work.
 *
 * This makes transactions exclusive. Each transaction has an owner token carried by the async
 * context (AsyncLocalStorage): `transaction()` runs its body under a fresh token, and an implicit
 * transaction (e.g. `repository.save`) takes one where it starts. While a transaction is open,
 * queries and transactions of other contexts wait for it to end, and to them no transaction
 * appears active. Nested transactions of the owner (savepoints) pass straight through.
 */
export function serialiseTransactions(dataSource: DataSource): void {
  const context = new AsyncLocalStorage<symbol>();
  const manager = dataSource.manager;
  const transaction = manager.transaction.bind(manager) as (...args: unknown[]) => Promise<unknown>;
  (manager as { transaction: (...args: unknown[]) => Promise<unknown> }).transaction = (...args: unknown[]) =>
    context.run(Symbol('transaction'), () => transaction(...args));

  const driver = dataSource.driver as { createQueryRunner: (mode?: string) => QueryRunner };
  const original = driver.createQueryRunner.bind(driver);
  const patched = new WeakSet<QueryRunner>();
  driver.createQueryRunner = (mode?: string) => {
    const runner = original(mode);
    if (!patched.has(runner)) {
      patchRunner(runner, context);
      patched.add(runner);
    }
    return runner;
  };
}

function patchRunner(runner: QueryRunner, context: AsyncLocalStorage<symbol>): void {
  let owner: symbol | null = null;
  let released: Promise<void> = Promise.resolve();
  let release: () => void = () => undefined;
  const isOwner = () => owner !== null && context.getStore() === owner;
  const waitForOthers = async () => {
    while (owner !== null && !isOwner()) await released;
  };

  // Other contexts must not see (and join) the owner's transaction.
  let active = runner.isTransactionActive;
  Object.defineProperty(runner, 'isTransactionActive', {
    configurable: true,
    get: () => (owner === null || isOwner() ? active : false),
    set: (value: boolean) => {
      active = value;
    },
  });

  const query = runner.query.bind(runner) as (...args: unknown[]) => Promise<unknown>;
  (runner as { query: (...args: unknown[]) => Promise<unknown> }).query = async (...args: unknown[]) => {
    await waitForOthers();
    return query(...args);
  };

  const start = runner.startTransaction.bind(runner);
  runner.startTransaction = async (...args: Parameters<QueryRunner['startTransaction']>) => {
    if (isOwner()) return start(...args); // nested: a savepoint inside the owner's transaction
    let token = context.getStore();
    if (token === undefined) {
      // Implicit transaction (repository.save and friends): own the rest of this async flow.
      token = Symbol('implicit transaction');
      context.enterWith(token);
    }
    // Check and take the lock with no await in between, so two waiters cannot both take it.
    while (owner !== null) await released;
    owner = token;
    released = new Promise<void>((resolve) => (release = resolve));
    try {
      await start(...args);
    } catch (err) {
      freeLock();
      throw err;
    }
  };

  const freeLock = () => {
    owner = null;
    release();
  };
  const depth = () => (runner as unknown as { transactionDepth: number }).transactionDepth;
  const finishing = (fn: () => Promise<void>) => async (): Promise<void> => {
    const outermost = depth() <= 1;
    try {
      await fn();
    } finally {
      // Free the lock when the outermost transaction ends, even if COMMIT/ROLLBACK failed.
      if (isOwner() && outermost) freeLock();
    }
  };
  runner.commitTransaction = finishing(runner.commitTransaction.bind(runner));
  runner.rollbackTransaction = finishing(runner.rollbackTransaction.bind(runner));
}
