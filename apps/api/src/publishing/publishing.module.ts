import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ContractsModule } from '../contracts/contracts.module';
import { MailModule } from '../mail/mail.module';
import { RosterInputModule } from '../roster-input/roster-input.module';
import { RosterPeriodsModule } from '../roster-periods/roster-periods.module';
import { SolveRunsModule } from '../solve-runs/solve-runs.module';
import { RosterPublicationEntity } from './roster-publication.entity';
import { PublishingController } from './publishing.controller';
import { PublishingService } from './publishing.service';

/** Publish and repair rosters; the audit trail's reading side and the period export. */
@Module({
  imports: [
    TypeOrmModule.forFeature([RosterPublicationEntity]),
    ContractsModule,
    MailModule,
    RosterPeriodsModule,
    RosterInputModule,
    SolveRunsModule,
  ],
  controllers: [PublishingController],
  providers: [PublishingService],
})
export class PublishingModule {}
