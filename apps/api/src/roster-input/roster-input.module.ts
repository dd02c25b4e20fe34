import { Module } from '@nestjs/common';
import { RosterInputService } from './roster-input.service';

@Module({
  providers: [RosterInputService],
  exports: [RosterInputService],
})
export class RosterInputModule {}
