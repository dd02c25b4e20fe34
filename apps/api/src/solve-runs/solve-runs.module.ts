import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { RosterInputModule } from '../roster-input/roster-input.module';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { RedisConnections } from '../redis/redis-connections';
import { SolveQueue } from './solve-queue';
import { SolveRunEntity } from './solve-run.entity';
import { SolveRunsController } from './solve-runs.controller';
import { SolveRunsService } from './solve-runs.service';

@Module({
  imports: [TypeOrmModule.forFeature([SolveRunEntity]), RosterPeriodsModule, RosterInputModule],
  controllers: [SolveRunsController],
  providers: [
    SolveRunsService,
    // REDIS_URL set: solves go through BullMQ to `npm run worker` processes; otherwise null.
    {
      provide: SolveQueue,
      inject: [RedisConnections],
      useFactory: (redis: RedisConnections | null) => (redis ? new SolveQueue(redis) : null),
    },
  ],
  exports: [SolveRunsService, SolveQueue],
})
export class SolveRunsModule {}
