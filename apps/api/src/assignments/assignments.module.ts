import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { RosterInputModule } from '../roster-input/roster-input.module';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { AssignmentEntity } from './assignment.entity';
import { AssignmentsController } from './assignments.controller';
import { AssignmentsService } from './assignments.service';

@Module({
  imports: [TypeOrmModule.forFeature([AssignmentEntity]), RosterPeriodsModule, RosterInputModule],
  controllers: [AssignmentsController],
  providers: [AssignmentsService],
  exports: [AssignmentsService],
})
export class AssignmentsModule {}
