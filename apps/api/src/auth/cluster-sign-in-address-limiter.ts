import { Logger } from '@nestjs/common';
import { type AppConfig } from '../config/app-config';
import { SignInAddressLimiter } from './sign-in-address-limiter';
import { type RedisConnections } from '../redis/redis-connections';

const CHANNEL = 'sign-in-failures';

/**
 * SignInAddressLimiter for several API instances (REDIS_URL set): each failed sign-in is also
 * announced on a Redis channel, and every instance records the failures the others announce, so
 * the limit of failures per address counts them all. The check itself stays in memory (no Redis
 * round trip before a sign-in).
 */
export class ClusterSignInAddressLimiter extends SignInAddressLimiter {
  constructor(
    config: AppConfig,
    private readonly redis: RedisConnections,
  ) {
    super(config);
  }

  async listen(): Promise<void> {
    await this.redis.listen(this.redis.key(CHANNEL), (text) => {
      try {
        const { from, address, at } = JSON.parse(text) as { from: string; address: string; at: number };
        if (from !== this.redis.instanceId && typeof address === 'string' && Number.isFinite(at))
          super.recordFailure(address, at);
      } catch {
        // not ours
      }
    });
  }

  override recordFailure(address: string, now = Date.now()): void {
    super.recordFailure(address, now);
    const message = JSON.stringify({ from: this.redis.instanceId, address, at: now });
    this.redis.client.publish(this.redis.key(CHANNEL), message).catch((err: unknown) => {
      new Logger('SignInAddressLimiter').warn(`Announcing a failed sign-in: ${String(err)}`);
    });
  }
}
