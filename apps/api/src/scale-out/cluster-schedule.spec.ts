/**
 * The shared schedule of the scheduled jobs (REDIS_URL set) against real @nestjs/schedule timers
 * and Debian's redis-server on a free port: each job's pattern comes from its @Cron timer (the one
 * definition), the timer is stopped, and a job whose timer this instance cannot take over is left
 * out of Redis. The timers here are the test's own, with patterns unlike the real jobs' (every
 * minute, every hour), so a schedule in Redis can only have taken its pattern from them.
 */
import { Injectable, Logger } from '@nestjs/common';
import { Cron, ScheduleModule, SchedulerRegistry } from '@nestjs/schedule';
import { Test, type TestingModule } from '@nestjs/testing';
import { Queue } from 'bullmq';
import { type RedisServer, startRedis } from '../../test/scale-out/cluster';
import { MAINTENANCE_QUEUE } from '../solve-runs/solve-queue-protocol';
import { ClusterSchedule } from './cluster-schedule';
import { RedisConnections } from '../redis/redis-connections';
import { loadScaleOutConfig } from '../redis/scale-out-config';

const SYSTEM_ZONE = Intl.DateTimeFormat().resolvedOptions().timeZone;

/** 04:15 and 04:45 on 1 January: never during a test run. */
@Injectable()
class BothTimers {
  @Cron('0 15 4 1 1 *', { name: 'swap-expiry' })
  swapExpiry(): void {
    return;
  }

  @Cron('0 45 4 1 1 *', { name: 'outbox-retention', timeZone: 'Europe/Lisbon' })
  outboxRetention(): void {
    return;
  }
}

/** A build whose outbox retention timer is missing (renamed, say). */
@Injectable()
class SwapExpiryTimerOnly {
  @Cron('0 15 4 1 1 *', { name: 'swap-expiry' })
  swapExpiry(): void {
    return;
  }
}

describe('ClusterSchedule (real timers, real redis-server)', () => {
  let redis: RedisServer;
  let app: TestingModule | null = null;
  let queue: Queue | null = null;

  beforeAll(async () => {
    redis = await startRedis();
  }, 30_000);

  afterEach(async () => {
    jest.restoreAllMocks();
    await queue?.close();
    await app?.close();
    queue = null;
    app = null;
  });

  afterAll(async () => {
    await redis?.stop();
  });

  /** One API instance's scheduling parts: the schedule module, the timers, ClusterSchedule. */
  async function start(timers: new () => object, prefix: string): Promise<TestingModule> {
    const config = loadScaleOutConfig({ REDIS_URL: redis.url, REDIS_PREFIX: prefix });
    app = await Test.createTestingModule({
      imports: [ScheduleModule.forRoot()],
      providers: [
        timers,
        ClusterSchedule,
        { provide: RedisConnections, useFactory: () => new RedisConnections(config) },
      ],
    }).compile();
    await app.init();
    queue = new Queue(MAINTENANCE_QUEUE, { connection: { url: redis.url }, prefix });
    return app;
  }

  it("schedules each job in Redis with its @Cron timer's pattern and time zone, and stops the timer", async () => {
    const instance = await start(BothTimers, 'schedule-both');
    const registry = instance.get(SchedulerRegistry);
    expect(registry.getCronJob('swap-expiry').isActive).toBe(false);
    expect(registry.getCronJob('outbox-retention').isActive).toBe(false);
    const schedulers = (await (queue as Queue).getJobSchedulers()).sort((a, b) => a.key.localeCompare(b.key));
    expect(schedulers).toHaveLength(2);
    expect(schedulers[0]).toMatchObject({
      key: 'outbox-retention',
      pattern: '0 45 4 1 1 *',
      tz: 'Europe/Lisbon',
    });
    // No timeZone on the @Cron: the timer runs in the system's zone (cron's CronTime fills it in
    // from Intl), and so does the schedule in Redis.
    expect(schedulers[1]).toMatchObject({ key: 'swap-expiry', pattern: '0 15 4 1 1 *', tz: SYSTEM_ZONE });
  });

  it('leaves a job whose timer it cannot find out of Redis, and says so', async () => {
    const errors = jest.spyOn(Logger.prototype, 'error');
    const instance = await start(SwapExpiryTimerOnly, 'schedule-one-missing');
    expect(instance.get(SchedulerRegistry).getCronJob('swap-expiry').isActive).toBe(false);
    const schedulers = await (queue as Queue).getJobSchedulers();
    expect(schedulers.map((s) => s.key)).toEqual(['swap-expiry']);
    expect(errors.mock.calls.map(([message]) => String(message))).toEqual([
      expect.stringMatching(/^Scheduled job outbox-retention: no @Cron timer of that name is registered\./),
    ]);
    expect(instance.get(ClusterSchedule).stopLocalTimers()).toEqual([
      { name: 'swap-expiry', stopped: true, pattern: '0 15 4 1 1 *', tz: SYSTEM_ZONE },
      { name: 'outbox-retention', stopped: false, reason: 'no @Cron timer of that name is registered' },
    ]);
  });
});
