import { type DynamicModule, Module } from '@nestjs/common';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { ScheduleModule } from '@nestjs/schedule';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuthModule } from './auth/auth.module';
import { DatabaseErrorFilter } from './common/filters/database-error.filter';
import { JwtAuthGuard } from './common/guards/jwt-auth.guard';
import { PermissionsGuard } from './common/guards/permissions.guard';
import { AppConfig } from './config/app-config';
import { ConfigModule } from './config/config.module';
import { databaseTarget, dataSourceOptions } from './database/data-source-options';
import { openDatabase } from './database/open-database';
import { WriteGenerationModule } from './database/write-generation';
import { DemoModule } from './demo/demo.module';
import { RequestsModule } from './requests/requests.module';
import { SwapsModule } from './swaps/swaps.module';
import { OpenShiftsModule } from './open-shifts/open-shifts.module';
import { HealthModule } from './health/health.module';
import { MailModule } from './mail/mail.module';
import { OrganisationModule } from './organisation/organisation.module';
import { UnitsModule } from './units/units.module';
import { UsersModule } from './users/users.module';
import { SkillsModule } from './skills/skills.module';
import { ShiftTypesModule } from './shift-types/shift-types.module';
import { ContractsModule } from './contracts/contracts.module';
import { StaffModule } from './staff/staff.module';
import { CoverNeedsModule } from './cover-needs/cover-needs.module';
import { DemandModule } from './demand/demand.module';
import { RosterPeriodsModule } from './roster-periods/roster-periods.module';
import { SolveRunsModule } from './solve-runs/solve-runs.module';
import { AssignmentsModule } from './assignments/assignments.module';
import { ReportsModule } from './reports/reports.module';
import { OutboxModule } from './mail/outbox/outbox.module';
import { AuditModule } from './audit/audit.module';
import { PublishingModule } from './publishing/publishing.module';
import { MyRosterModule } from './my-roster/my-roster.module';
import { ClusterWriteGenerationModule } from './scale-out/cluster-write-generation';
import { ScaleOutModule } from './redis/redis-connections';
import { ScaleOutConfig } from './redis/scale-out-config';
import { ScaleOutServicesModule } from './scale-out/scale-out-services.module';

/** One process: solves in this process's worker pool, everything else in memory. */
const NO_SCALE_OUT: ScaleOutConfig = {
  redisUrl: null,
  prefix: 'rotaplex',
  solveLockMs: 30_000,
  workerConcurrency: 1,
  workerThreads: 1,
};

@Module({})
export class AppModule {
  /**
   * The whole API for a validated configuration (with its JWT secret resolved). With a REDIS_URL in
   * `scaleOut`, solves go to worker processes and the instances share events, caches' invalidation,
   * rate limits and scheduled jobs through Redis (docs/scale-out.md).
   */
  static forRoot(config: AppConfig, scaleOut: ScaleOutConfig = NO_SCALE_OUT): DynamicModule {
    const redis = scaleOut.redisUrl !== null;
    return {
      module: AppModule,
      imports: [
        ConfigModule.forRoot(config),
        ScaleOutModule.forRoot(scaleOut),
        TypeOrmModule.forRootAsync({
          // SQLite file by default, PostgreSQL when DATABASE_URL is set (database/open-database.ts).
          // The entities are those the modules register with TypeOrmModule.forFeature: each module
          // owns its tables.
          useFactory: () => ({
            ...dataSourceOptions(databaseTarget(config)),
            entities: [],
            autoLoadEntities: true,
          }),
          dataSourceFactory: (options) => openDatabase(databaseTarget(config), options!),
        }),
        redis ? ClusterWriteGenerationModule : WriteGenerationModule,
        // Time-driven work: expiry of swap requests and their links, outbox retention.
        ScheduleModule.forRoot(),
        HealthModule,
        MailModule,
        OrganisationModule,
        UnitsModule,
        UsersModule,
        AuthModule,
        SkillsModule,
        ShiftTypesModule,
        ContractsModule,
        StaffModule,
        CoverNeedsModule,
        DemandModule,
        RosterPeriodsModule,
        SolveRunsModule,
        AssignmentsModule,
        ReportsModule,
        OutboxModule,
        AuditModule,
        PublishingModule,
        SwapsModule,
        OpenShiftsModule,
        MyRosterModule,
        RequestsModule,
        DemoModule,
        ...(redis ? [ScaleOutServicesModule] : []),
      ],
      providers: [
        // Order matters: authentication first, then the route's access rule.
        { provide: APP_GUARD, useClass: JwtAuthGuard },
        { provide: APP_GUARD, useClass: PermissionsGuard },
        { provide: APP_FILTER, useClass: DatabaseErrorFilter },
      ],
    };
  }
}
