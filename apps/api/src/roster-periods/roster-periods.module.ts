import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OrganisationModule } from '../organisation/organisation.module';
import { UnitsModule } from '../units/units.module';
import { UsersModule } from '../users/users.module';
import { AssignmentEntity } from './assignment.entity';
import { LateChangeEntity } from './late-change.entity';
import { RosterPeriodChangeEntity } from './roster-period-change.entity';
import { RosterPeriodEntity } from './roster-period.entity';
import { RosterPeriodsController } from './roster-periods.controller';
import { RosterPeriodsService } from './roster-periods.service';
import { PeriodWriter } from './period-writer';

@Module({
  imports: [
    TypeOrmModule.forFeature([
      RosterPeriodEntity,
      RosterPeriodChangeEntity,
      LateChangeEntity,
      AssignmentEntity,
    ]),
    OrganisationModule,
    UnitsModule,
    UsersModule,
  ],
  controllers: [RosterPeriodsController],
  providers: [RosterPeriodsService, PeriodWriter],
  exports: [RosterPeriodsService, PeriodWriter],
})
export class RosterPeriodsModule {}
