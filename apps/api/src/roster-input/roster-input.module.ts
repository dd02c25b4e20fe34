import { Module } from '@nestjs/common';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { RosterInputService } from './roster-input.service';

@Module({
  imports: [RosterPeriodsModule],
  providers: [RosterInputService],
  exports: [RosterInputService],
})
export class RosterInputModule {}
