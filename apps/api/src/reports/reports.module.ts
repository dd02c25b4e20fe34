import { Module } from '@nestjs/common';
import { RosterInputModule } from '../roster-input/roster-input.module';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { ReportsController } from './reports.controller';
import { ReportsService } from './reports.service';

@Module({
  imports: [RosterPeriodsModule, RosterInputModule],
  controllers: [ReportsController],
  providers: [ReportsService],
})
export class ReportsModule {}
