import { type MigrationInterface, type QueryRunner } from 'typeorm';

/** PostgreSQL's twin of PostgresBaseline1765540800000, written by TypeORM's schema diff (generate-postgres-migration.ts). */
export class PostgresBaseline1765540800000 implements MigrationInterface {
  name = 'PostgresBaseline1765540800000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "organisations" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "name" character varying(200) NOT NULL, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updatedAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_7bf54cba378d5b2f1d4c10ef4df" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "units" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisationId" uuid NOT NULL, "name" character varying(200) NOT NULL, "timeZone" character varying(64) NOT NULL, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updatedAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_5a8f2f064919b587d93936cb223" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_units_organisation_name" ON "units"  ("organisationId", "name") `,
    );
    await queryRunner.query(
      `CREATE TABLE "users" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisationId" uuid NOT NULL, "email" character varying(254) NOT NULL, "displayName" character varying(200) NOT NULL, "passwordHash" character varying, "role" character varying(16) NOT NULL, "active" boolean NOT NULL DEFAULT true, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updatedAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "UQ_97672ac88f789774dd47f7c8be3" UNIQUE ("email"), CONSTRAINT "CHK_users_role" CHECK ("role" IN ('admin', 'manager', 'staff')), CONSTRAINT "PK_a3ffb1c0c8416b9fc6f907b7433" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "one_time_tokens" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "userId" uuid NOT NULL, "purpose" character varying(20) NOT NULL, "tokenHash" character varying(64) NOT NULL, "expiresAt" TIMESTAMP WITH TIME ZONE NOT NULL, "usedAt" TIMESTAMP WITH TIME ZONE, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "UQ_3cd7ae667bfe489f39288fe9964" UNIQUE ("tokenHash"), CONSTRAINT "CHK_one_time_tokens_purpose" CHECK ("purpose" IN ('invitation', 'password-reset')), CONSTRAINT "PK_8e470cc9ffc1b2afa054304db17" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "IDX_one_time_tokens_user" ON "one_time_tokens"  ("userId") `);
    await queryRunner.query(
      `CREATE TABLE "roster_periods" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "unitId" uuid NOT NULL, "startDate" character varying(10) NOT NULL, "days" integer NOT NULL, "status" character varying(16) NOT NULL DEFAULT 'draft', "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "publishedAt" TIMESTAMP WITH TIME ZONE, "requestLimit" integer NOT NULL DEFAULT '5', "version" integer NOT NULL, CONSTRAINT "CHK_roster_periods_status" CHECK ("status" IN ('draft', 'published', 'archived')), CONSTRAINT "PK_f59fd05384caf377db48140f5a7" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_roster_periods_unit_start" ON "roster_periods"  ("unitId", "startDate") `,
    );
    await queryRunner.query(
      `CREATE TABLE "contracts" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisationId" uuid NOT NULL, "unitId" uuid, "name" character varying(200) NOT NULL, "maxShiftsPerType" text, "minPaidMinutes" integer, "maxPaidMinutes" integer, "targetPaidMinutes" integer, "maxConsecutiveWorkDays" integer, "minConsecutiveWorkDays" integer, "minConsecutiveDaysOff" integer, "maxWeekends" integer, "maxConsecutiveNights" integer, "minRestMinutes" integer, CONSTRAINT "PK_2c7b8f3a7b1acdd49497d83d0fb" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "skills" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "organisationId" uuid NOT NULL, "code" character varying(16) NOT NULL, "name" character varying(200) NOT NULL, CONSTRAINT "PK_0d3212120f4ecedf90864d7e298" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_skills_organisation_code" ON "skills"  ("organisationId", "code") `,
    );
    await queryRunner.query(
      `CREATE TABLE "staff_members" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "unitId" uuid NOT NULL, "userId" uuid, "name" character varying(200) NOT NULL, "email" character varying(254), "contractId" uuid, "hourlyCost" real, "active" boolean NOT NULL DEFAULT true, CONSTRAINT "PK_cdad75efe024402db5d51140960" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_staff_members_unit_user" ON "staff_members"  ("unitId", "userId") `,
    );
    await queryRunner.query(
      `CREATE TABLE "swap_requests" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "unitId" uuid NOT NULL, "kind" character varying(8) NOT NULL, "status" character varying(12) NOT NULL, "proposerStaffMemberId" uuid NOT NULL, "colleagueStaffMemberId" uuid, "skillId" uuid, "changes" text NOT NULL, "firstDate" character varying(10) NOT NULL, "note" character varying(500), "outcome" character varying(1000), "decidedById" uuid, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updatedAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "version" integer NOT NULL, CONSTRAINT "CHK_swap_requests_status" CHECK ("status" IN ('proposed', 'accepted', 'declined', 'approved', 'refused', 'cancelled', 'expired')), CONSTRAINT "CHK_swap_requests_kind" CHECK ("kind" IN ('swap', 'offer', 'claim')), CONSTRAINT "PK_4a3a8b292e0e8df37acbc47e648" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_swap_requests_status_first_date" ON "swap_requests"  ("status", "firstDate") `,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_swap_requests_period_status" ON "swap_requests"  ("rosterPeriodId", "status") `,
    );
    await queryRunner.query(
      `CREATE TABLE "swap_link_tokens" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "swapRequestId" uuid NOT NULL, "userId" uuid NOT NULL, "role" character varying(12) NOT NULL, "tokenHash" character varying(64) NOT NULL, "expiresAt" TIMESTAMP WITH TIME ZONE NOT NULL, "usedAt" TIMESTAMP WITH TIME ZONE, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "UQ_a88f0ebed59b089b34e5ab2263f" UNIQUE ("tokenHash"), CONSTRAINT "CHK_swap_link_tokens_role" CHECK ("role" IN ('colleague', 'manager')), CONSTRAINT "PK_5cc2e387459ff505eb906a862bd" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_swap_link_tokens_request" ON "swap_link_tokens"  ("swapRequestId") `,
    );
    await queryRunner.query(
      `CREATE TABLE "refresh_tokens" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "userId" uuid NOT NULL, "familyId" character varying NOT NULL, "tokenHash" character varying(64) NOT NULL, "expiresAt" TIMESTAMP WITH TIME ZONE NOT NULL, "replacedAt" TIMESTAMP WITH TIME ZONE, "revokedAt" TIMESTAMP WITH TIME ZONE, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "UQ_c25bc63d248ca90e8dcc1d92d06" UNIQUE ("tokenHash"), CONSTRAINT "PK_7d8bee0204106019488c4c50ffa" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "IDX_refresh_tokens_user" ON "refresh_tokens"  ("userId") `);
    await queryRunner.query(`CREATE INDEX "IDX_refresh_tokens_family" ON "refresh_tokens"  ("familyId") `);
    await queryRunner.query(
      `CREATE TABLE "mail_messages" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "messageId" character varying, "from" character varying(500) NOT NULL, "to" text NOT NULL, "subject" character varying(1000) NOT NULL, "text" text NOT NULL, "html" text, "receivedAt" TIMESTAMP WITH TIME ZONE NOT NULL, CONSTRAINT "PK_1bd6e76ef3b3d4aff7d0510a509" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "IDX_mail_messages_received" ON "mail_messages"  ("receivedAt") `);
    await queryRunner.query(
      `CREATE TABLE "shift_types" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "unitId" uuid NOT NULL, "code" character varying(4) NOT NULL, "name" character varying(200) NOT NULL, "start" character varying(5) NOT NULL, "end" character varying(5) NOT NULL, "paidMinutes" integer NOT NULL, "colour" character varying(16) NOT NULL, "night" boolean, CONSTRAINT "PK_5b20632c0c576fb5887e934b9c2" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_shift_types_unit_code" ON "shift_types"  ("unitId", "code") `,
    );
    await queryRunner.query(
      `CREATE TABLE "cover_pattern_rows" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "unitId" uuid NOT NULL, "weekday" integer NOT NULL, "shiftTypeId" uuid NOT NULL, "skillId" uuid, "min" integer NOT NULL, "target" integer NOT NULL, CONSTRAINT "PK_608844a456afdae595145653094" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_cover_pattern_rows_unit" ON "cover_pattern_rows"  ("unitId") `,
    );
    await queryRunner.query(
      `CREATE TABLE "cover_overrides" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "unitId" uuid NOT NULL, "date" character varying(10) NOT NULL, "shiftTypeId" uuid NOT NULL, "skillId" uuid, "min" integer NOT NULL, "target" integer NOT NULL, CONSTRAINT "PK_1a406f1395b4c8422c2303afc19" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_cover_overrides_unit_date" ON "cover_overrides"  ("unitId", "date") `,
    );
    await queryRunner.query(
      `CREATE TABLE "roster_period_changes" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "version" integer NOT NULL, "kind" character varying(16) NOT NULL, "cells" integer NOT NULL, "actorUserId" uuid, "actorName" character varying(200) NOT NULL, "at" TIMESTAMP WITH TIME ZONE NOT NULL, CONSTRAINT "CHK_roster_period_changes_kind" CHECK ("kind" IN ('edit', 'pin', 'unpin', 'generate', 'repair', 'swap', 'open-shift-claim')), CONSTRAINT "PK_1c9307b46e28c27d2c383e67a6e" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_roster_period_changes_period_version" ON "roster_period_changes"  ("rosterPeriodId", "version") `,
    );
    await queryRunner.query(
      `CREATE TABLE "solve_runs" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "status" character varying(16) NOT NULL DEFAULT 'queued', "mode" character varying(16) NOT NULL DEFAULT 'generate', "requestedById" uuid, "timeLimitSeconds" integer NOT NULL, "weights" text NOT NULL, "progress" text, "result" text, "errorMessage" text, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "startedAt" TIMESTAMP WITH TIME ZONE, "finishedAt" TIMESTAMP WITH TIME ZONE, CONSTRAINT "CHK_solve_runs_mode" CHECK ("mode" IN ('generate', 'repair')), CONSTRAINT "CHK_solve_runs_status" CHECK ("status" IN ('queued', 'running', 'finished', 'failed', 'cancelled')), CONSTRAINT "PK_4ceff025ddaec0a6091a2d5c91b" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_solve_runs_period_status" ON "solve_runs"  ("rosterPeriodId", "status") `,
    );
    await queryRunner.query(
      `CREATE TABLE "assignments" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "staffMemberId" uuid NOT NULL, "date" character varying(10) NOT NULL, "shiftTypeId" uuid, "pinned" boolean NOT NULL DEFAULT false, CONSTRAINT "PK_c54ca359535e0012b04dcbd80ee" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_assignments_period_staff_date" ON "assignments"  ("rosterPeriodId", "staffMemberId", "date") `,
    );
    await queryRunner.query(
      `CREATE TABLE "calendar_feeds" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "userId" uuid NOT NULL, "nonce" character varying(64) NOT NULL, "tokenHash" character varying(64) NOT NULL, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_045067d8bb57f971f3c5426ea71" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE UNIQUE INDEX "UQ_calendar_feeds_user" ON "calendar_feeds"  ("userId") `);
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_calendar_feeds_token_hash" ON "calendar_feeds"  ("tokenHash") `,
    );
    await queryRunner.query(
      `CREATE TABLE "calendar_feed_events" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "userId" uuid NOT NULL, "uid" character varying(200) NOT NULL, "sequence" integer NOT NULL DEFAULT '0', "contentHash" character varying(64) NOT NULL, "cancelled" boolean NOT NULL DEFAULT false, "content" text NOT NULL, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "changedAt" TIMESTAMP WITH TIME ZONE NOT NULL, CONSTRAINT "PK_93efeb6908c758a96a2436652cb" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_calendar_feed_events_user_uid" ON "calendar_feed_events"  ("userId", "uid") `,
    );
    await queryRunner.query(
      `CREATE TABLE "availability_cells" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "staffMemberId" uuid NOT NULL, "weekday" integer NOT NULL, "part" character varying(8) NOT NULL, "status" character varying(16) NOT NULL, CONSTRAINT "CHK_availability_cells_status" CHECK ("status" IN ('available', 'prefer-not', 'unavailable')), CONSTRAINT "CHK_availability_cells_part" CHECK ("part" IN ('early', 'day', 'late', 'night')), CONSTRAINT "CHK_availability_cells_weekday" CHECK ("weekday" BETWEEN 0 AND 6), CONSTRAINT "PK_d509a020fb5158284f5e5997a90" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_availability_cells_staff_weekday_part" ON "availability_cells"  ("staffMemberId", "weekday", "part") `,
    );
    await queryRunner.query(
      `CREATE TABLE "date_requests" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "staffMemberId" uuid NOT NULL, "date" character varying(10) NOT NULL, "kind" character varying(16) NOT NULL, "shiftTypeId" uuid, "note" text, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "CHK_date_requests_kind" CHECK ("kind" IN ('shiftOn', 'shiftOff', 'dayOff')), CONSTRAINT "PK_90f3e3ac60af389d4bcf449ec1e" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE UNIQUE INDEX "UQ_date_requests_period_staff_date" ON "date_requests"  ("rosterPeriodId", "staffMemberId", "date") `,
    );
    await queryRunner.query(
      `CREATE TABLE "leave_requests" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "staffMemberId" uuid NOT NULL, "startDate" character varying(10) NOT NULL, "endDate" character varying(10) NOT NULL, "type" character varying(16) NOT NULL, "status" character varying(16) NOT NULL DEFAULT 'pending', "note" text, "decisionNote" text, "decidedById" uuid, "decidedAt" TIMESTAMP WITH TIME ZONE, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "CHK_leave_requests_range" CHECK ("endDate" >= "startDate"), CONSTRAINT "CHK_leave_requests_status" CHECK ("status" IN ('pending', 'approved', 'declined', 'cancelled')), CONSTRAINT "CHK_leave_requests_type" CHECK ("type" IN ('annual', 'sick', 'other')), CONSTRAINT "PK_d3abcf9a16cef1450129e06fa9f" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_leave_requests_staff_start" ON "leave_requests"  ("staffMemberId", "startDate") `,
    );
    await queryRunner.query(
      `CREATE TABLE "outbox_messages" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "to" character varying(320) NOT NULL, "subject" character varying(1000) NOT NULL, "body" text, "status" character varying(16) NOT NULL DEFAULT 'pending', "attempts" integer NOT NULL DEFAULT '0', "nextAttemptAt" TIMESTAMP WITH TIME ZONE, "lastError" text, "createdAt" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "sentAt" TIMESTAMP WITH TIME ZONE, CONSTRAINT "CHK_outbox_messages_status" CHECK ("status" IN ('pending', 'sending', 'sent', 'failed')), CONSTRAINT "PK_0171348f527c64b137e4d4f5b66" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_outbox_messages_status_next" ON "outbox_messages"  ("status", "nextAttemptAt") `,
    );
    await queryRunner.query(
      `CREATE TABLE "audit_entries" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "actorUserId" uuid, "actorName" character varying(200) NOT NULL, "kind" character varying(32) NOT NULL, "at" TIMESTAMP WITH TIME ZONE NOT NULL, "summary" character varying(1000) NOT NULL, "before" text, "after" text, CONSTRAINT "CHK_audit_entries_kind" CHECK ("kind" IN ('publish', 'repair', 'swap', 'open-shift-claim', 'manual-edit')), CONSTRAINT "PK_6b1623bcad4d04530b76548d619" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_audit_entries_period_at" ON "audit_entries"  ("rosterPeriodId", "at") `,
    );
    await queryRunner.query(
      `CREATE TABLE "roster_publications" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "kind" character varying(16) NOT NULL, "publishedAt" TIMESTAMP WITH TIME ZONE NOT NULL, "publishedById" uuid, "cells" text NOT NULL, CONSTRAINT "PK_6df3f10e6af0a2f4372586612e6" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_roster_publications_period_at" ON "roster_publications"  ("rosterPeriodId", "publishedAt") `,
    );
    await queryRunner.query(
      `CREATE TABLE "user_units" ("userId" uuid NOT NULL, "unitId" uuid NOT NULL, CONSTRAINT "PK_398cf55969f0f0852a46fbe7678" PRIMARY KEY ("userId", "unitId"))`,
    );
    await queryRunner.query(`CREATE INDEX "IDX_b31c5490ab8f851d1a5e56eed3" ON "user_units"  ("userId") `);
    await queryRunner.query(`CREATE INDEX "IDX_eb5a24b37234fad2ed645d97b5" ON "user_units"  ("unitId") `);
    await queryRunner.query(
      `CREATE TABLE "staff_member_skills" ("staffMemberId" uuid NOT NULL, "skillId" uuid NOT NULL, CONSTRAINT "PK_f74ad86341a8a3901845127aeaf" PRIMARY KEY ("staffMemberId", "skillId"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_c9ea58ae418d0ddf64090400d4" ON "staff_member_skills"  ("staffMemberId") `,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_9978946285a31c8ab12d2ffbdf" ON "staff_member_skills"  ("skillId") `,
    );
    await queryRunner.query(
      `ALTER TABLE "units" ADD CONSTRAINT "FK_07d5402da0666b138ff0aa88154" FOREIGN KEY ("organisationId") REFERENCES "organisations"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "users" ADD CONSTRAINT "FK_4bba96961e0142c06aa921ce27f" FOREIGN KEY ("organisationId") REFERENCES "organisations"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "one_time_tokens" ADD CONSTRAINT "FK_c050f9d5e8a16e1a30a98c7257f" FOREIGN KEY ("userId") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "roster_periods" ADD CONSTRAINT "FK_7f3e24fe0c2994ee92042910015" FOREIGN KEY ("unitId") REFERENCES "units"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "contracts" ADD CONSTRAINT "FK_3682f1302d91e5aae2368a4af26" FOREIGN KEY ("organisationId") REFERENCES "organisations"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "contracts" ADD CONSTRAINT "FK_bb34baa11de346faffe4a7448b3" FOREIGN KEY ("unitId") REFERENCES "units"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "skills" ADD CONSTRAINT "FK_a90078ad9fbc553ba0d35a5f515" FOREIGN KEY ("organisationId") REFERENCES "organisations"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "staff_members" ADD CONSTRAINT "FK_5e234a0f1890c58de0046ffbad9" FOREIGN KEY ("unitId") REFERENCES "units"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "staff_members" ADD CONSTRAINT "FK_e360dda42b3876dc5a856d44ca4" FOREIGN KEY ("userId") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "staff_members" ADD CONSTRAINT "FK_985bbc21a314028c01b058dd063" FOREIGN KEY ("contractId") REFERENCES "contracts"("id") ON DELETE RESTRICT ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "swap_requests" ADD CONSTRAINT "FK_0592a33a325fc65894cc2b9d281" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "swap_requests" ADD CONSTRAINT "FK_5a0b930373a1fe13df2bf05c197" FOREIGN KEY ("proposerStaffMemberId") REFERENCES "staff_members"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "swap_requests" ADD CONSTRAINT "FK_2e249e6b99e15ab03fdc971fe31" FOREIGN KEY ("colleagueStaffMemberId") REFERENCES "staff_members"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "swap_requests" ADD CONSTRAINT "FK_8e2a958b2394aa35212a9b3f7da" FOREIGN KEY ("decidedById") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "swap_link_tokens" ADD CONSTRAINT "FK_e829dcfff63bece268ca8cd5b9f" FOREIGN KEY ("swapRequestId") REFERENCES "swap_requests"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "swap_link_tokens" ADD CONSTRAINT "FK_aad823b7dd8985b25ab8dff723c" FOREIGN KEY ("userId") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "refresh_tokens" ADD CONSTRAINT "FK_610102b60fea1455310ccd299de" FOREIGN KEY ("userId") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "shift_types" ADD CONSTRAINT "FK_ae8525d249aa42828a2ce759b80" FOREIGN KEY ("unitId") REFERENCES "units"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "cover_pattern_rows" ADD CONSTRAINT "FK_f1f5df0ecdaaf9b117bfb37c0c1" FOREIGN KEY ("unitId") REFERENCES "units"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "cover_pattern_rows" ADD CONSTRAINT "FK_54f5d2425d674d31f4d22f3b632" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "cover_pattern_rows" ADD CONSTRAINT "FK_accd30bf34f407f96afa62eb336" FOREIGN KEY ("skillId") REFERENCES "skills"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "cover_overrides" ADD CONSTRAINT "FK_b867177a7cde90fd330ef3c4390" FOREIGN KEY ("unitId") REFERENCES "units"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "cover_overrides" ADD CONSTRAINT "FK_703a01626a317eca80c6c748f4b" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "cover_overrides" ADD CONSTRAINT "FK_3526585aeeb1d352b0e70c92db8" FOREIGN KEY ("skillId") REFERENCES "skills"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "roster_period_changes" ADD CONSTRAINT "FK_cb28dd3054c16360d56dd858cbf" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "roster_period_changes" ADD CONSTRAINT "FK_b6bb7ca6ea34fb010d3a597f9f1" FOREIGN KEY ("actorUserId") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "solve_runs" ADD CONSTRAINT "FK_c1363b197dce6c9feefc2712249" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "solve_runs" ADD CONSTRAINT "FK_e601d9d06f753ca12dd7fa476ac" FOREIGN KEY ("requestedById") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "assignments" ADD CONSTRAINT "FK_32dfc79dbc98d77b679f2cf2684" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "assignments" ADD CONSTRAINT "FK_c4aa59e5adea97412b2ac84ccc8" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "assignments" ADD CONSTRAINT "FK_7655a1fb4138cd055502351d1cf" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "calendar_feeds" ADD CONSTRAINT "FK_cf31466b7789c6df501598bed0f" FOREIGN KEY ("userId") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "calendar_feed_events" ADD CONSTRAINT "FK_f92bc705543ec3e3f3052e869f3" FOREIGN KEY ("userId") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "availability_cells" ADD CONSTRAINT "FK_45b7954ef93bad45d4b408dbdfe" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "date_requests" ADD CONSTRAINT "FK_a8ad10b25f015546fbf97099a31" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "date_requests" ADD CONSTRAINT "FK_d71ad8657f14bd9e3884e8f4d74" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "date_requests" ADD CONSTRAINT "FK_c8297d08d46b222cb316ced03f5" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "leave_requests" ADD CONSTRAINT "FK_d2eae40c10414ae0780bd20ff91" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "leave_requests" ADD CONSTRAINT "FK_019fb324ca090dbdc377290cad9" FOREIGN KEY ("decidedById") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "audit_entries" ADD CONSTRAINT "FK_5408f82f6a0000d792c94f64e5c" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "audit_entries" ADD CONSTRAINT "FK_75131667de5de7246d2533dd507" FOREIGN KEY ("actorUserId") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "roster_publications" ADD CONSTRAINT "FK_6e1e3da3e411dc64567fe676db8" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "roster_publications" ADD CONSTRAINT "FK_9ea96192a059b89c7ed0114e93b" FOREIGN KEY ("publishedById") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "user_units" ADD CONSTRAINT "FK_b31c5490ab8f851d1a5e56eed3a" FOREIGN KEY ("userId") REFERENCES "users"("id") ON DELETE CASCADE ON UPDATE CASCADE`,
    );
    await queryRunner.query(
      `ALTER TABLE "user_units" ADD CONSTRAINT "FK_eb5a24b37234fad2ed645d97b5e" FOREIGN KEY ("unitId") REFERENCES "units"("id") ON DELETE CASCADE ON UPDATE CASCADE`,
    );
    await queryRunner.query(
      `ALTER TABLE "staff_member_skills" ADD CONSTRAINT "FK_c9ea58ae418d0ddf64090400d49" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members"("id") ON DELETE CASCADE ON UPDATE CASCADE`,
    );
    await queryRunner.query(
      `ALTER TABLE "staff_member_skills" ADD CONSTRAINT "FK_9978946285a31c8ab12d2ffbdf2" FOREIGN KEY ("skillId") REFERENCES "skills"("id") ON DELETE CASCADE ON UPDATE CASCADE`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE "staff_member_skills" DROP CONSTRAINT "FK_9978946285a31c8ab12d2ffbdf2"`,
    );
    await queryRunner.query(
      `ALTER TABLE "staff_member_skills" DROP CONSTRAINT "FK_c9ea58ae418d0ddf64090400d49"`,
    );
    await queryRunner.query(`ALTER TABLE "user_units" DROP CONSTRAINT "FK_eb5a24b37234fad2ed645d97b5e"`);
    await queryRunner.query(`ALTER TABLE "user_units" DROP CONSTRAINT "FK_b31c5490ab8f851d1a5e56eed3a"`);
    await queryRunner.query(
      `ALTER TABLE "roster_publications" DROP CONSTRAINT "FK_9ea96192a059b89c7ed0114e93b"`,
    );
    await queryRunner.query(
      `ALTER TABLE "roster_publications" DROP CONSTRAINT "FK_6e1e3da3e411dc64567fe676db8"`,
    );
    await queryRunner.query(`ALTER TABLE "audit_entries" DROP CONSTRAINT "FK_75131667de5de7246d2533dd507"`);
    await queryRunner.query(`ALTER TABLE "audit_entries" DROP CONSTRAINT "FK_5408f82f6a0000d792c94f64e5c"`);
    await queryRunner.query(`ALTER TABLE "leave_requests" DROP CONSTRAINT "FK_019fb324ca090dbdc377290cad9"`);
    await queryRunner.query(`ALTER TABLE "leave_requests" DROP CONSTRAINT "FK_d2eae40c10414ae0780bd20ff91"`);
    await queryRunner.query(`ALTER TABLE "date_requests" DROP CONSTRAINT "FK_c8297d08d46b222cb316ced03f5"`);
    await queryRunner.query(`ALTER TABLE "date_requests" DROP CONSTRAINT "FK_d71ad8657f14bd9e3884e8f4d74"`);
    await queryRunner.query(`ALTER TABLE "date_requests" DROP CONSTRAINT "FK_a8ad10b25f015546fbf97099a31"`);
    await queryRunner.query(
      `ALTER TABLE "availability_cells" DROP CONSTRAINT "FK_45b7954ef93bad45d4b408dbdfe"`,
    );
    await queryRunner.query(
      `ALTER TABLE "calendar_feed_events" DROP CONSTRAINT "FK_f92bc705543ec3e3f3052e869f3"`,
    );
    await queryRunner.query(`ALTER TABLE "calendar_feeds" DROP CONSTRAINT "FK_cf31466b7789c6df501598bed0f"`);
    await queryRunner.query(`ALTER TABLE "assignments" DROP CONSTRAINT "FK_7655a1fb4138cd055502351d1cf"`);
    await queryRunner.query(`ALTER TABLE "assignments" DROP CONSTRAINT "FK_c4aa59e5adea97412b2ac84ccc8"`);
    await queryRunner.query(`ALTER TABLE "assignments" DROP CONSTRAINT "FK_32dfc79dbc98d77b679f2cf2684"`);
    await queryRunner.query(`ALTER TABLE "solve_runs" DROP CONSTRAINT "FK_e601d9d06f753ca12dd7fa476ac"`);
    await queryRunner.query(`ALTER TABLE "solve_runs" DROP CONSTRAINT "FK_c1363b197dce6c9feefc2712249"`);
    await queryRunner.query(
      `ALTER TABLE "roster_period_changes" DROP CONSTRAINT "FK_b6bb7ca6ea34fb010d3a597f9f1"`,
    );
    await queryRunner.query(
      `ALTER TABLE "roster_period_changes" DROP CONSTRAINT "FK_cb28dd3054c16360d56dd858cbf"`,
    );
    await queryRunner.query(`ALTER TABLE "cover_overrides" DROP CONSTRAINT "FK_3526585aeeb1d352b0e70c92db8"`);
    await queryRunner.query(`ALTER TABLE "cover_overrides" DROP CONSTRAINT "FK_703a01626a317eca80c6c748f4b"`);
    await queryRunner.query(`ALTER TABLE "cover_overrides" DROP CONSTRAINT "FK_b867177a7cde90fd330ef3c4390"`);
    await queryRunner.query(
      `ALTER TABLE "cover_pattern_rows" DROP CONSTRAINT "FK_accd30bf34f407f96afa62eb336"`,
    );
    await queryRunner.query(
      `ALTER TABLE "cover_pattern_rows" DROP CONSTRAINT "FK_54f5d2425d674d31f4d22f3b632"`,
    );
    await queryRunner.query(
      `ALTER TABLE "cover_pattern_rows" DROP CONSTRAINT "FK_f1f5df0ecdaaf9b117bfb37c0c1"`,
    );
    await queryRunner.query(`ALTER TABLE "shift_types" DROP CONSTRAINT "FK_ae8525d249aa42828a2ce759b80"`);
    await queryRunner.query(`ALTER TABLE "refresh_tokens" DROP CONSTRAINT "FK_610102b60fea1455310ccd299de"`);
    await queryRunner.query(
      `ALTER TABLE "swap_link_tokens" DROP CONSTRAINT "FK_aad823b7dd8985b25ab8dff723c"`,
    );
    await queryRunner.query(
      `ALTER TABLE "swap_link_tokens" DROP CONSTRAINT "FK_e829dcfff63bece268ca8cd5b9f"`,
    );
    await queryRunner.query(`ALTER TABLE "swap_requests" DROP CONSTRAINT "FK_8e2a958b2394aa35212a9b3f7da"`);
    await queryRunner.query(`ALTER TABLE "swap_requests" DROP CONSTRAINT "FK_2e249e6b99e15ab03fdc971fe31"`);
    await queryRunner.query(`ALTER TABLE "swap_requests" DROP CONSTRAINT "FK_5a0b930373a1fe13df2bf05c197"`);
    await queryRunner.query(`ALTER TABLE "swap_requests" DROP CONSTRAINT "FK_0592a33a325fc65894cc2b9d281"`);
    await queryRunner.query(`ALTER TABLE "staff_members" DROP CONSTRAINT "FK_985bbc21a314028c01b058dd063"`);
    await queryRunner.query(`ALTER TABLE "staff_members" DROP CONSTRAINT "FK_e360dda42b3876dc5a856d44ca4"`);
    await queryRunner.query(`ALTER TABLE "staff_members" DROP CONSTRAINT "FK_5e234a0f1890c58de0046ffbad9"`);
    await queryRunner.query(`ALTER TABLE "skills" DROP CONSTRAINT "FK_a90078ad9fbc553ba0d35a5f515"`);
    await queryRunner.query(`ALTER TABLE "contracts" DROP CONSTRAINT "FK_bb34baa11de346faffe4a7448b3"`);
    await queryRunner.query(`ALTER TABLE "contracts" DROP CONSTRAINT "FK_3682f1302d91e5aae2368a4af26"`);
    await queryRunner.query(`ALTER TABLE "roster_periods" DROP CONSTRAINT "FK_7f3e24fe0c2994ee92042910015"`);
    await queryRunner.query(`ALTER TABLE "one_time_tokens" DROP CONSTRAINT "FK_c050f9d5e8a16e1a30a98c7257f"`);
    await queryRunner.query(`ALTER TABLE "users" DROP CONSTRAINT "FK_4bba96961e0142c06aa921ce27f"`);
    await queryRunner.query(`ALTER TABLE "units" DROP CONSTRAINT "FK_07d5402da0666b138ff0aa88154"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_9978946285a31c8ab12d2ffbdf"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_c9ea58ae418d0ddf64090400d4"`);
    await queryRunner.query(`DROP TABLE "staff_member_skills"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_eb5a24b37234fad2ed645d97b5"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_b31c5490ab8f851d1a5e56eed3"`);
    await queryRunner.query(`DROP TABLE "user_units"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_roster_publications_period_at"`);
    await queryRunner.query(`DROP TABLE "roster_publications"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_audit_entries_period_at"`);
    await queryRunner.query(`DROP TABLE "audit_entries"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_outbox_messages_status_next"`);
    await queryRunner.query(`DROP TABLE "outbox_messages"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_leave_requests_staff_start"`);
    await queryRunner.query(`DROP TABLE "leave_requests"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_date_requests_period_staff_date"`);
    await queryRunner.query(`DROP TABLE "date_requests"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_availability_cells_staff_weekday_part"`);
    await queryRunner.query(`DROP TABLE "availability_cells"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_calendar_feed_events_user_uid"`);
    await queryRunner.query(`DROP TABLE "calendar_feed_events"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_calendar_feeds_token_hash"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_calendar_feeds_user"`);
    await queryRunner.query(`DROP TABLE "calendar_feeds"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_assignments_period_staff_date"`);
    await queryRunner.query(`DROP TABLE "assignments"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_solve_runs_period_status"`);
    await queryRunner.query(`DROP TABLE "solve_runs"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_roster_period_changes_period_version"`);
    await queryRunner.query(`DROP TABLE "roster_period_changes"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_cover_overrides_unit_date"`);
    await queryRunner.query(`DROP TABLE "cover_overrides"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_cover_pattern_rows_unit"`);
    await queryRunner.query(`DROP TABLE "cover_pattern_rows"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_shift_types_unit_code"`);
    await queryRunner.query(`DROP TABLE "shift_types"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_mail_messages_received"`);
    await queryRunner.query(`DROP TABLE "mail_messages"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_refresh_tokens_family"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_refresh_tokens_user"`);
    await queryRunner.query(`DROP TABLE "refresh_tokens"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_swap_link_tokens_request"`);
    await queryRunner.query(`DROP TABLE "swap_link_tokens"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_swap_requests_period_status"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_swap_requests_status_first_date"`);
    await queryRunner.query(`DROP TABLE "swap_requests"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_staff_members_unit_user"`);
    await queryRunner.query(`DROP TABLE "staff_members"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_skills_organisation_code"`);
    await queryRunner.query(`DROP TABLE "skills"`);
    await queryRunner.query(`DROP TABLE "contracts"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_roster_periods_unit_start"`);
    await queryRunner.query(`DROP TABLE "roster_periods"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_one_time_tokens_user"`);
    await queryRunner.query(`DROP TABLE "one_time_tokens"`);
    await queryRunner.query(`DROP TABLE "users"`);
    await queryRunner.query(`DROP INDEX "public"."UQ_units_organisation_name"`);
    await queryRunner.query(`DROP TABLE "units"`);
    await queryRunner.query(`DROP TABLE "organisations"`);
  }
}
