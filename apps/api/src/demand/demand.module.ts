import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { CoverNeedsModule } from '../cover-needs/cover-needs.module';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { ShiftTypesModule } from '../shift-types/shift-types.module';
import { StaffModule } from '../staff/staff.module';
import { UnitsModule } from '../units/units.module';
import { DemandPlanController, UnitDemandController } from './demand.controller';
import { DemandAcceptanceEntity, UnitDemandEntity } from './demand.entities';
import { DemandService } from './demand.service';

/** From demand to cover: forecasts, requirement, covering plan and its acceptance into cover needs. */
@Module({
  imports: [
    TypeOrmModule.forFeature([UnitDemandEntity, DemandAcceptanceEntity]),
    UnitsModule,
    RosterPeriodsModule,
    CoverNeedsModule,
    ShiftTypesModule,
    StaffModule,
  ],
  controllers: [UnitDemandController, DemandPlanController],
  providers: [DemandService],
})
export class DemandModule {}
