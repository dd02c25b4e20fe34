import { Module } from '@nestjs/common';
import { ClusterSchedule } from './cluster-schedule';

/** What only runs with REDIS_URL: the scheduled jobs once across instances. */
@Module({ providers: [ClusterSchedule] })
export class ScaleOutServicesModule {}
