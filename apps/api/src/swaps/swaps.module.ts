import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MailModule } from '../mail/mail.module';
import { RosterInputModule } from '../roster-input/roster-input.module';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { ShiftTypesModule } from '../shift-types/shift-types.module';
import { StaffModule } from '../staff/staff.module';
import { UnitsModule } from '../units/units.module';
import { UsersModule } from '../users/users.module';
import { SwapDecisions } from './swap-decisions.service';
import { SwapExpiryService } from './swap-expiry.service';
import { SwapLinks } from './swap-links';
import { SwapMailer } from './swap-mailer';
import { SwapPlanning } from './swap-planning.service';
import { SwapReads } from './swap-reads.service';
import { SwapLinkTokenEntity, SwapRequestEntity } from './swap-request.entity';
import { SwapLinksController, SwapsController } from './swaps.controller';
import { SwapsService } from './swaps.service';

@Module({
  imports: [
    TypeOrmModule.forFeature([SwapRequestEntity, SwapLinkTokenEntity]),
    RosterInputModule,
    RosterPeriodsModule,
    MailModule,
    UnitsModule,
    ShiftTypesModule,
    StaffModule,
    UsersModule,
  ],
  controllers: [SwapsController, SwapLinksController],
  providers: [SwapsService, SwapReads, SwapPlanning, SwapDecisions, SwapLinks, SwapMailer, SwapExpiryService],
  exports: [SwapsService, SwapExpiryService],
})
export class SwapsModule {}
