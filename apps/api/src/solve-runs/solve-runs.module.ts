import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { RosterInputModule } from '../roster-input/roster-input.module';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { SolveRunEntity } from './solve-run.entity';
import { SolveRunsController } from './solve-runs.controller';
import { SolveRunsService } from './solve-runs.service';

@Module({
  imports: [TypeOrmModule.forFeature([SolveRunEntity]), RosterPeriodsModule, RosterInputModule],
  controllers: [SolveRunsController],
  providers: [SolveRunsService],
  exports: [SolveRunsService],
})
export class SolveRunsModule {}
