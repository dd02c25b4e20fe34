import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MailModule } from '../mail/mail.module';
import { RosterInputModule } from '../roster-input/roster-input.module';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { SkillsModule } from '../skills/skills.module';
import { SwapsModule } from '../swaps/swaps.module';
import { UnitsModule } from '../units/units.module';
import { UsersModule } from '../users/users.module';
import { OpenShiftsController } from './open-shifts.controller';
import { OpenShiftsService } from './open-shifts.service';
import { OutsideOfferEntity } from './outside-offer.entity';

@Module({
  imports: [
    TypeOrmModule.forFeature([OutsideOfferEntity]),
    SwapsModule,
    RosterInputModule,
    RosterPeriodsModule,
    MailModule,
    SkillsModule,
    UnitsModule,
    UsersModule,
  ],
  controllers: [OpenShiftsController],
  providers: [OpenShiftsService],
})
export class OpenShiftsModule {}
