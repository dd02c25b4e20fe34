import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Staff input: weekly availability cells, date requests, leave requests, and the per-period limit of
 * date requests. SQL as TypeORM's schema diff writes it for the entities (constraint names included),
 * so migrations.spec.ts finds nothing left to change. The limit is added with ALTER TABLE (not by
 * rebuilding roster_periods, which would cascade-delete the periods' runs and assignments).
 */
export class Requests1764979200000 implements MigrationInterface {
  name = 'Requests1764979200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "roster_periods" ADD COLUMN "requestLimit" integer NOT NULL DEFAULT (5)`);
    await q.query(
      `CREATE TABLE "availability_cells" ("id" varchar PRIMARY KEY NOT NULL, "staffMemberId" varchar NOT NULL, "weekday" integer NOT NULL, "part" varchar(8) NOT NULL, "status" varchar(16) NOT NULL, CONSTRAINT "CHK_availability_cells_status" CHECK ("status" IN ('available', 'prefer-not', 'unavailable')), CONSTRAINT "CHK_availability_cells_part" CHECK ("part" IN ('early', 'day', 'late', 'night')), CONSTRAINT "CHK_availability_cells_weekday" CHECK ("weekday" BETWEEN 0 AND 6), CONSTRAINT "FK_45b7954ef93bad45d4b408dbdfe" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE UNIQUE INDEX "UQ_availability_cells_staff_weekday_part" ON "availability_cells" ("staffMemberId", "weekday", "part") `,
    );
    await q.query(
      `CREATE TABLE "date_requests" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "staffMemberId" varchar NOT NULL, "date" varchar(10) NOT NULL, "kind" varchar(16) NOT NULL, "shiftTypeId" varchar, "note" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "CHK_date_requests_kind" CHECK ("kind" IN ('shiftOn', 'shiftOff', 'dayOff')), CONSTRAINT "FK_a8ad10b25f015546fbf97099a31" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_d71ad8657f14bd9e3884e8f4d74" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_c8297d08d46b222cb316ced03f5" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE UNIQUE INDEX "UQ_date_requests_period_staff_date" ON "date_requests" ("rosterPeriodId", "staffMemberId", "date") `,
    );
    await q.query(
      `CREATE TABLE "leave_requests" ("id" varchar PRIMARY KEY NOT NULL, "staffMemberId" varchar NOT NULL, "startDate" varchar(10) NOT NULL, "endDate" varchar(10) NOT NULL, "type" varchar(16) NOT NULL, "status" varchar(16) NOT NULL DEFAULT ('pending'), "note" text, "decisionNote" text, "decidedById" varchar, "decidedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "CHK_leave_requests_range" CHECK ("endDate" >= "startDate"), CONSTRAINT "CHK_leave_requests_status" CHECK ("status" IN ('pending', 'approved', 'declined', 'cancelled')), CONSTRAINT "CHK_leave_requests_type" CHECK ("type" IN ('annual', 'sick', 'other')), CONSTRAINT "FK_d2eae40c10414ae0780bd20ff91" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_019fb324ca090dbdc377290cad9" FOREIGN KEY ("decidedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE INDEX "IDX_leave_requests_staff_start" ON "leave_requests" ("staffMemberId", "startDate") `,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_leave_requests_staff_start"`);
    await q.query(`DROP TABLE "leave_requests"`);
    await q.query(`DROP INDEX "UQ_date_requests_period_staff_date"`);
    await q.query(`DROP TABLE "date_requests"`);
    await q.query(`DROP INDEX "UQ_availability_cells_staff_weekday_part"`);
    await q.query(`DROP TABLE "availability_cells"`);
    await q.query(`ALTER TABLE "roster_periods" DROP COLUMN "requestLimit"`);
  }
}
