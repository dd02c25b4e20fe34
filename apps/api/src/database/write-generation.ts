import { Global, Injectable, Module } from '@nestjs/common';
import { DataSource, type EntitySubscriberInterface, type EntityMetadata, type QueryRunner } from 'typeorm';

/**
 * Tables whose writes never change what a roster read shows (sessions, mail, solver progress,
 * logs). Writes to any other table move the generation on.
 */
const IGNORED_TABLES = new Set([
  'refresh_tokens',
  'one_time_tokens',
  'mail_messages',
  'outbox_messages',
  'solve_runs',
  'audit_entries',
]);

/**
 * A number that moves on whenever data that reads depend on may have changed: on every entity
 * write TypeORM reports (save, insert, update, remove, query-builder updates and deletes) and again
 * when the transaction holding such a write commits or rolls back. A cached read is valid while the
 * generation it was computed under is still current; take the generation BEFORE reading the data,
 * so a write that lands while the read runs makes the result stale at once. Raw SQL writes are not
 * seen: the product writes through entities (the few raw queries are counts).
 */
@Injectable()
export class WriteGeneration {
  private generation = 0;
  /** Connections whose open transaction wrote something reads depend on. */
  private readonly dirty = new WeakSet<QueryRunner>();

  constructor(dataSource: DataSource) {
    const subscriber: EntitySubscriberInterface = {
      afterInsert: (e) => this.wrote(e.metadata, e.queryRunner),
      afterUpdate: (e) => this.wrote(e.metadata, e.queryRunner),
      afterRemove: (e) => this.wrote(e.metadata, e.queryRunner),
      afterSoftRemove: (e) => this.wrote(e.metadata, e.queryRunner),
      afterRecover: (e) => this.wrote(e.metadata, e.queryRunner),
      afterTransactionCommit: (e) => this.settled(e.queryRunner),
      afterTransactionRollback: (e) => this.settled(e.queryRunner),
    };
    dataSource.subscribers.push(subscriber);
  }

  current(): number {
    return this.generation;
  }

  private wrote(metadata: EntityMetadata | undefined, runner: QueryRunner | undefined): void {
    if (metadata && IGNORED_TABLES.has(metadata.tableName)) return;
    this.generation++;
    if (runner) this.dirty.add(runner);
  }

  private settled(runner: QueryRunner | undefined): void {
    // The flag belongs to the connection whose transaction just ended: on SQLite the one shared
    // connection (transactions are serialised, see serialised-transactions.ts), on PostgreSQL the
    // pooled connection that ran it, while other transactions may still be open on others.
    if (!runner || !this.dirty.has(runner)) return;
    this.dirty.delete(runner);
    this.generation++;
  }
}

/** One WriteGeneration for the whole application. */
@Global()
@Module({ providers: [WriteGeneration], exports: [WriteGeneration] })
export class WriteGenerationModule {}

export interface GenerationCacheOptions {
  /** Most keys kept (least recently stored dropped first); default 64. */
  maxEntries?: number;
  /** Also expire an entry after this many milliseconds, whatever the generation (default: never). */
  maxAgeMs?: number;
}

/** Results of an expensive read per key, valid while the write generation has not moved. */
export class GenerationCache<T> {
  private readonly entries = new Map<string, { generation: number; at: number; value: Promise<T> }>();
  private readonly maxEntries: number;
  private readonly maxAgeMs: number;

  constructor(
    private readonly writes: WriteGeneration,
    options: GenerationCacheOptions = {},
  ) {
    this.maxEntries = options.maxEntries ?? 64;
    this.maxAgeMs = options.maxAgeMs ?? Infinity;
  }

  get(key: string, compute: () => Promise<T>): Promise<T> {
    const generation = this.writes.current();
    const now = performance.now();
    const hit = this.entries.get(key);
    if (hit && hit.generation === generation && now - hit.at <= this.maxAgeMs) return hit.value;
    const value = compute();
    this.entries.delete(key);
    this.entries.set(key, { generation, at: now, value });
    // A failed read is not kept.
    value.catch(() => {
      if (this.entries.get(key)?.value === value) this.entries.delete(key);
    });
    while (this.entries.size > this.maxEntries) this.entries.delete(this.entries.keys().next().value!);
    return value;
  }
}
