import { Module } from '@nestjs/common';
import { MailModule } from '../mail/mail.module';
import { RosterInputModule } from '../roster-input/roster-input.module';
import { SwapsModule } from '../swaps/swaps.module';
import { OpenShiftsController } from './open-shifts.controller';
import { OpenShiftsService } from './open-shifts.service';

@Module({
  imports: [SwapsModule, RosterInputModule, MailModule],
  controllers: [OpenShiftsController],
  providers: [OpenShiftsService],
})
export class OpenShiftsModule {}
