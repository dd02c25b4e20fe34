import {
  type DynamicModule,
  Global,
  Injectable,
  Logger,
  Module,
  type OnApplicationShutdown,
} from '@nestjs/common';
import { Redis } from 'ioredis';
import { randomUUID } from 'node:crypto';
import { ScaleOutConfig } from './scale-out-config';

/** A Redis connection as BullMQ wants it (commands wait for a reconnect instead of failing). */
export function redisConnection(url: string, name: string, subscriber = false): Redis {
  const redis = new Redis(url, {
    maxRetriesPerRequest: null,
    connectionName: name,
    // A connection that subscribes at once must not run the ready check's INFO in subscriber mode.
    enableReadyCheck: !subscriber,
  });
  // ioredis reconnects by itself; an error event without a listener would crash the process.
  redis.on('error', (err: Error) => new Logger('Redis').warn(`${name}: ${err.message}`));
  return redis;
}

/**
 * The API instance's Redis connections: one for commands and publishing, one subscribed to the
 * channels of the instances' shared events (a subscribed connection can do nothing else). Only
 * created when REDIS_URL is set.
 */
@Injectable()
export class RedisConnections implements OnApplicationShutdown {
  /** This API process, for heartbeats and the ownership of the solves it started. */
  readonly instanceId = randomUUID();
  readonly client: Redis;
  readonly subscriber: Redis;
  /** For the sign-in rate limit's counters (keys under REDIS_PREFIX:throttle:). */
  readonly throttle: Redis;
  private readonly handlers = new Map<string, ((message: string) => void)[]>();

  constructor(readonly config: ScaleOutConfig) {
    const url = config.redisUrl as string;
    this.client = redisConnection(url, `${config.prefix}-api`);
    this.subscriber = redisConnection(url, `${config.prefix}-api-sub`, true);
    this.throttle = new Redis(url, {
      connectionName: `${config.prefix}-api-throttle`,
      keyPrefix: `${config.prefix}:throttle:`,
    });
    this.throttle.on('error', (err: Error) => new Logger('Redis').warn(`throttle: ${err.message}`));
    this.subscriber.on('message', (channel: string, message: string) => {
      for (const handler of this.handlers.get(channel) ?? []) handler(message);
    });
  }

  /** Full name of a key or channel under REDIS_PREFIX. */
  key(name: string): string {
    return `${this.config.prefix}:${name}`;
  }

  /** Receive every message published on a channel (by any process). */
  async listen(channel: string, handler: (message: string) => void): Promise<void> {
    const list = this.handlers.get(channel);
    if (list) list.push(handler);
    else {
      this.handlers.set(channel, [handler]);
      await this.subscriber.subscribe(channel);
    }
  }

  async onApplicationShutdown(): Promise<void> {
    await Promise.allSettled([this.subscriber.quit(), this.client.quit(), this.throttle.quit()]);
  }
}

/** ScaleOutConfig everywhere; RedisConnections (or null) when REDIS_URL is set. */
@Global()
@Module({})
export class ScaleOutModule {
  static forRoot(config: ScaleOutConfig): DynamicModule {
    return {
      module: ScaleOutModule,
      providers: [
        { provide: ScaleOutConfig, useValue: config },
        {
          provide: RedisConnections,
          useFactory: () => (config.redisUrl ? new RedisConnections(config) : null),
        },
      ],
      exports: [ScaleOutConfig, RedisConnections],
    };
  }
}
