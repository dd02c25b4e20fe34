import { Global, Injectable, Logger, Module, type OnApplicationBootstrap } from '@nestjs/common';
import { DataSource } from 'typeorm';
import { WriteGeneration } from '../database/write-generation';
import { RedisConnections } from '../redis/redis-connections';

const CHANNEL = 'write-generation';

/**
 * WriteGeneration for several API instances (REDIS_URL set): when this instance's generation
 * moves (a write it made), it says so on a Redis channel; a message from another instance moves
 * this one's generation too, so every instance's caches (board reads, open shifts, the caller's
 * lookup) drop what another instance's write made stale. The window is the channel's delivery
 * time (well under a millisecond on one network), against a whole HTTP round trip for a client.
 */
@Injectable()
export class ClusterWriteGeneration extends WriteGeneration implements OnApplicationBootstrap {
  private remote = 0;
  private announced = 0;
  private pending = false;

  constructor(
    dataSource: DataSource,
    private readonly redis: RedisConnections,
  ) {
    super(dataSource);
    const later = (): void => {
      if (this.pending) return;
      this.pending = true;
      // After WriteGeneration's own subscriber (registered first) has counted the write.
      queueMicrotask(() => this.announce());
    };
    dataSource.subscribers.push({
      afterInsert: later,
      afterUpdate: later,
      afterRemove: later,
      afterSoftRemove: later,
      afterRecover: later,
      afterTransactionCommit: later,
      afterTransactionRollback: later,
    });
  }

  async onApplicationBootstrap(): Promise<void> {
    this.announced = super.current();
    await this.redis.listen(this.redis.key(CHANNEL), (from) => {
      if (from !== this.redis.instanceId) this.remote++;
    });
  }

  /** Local writes plus writes announced by other instances: moves on with either. */
  override current(): number {
    return super.current() + this.remote;
  }

  private announce(): void {
    this.pending = false;
    const local = super.current();
    if (local === this.announced) return;
    this.announced = local;
    this.redis.client.publish(this.redis.key(CHANNEL), this.redis.instanceId).catch((err: unknown) => {
      new Logger('WriteGeneration').warn(`Announcing a write: ${String(err)}`);
    });
  }
}

/** Replaces WriteGenerationModule when REDIS_URL is set. */
@Global()
@Module({
  providers: [{ provide: WriteGeneration, useClass: ClusterWriteGeneration }],
  exports: [WriteGeneration],
})
export class ClusterWriteGenerationModule {}
