import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ReadConnectionModule } from '../database/read-connection';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { ShiftTypesModule } from '../shift-types/shift-types.module';
import { StaffModule } from '../staff/staff.module';
import { UnitsModule } from '../units/units.module';
import { UsersModule } from '../users/users.module';
import { CalendarFeedEntity, CalendarFeedEventEntity } from './calendar-feed.entity';
import { CalendarFeedsController } from './calendar-feeds.controller';
import { CalendarFeedsService } from './calendar-feeds.service';
import { MyRosterController } from './my-roster.controller';
import { MyRosterService } from './my-roster.service';
import { PublishedShifts } from './published-shifts';

/** My roster (published shifts of me and my units) and the personal iCalendar feed. */
@Module({
  imports: [
    TypeOrmModule.forFeature([CalendarFeedEntity, CalendarFeedEventEntity]),
    ReadConnectionModule,
    RosterPeriodsModule,
    ShiftTypesModule,
    StaffModule,
    UnitsModule,
    UsersModule,
  ],
  controllers: [MyRosterController, CalendarFeedsController],
  providers: [MyRosterService, CalendarFeedsService, PublishedShifts],
  exports: [CalendarFeedsService],
})
export class MyRosterModule {}
