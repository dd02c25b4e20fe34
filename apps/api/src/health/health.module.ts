import { Module } from '@nestjs/common';
import { SolveRunsModule } from '../solve-runs/solve-runs.module';
import { HealthController } from './health.controller';

@Module({ imports: [SolveRunsModule], controllers: [HealthController] })
export class HealthModule {}
