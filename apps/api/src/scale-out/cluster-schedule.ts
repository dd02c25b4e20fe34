import { Injectable, Logger, type OnApplicationBootstrap, type OnModuleDestroy } from '@nestjs/common';
import { ModuleRef } from '@nestjs/core';
import { SchedulerRegistry } from '@nestjs/schedule';
import { Queue, Worker } from 'bullmq';
import { OutboxRetentionService } from '../outbox/outbox-retention.service';
import { MAINTENANCE_QUEUE } from '../solve-runs/solve-queue-protocol';
import { SwapExpiryService } from '../swaps/swap-expiry.service';
import { redisConnection, RedisConnections } from './redis-connections';

/** The scheduled jobs (names of their @Cron) and what each one runs. */
const JOBS: { name: string; pattern: string; run: (ref: ModuleRef) => Promise<unknown> }[] = [
  {
    name: 'swap-expiry',
    pattern: '0 * * * * *',
    run: (ref) => ref.get(SwapExpiryService, { strict: false }).expireOverdue(),
  },
  {
    name: 'outbox-retention',
    pattern: '0 0 * * * *',
    run: (ref) => ref.get(OutboxRetentionService, { strict: false }).purgeDelivered(),
  },
];

/**
 * REDIS_URL set: the scheduled jobs run once per tick across all API instances. Each instance
 * stops its own @Cron timers and the same schedules become BullMQ job schedulers (one per name,
 * upserted by every instance, so there is one schedule however many start); a job goes to exactly
 * one instance's worker.
 */
@Injectable()
export class ClusterSchedule implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('ClusterSchedule');
  private queue: Queue | null = null;
  private worker: Worker | null = null;

  constructor(
    private readonly redis: RedisConnections,
    private readonly registry: SchedulerRegistry,
    private readonly moduleRef: ModuleRef,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    const { redisUrl, prefix } = this.redis.config;
    this.queue = new Queue(MAINTENANCE_QUEUE, {
      connection: redisConnection(redisUrl as string, `${prefix}-api-maintenance`),
      prefix,
    });
    for (const job of JOBS) {
      await this.queue.upsertJobScheduler(
        job.name,
        { pattern: job.pattern },
        { name: job.name, opts: { removeOnComplete: 100, removeOnFail: 100 } },
      );
    }
    this.worker = new Worker(
      MAINTENANCE_QUEUE,
      async (job) => {
        const found = JOBS.find((j) => j.name === job.name);
        if (!found) throw new Error(`unknown scheduled job ${job.name}`);
        return found.run(this.moduleRef);
      },
      {
        connection: redisConnection(redisUrl as string, `${prefix}-api-maintenance-worker`),
        prefix,
        concurrency: 1,
      },
    );
    this.worker.on('error', (err) => this.logger.warn(err.message));
    // The schedule module mounts the @Cron timers during bootstrap too: stop them once it has.
    setImmediate(() => this.stopLocalTimers());
  }

  /** Whether this instance's own timers are stopped (for the health check and tests). */
  stopLocalTimers(): boolean {
    let all = true;
    for (const job of JOBS) {
      try {
        void this.registry.getCronJob(job.name).stop();
      } catch {
        all = false;
      }
    }
    return all;
  }

  async onModuleDestroy(): Promise<void> {
    await Promise.allSettled([this.worker?.close(), this.queue?.close()]);
  }
}
