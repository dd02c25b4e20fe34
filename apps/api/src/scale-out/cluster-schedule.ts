import { Injectable, Logger, type OnApplicationBootstrap, type OnModuleDestroy } from '@nestjs/common';
import { ModuleRef } from '@nestjs/core';
import { SchedulerRegistry } from '@nestjs/schedule';
import { Queue, Worker } from 'bullmq';
import { type Redis } from 'ioredis';
import { OutboxRetentionService } from '../mail/outbox/outbox-retention.service';
import { MAINTENANCE_QUEUE } from '../solve-runs/solve-queue-protocol';
import { SwapExpiryService } from '../swaps/swap-expiry.service';
import { redisConnection, RedisConnections } from '../redis/redis-connections';

/**
 * The scheduled jobs: the names of their @Cron timers and what each one runs. Their patterns are
 * those of the @Cron timers themselves (read from the registry), the one definition of both
 * schedules.
 */
const JOBS: { name: string; run: (ref: ModuleRef) => Promise<unknown> }[] = [
  { name: 'swap-expiry', run: (ref) => ref.get(SwapExpiryService, { strict: false }).expireOverdue() },
  {
    name: 'outbox-retention',
    run: (ref) => ref.get(OutboxRetentionService, { strict: false }).purgeDelivered(),
  },
];

/** What became of one job's local timer: stopped (its schedule moves to Redis) or kept, and why. */
export type LocalTimerTakeOver =
  | { name: string; stopped: true; pattern: string; tz?: string }
  | { name: string; stopped: false; reason: string };

/**
 * REDIS_URL set: the scheduled jobs run once per tick across all API instances. Each instance
 * stops its own @Cron timers and the same schedules become BullMQ job schedulers (one per name,
 * upserted by every instance, so there is one schedule however many start); a job goes to exactly
 * one instance's worker.
 *
 * A job whose local timer this instance cannot stop (or cannot find) is not put in Redis by this
 * instance: it runs on the instance's own timer, as without Redis, rather than twice on one
 * instance (timer and shared schedule). Both jobs are single conditional statements, so a run on
 * more than one instance costs a query, never a wrong result; a job that never runs would leave
 * swaps pending past their date. Such a job is logged as an error at start-up.
 */
@Injectable()
export class ClusterSchedule implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('ClusterSchedule');
  private queue: Queue | null = null;
  private worker: Worker | null = null;
  /** The connections made here: BullMQ leaves connections it was given open when it closes. */
  private readonly connections: Redis[] = [];

  constructor(
    private readonly redis: RedisConnections,
    private readonly registry: SchedulerRegistry,
    private readonly moduleRef: ModuleRef,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    // ScheduleModule is global, and Nest runs the bootstrap hooks of global modules first: its
    // @Cron timers are mounted (and running) by now.
    const timers = this.stopLocalTimers();
    const { redisUrl, prefix } = this.redis.config;
    const connect = (name: string): Redis => {
      const connection = redisConnection(redisUrl as string, `${prefix}-${name}`);
      this.connections.push(connection);
      return connection;
    };
    this.queue = new Queue(MAINTENANCE_QUEUE, { connection: connect('api-maintenance'), prefix });
    for (const timer of timers) {
      if (!timer.stopped) {
        this.logger.error(
          `Scheduled job ${timer.name}: ${timer.reason}. It is not scheduled in Redis by this instance and runs on this instance's own timer, if any.`,
        );
        continue;
      }
      await this.queue.upsertJobScheduler(
        timer.name,
        { pattern: timer.pattern, ...(timer.tz ? { tz: timer.tz } : {}) },
        { name: timer.name, opts: { removeOnComplete: 100, removeOnFail: 100 } },
      );
    }
    this.worker = new Worker(
      MAINTENANCE_QUEUE,
      async (job) => {
        const found = JOBS.find((j) => j.name === job.name);
        if (!found) throw new Error(`unknown scheduled job ${job.name}`);
        return found.run(this.moduleRef);
      },
      { connection: connect('api-maintenance-worker'), prefix, concurrency: 1 },
    );
    this.worker.on('error', (err) => this.logger.warn(err.message));
  }

  /**
   * Stops this instance's @Cron timer of each scheduled job and reads its pattern (and time zone);
   * a timer missing from the registry or still active after stop() is reported as kept.
   */
  stopLocalTimers(): LocalTimerTakeOver[] {
    return JOBS.map(({ name }): LocalTimerTakeOver => {
      let timer: ReturnType<SchedulerRegistry['getCronJob']>;
      try {
        timer = this.registry.getCronJob(name);
      } catch {
        return { name, stopped: false, reason: 'no @Cron timer of that name is registered' };
      }
      const source = timer.cronTime.source;
      if (typeof source !== 'string')
        return { name, stopped: false, reason: 'its @Cron timer runs once at a date, not on a pattern' };
      if (timer.cronTime.utcOffset != null)
        return {
          name,
          stopped: false,
          reason: 'its @Cron timer uses a UTC offset, which a Redis schedule cannot',
        };
      try {
        void timer.stop();
      } catch (err) {
        return { name, stopped: false, reason: `its @Cron timer could not be stopped (${String(err)})` };
      }
      if (timer.isActive)
        return { name, stopped: false, reason: 'its @Cron timer is still active after stop()' };
      // Without a timeZone on the @Cron, the timer runs in the system's (cron fills it in).
      const tz = timer.cronTime.timeZone;
      return { name, stopped: true, pattern: source, ...(tz ? { tz } : {}) };
    });
  }

  async onModuleDestroy(): Promise<void> {
    await Promise.allSettled([this.worker?.close(), this.queue?.close()]);
    await Promise.allSettled(this.connections.map((c) => c.quit()));
  }
}
