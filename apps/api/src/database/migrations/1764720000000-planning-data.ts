import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Planning data: skills, shift types, contracts, staff members and their skills, the weekly cover
 * pattern and its date overrides, roster periods. SQL as TypeORM's schema diff writes it for the
 * entities (constraint names included), so migrations.spec.ts finds nothing left to change.
 */
export class PlanningData1764720000000 implements MigrationInterface {
  name = 'PlanningData1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "skills" ("id" varchar PRIMARY KEY NOT NULL, "organisationId" varchar NOT NULL, "code" varchar(16) NOT NULL, "name" varchar(200) NOT NULL, CONSTRAINT "FK_a90078ad9fbc553ba0d35a5f515" FOREIGN KEY ("organisationId") REFERENCES "organisations" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE UNIQUE INDEX "UQ_skills_organisation_code" ON "skills" ("organisationId", "code")`);
    await q.query(
      `CREATE TABLE "shift_types" ("id" varchar PRIMARY KEY NOT NULL, "unitId" varchar NOT NULL, "code" varchar(4) NOT NULL, "name" varchar(200) NOT NULL, "start" varchar(5) NOT NULL, "end" varchar(5) NOT NULL, "paidMinutes" integer NOT NULL, "colour" varchar(16) NOT NULL, "night" boolean, CONSTRAINT "FK_ae8525d249aa42828a2ce759b80" FOREIGN KEY ("unitId") REFERENCES "units" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE UNIQUE INDEX "UQ_shift_types_unit_code" ON "shift_types" ("unitId", "code")`);
    await q.query(
      `CREATE TABLE "contracts" ("id" varchar PRIMARY KEY NOT NULL, "organisationId" varchar NOT NULL, "unitId" varchar, "name" varchar(200) NOT NULL, "maxShiftsPerType" text, "minPaidMinutes" integer, "maxPaidMinutes" integer, "targetPaidMinutes" integer, "maxConsecutiveWorkDays" integer, "minConsecutiveWorkDays" integer, "minConsecutiveDaysOff" integer, "maxWeekends" integer, "maxConsecutiveNights" integer, "minRestMinutes" integer, CONSTRAINT "FK_3682f1302d91e5aae2368a4af26" FOREIGN KEY ("organisationId") REFERENCES "organisations" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_bb34baa11de346faffe4a7448b3" FOREIGN KEY ("unitId") REFERENCES "units" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE TABLE "staff_members" ("id" varchar PRIMARY KEY NOT NULL, "unitId" varchar NOT NULL, "userId" varchar, "name" varchar(200) NOT NULL, "email" varchar(254), "contractId" varchar, "hourlyCost" real, "active" boolean NOT NULL DEFAULT (1), CONSTRAINT "FK_5e234a0f1890c58de0046ffbad9" FOREIGN KEY ("unitId") REFERENCES "units" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_e360dda42b3876dc5a856d44ca4" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION, CONSTRAINT "FK_985bbc21a314028c01b058dd063" FOREIGN KEY ("contractId") REFERENCES "contracts" ("id") ON DELETE RESTRICT ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE UNIQUE INDEX "UQ_staff_members_unit_user" ON "staff_members" ("unitId", "userId")`);
    await q.query(
      `CREATE TABLE "cover_pattern_rows" ("id" varchar PRIMARY KEY NOT NULL, "unitId" varchar NOT NULL, "weekday" integer NOT NULL, "shiftTypeId" varchar NOT NULL, "skillId" varchar, "min" integer NOT NULL, "target" integer NOT NULL, CONSTRAINT "FK_f1f5df0ecdaaf9b117bfb37c0c1" FOREIGN KEY ("unitId") REFERENCES "units" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_54f5d2425d674d31f4d22f3b632" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_accd30bf34f407f96afa62eb336" FOREIGN KEY ("skillId") REFERENCES "skills" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_cover_pattern_rows_unit" ON "cover_pattern_rows" ("unitId")`);
    await q.query(
      `CREATE TABLE "cover_overrides" ("id" varchar PRIMARY KEY NOT NULL, "unitId" varchar NOT NULL, "date" varchar(10) NOT NULL, "shiftTypeId" varchar NOT NULL, "skillId" varchar, "min" integer NOT NULL, "target" integer NOT NULL, CONSTRAINT "FK_b867177a7cde90fd330ef3c4390" FOREIGN KEY ("unitId") REFERENCES "units" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_703a01626a317eca80c6c748f4b" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_3526585aeeb1d352b0e70c92db8" FOREIGN KEY ("skillId") REFERENCES "skills" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_cover_overrides_unit_date" ON "cover_overrides" ("unitId", "date")`);
    await q.query(
      `CREATE TABLE "roster_periods" ("id" varchar PRIMARY KEY NOT NULL, "unitId" varchar NOT NULL, "startDate" varchar(10) NOT NULL, "days" integer NOT NULL, "status" varchar(16) NOT NULL DEFAULT ('draft'), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "publishedAt" datetime, "version" integer NOT NULL, CONSTRAINT "CHK_roster_periods_status" CHECK ("status" IN ('draft', 'published', 'archived')), CONSTRAINT "FK_7f3e24fe0c2994ee92042910015" FOREIGN KEY ("unitId") REFERENCES "units" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_roster_periods_unit_start" ON "roster_periods" ("unitId", "startDate")`);
    await q.query(
      `CREATE TABLE "staff_member_skills" ("staffMemberId" varchar NOT NULL, "skillId" varchar NOT NULL, CONSTRAINT "FK_c9ea58ae418d0ddf64090400d49" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE CASCADE, CONSTRAINT "FK_9978946285a31c8ab12d2ffbdf2" FOREIGN KEY ("skillId") REFERENCES "skills" ("id") ON DELETE CASCADE ON UPDATE CASCADE, PRIMARY KEY ("staffMemberId", "skillId"))`,
    );
    await q.query(`CREATE INDEX "IDX_c9ea58ae418d0ddf64090400d4" ON "staff_member_skills" ("staffMemberId")`);
    await q.query(`CREATE INDEX "IDX_9978946285a31c8ab12d2ffbdf" ON "staff_member_skills" ("skillId")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_9978946285a31c8ab12d2ffbdf"`);
    await q.query(`DROP INDEX "IDX_c9ea58ae418d0ddf64090400d4"`);
    await q.query(`DROP TABLE "staff_member_skills"`);
    await q.query(`DROP INDEX "IDX_roster_periods_unit_start"`);
    await q.query(`DROP TABLE "roster_periods"`);
    await q.query(`DROP INDEX "IDX_cover_overrides_unit_date"`);
    await q.query(`DROP TABLE "cover_overrides"`);
    await q.query(`DROP INDEX "IDX_cover_pattern_rows_unit"`);
    await q.query(`DROP TABLE "cover_pattern_rows"`);
    await q.query(`DROP INDEX "UQ_staff_members_unit_user"`);
    await q.query(`DROP TABLE "staff_members"`);
    await q.query(`DROP TABLE "contracts"`);
    await q.query(`DROP INDEX "UQ_shift_types_unit_code"`);
    await q.query(`DROP TABLE "shift_types"`);
    await q.query(`DROP INDEX "UQ_skills_organisation_code"`);
    await q.query(`DROP TABLE "skills"`);
  }
}
