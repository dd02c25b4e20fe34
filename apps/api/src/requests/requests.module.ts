import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AvailabilityService } from './availability.service';
import { DateRequestsService } from './date-requests.service';
import { LeaveService } from './leave.service';
import { RequestAccess } from './request-access';
import { RequestDtos } from './request-dtos';
import { RequestViews } from './request-views.service';
import { AvailabilityCellEntity, DateRequestEntity, LeaveRequestEntity } from './requests.entities';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { ShiftTypesModule } from '../shift-types/shift-types.module';
import { StaffModule } from '../staff/staff.module';
import { UnitsModule } from '../units/units.module';
import { UsersModule } from '../users/users.module';
import { RequestsController } from './requests.controller';

/**
 * Staff input: availability, date requests and leave, split by job (who may see and change what,
 * the answers' rows, each kind of input, and the views over them).
 */
@Module({
  imports: [
    TypeOrmModule.forFeature([AvailabilityCellEntity, DateRequestEntity, LeaveRequestEntity]),
    UnitsModule,
    StaffModule,
    UsersModule,
    ShiftTypesModule,
    RosterPeriodsModule,
  ],
  controllers: [RequestsController],
  providers: [
    RequestAccess,
    RequestDtos,
    AvailabilityService,
    DateRequestsService,
    LeaveService,
    RequestViews,
  ],
})
export class RequestsModule {}
