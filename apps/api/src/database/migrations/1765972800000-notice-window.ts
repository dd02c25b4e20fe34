import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Changes to a published roster inside a notice window: the organisation's window (default 14 days,
 * as US fair-workweek laws such as Seattle SMC 14.22 ask) and optional predictability-pay recording,
 * and one `late_changes` row per changed cell inside the window. The organisation's columns are
 * plain added columns with constant defaults (no table rebuild); the table as TypeORM's schema diff
 * writes it for SQLite.
 */
export class NoticeWindow1765972800000 implements MigrationInterface {
  name = 'NoticeWindow1765972800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "organisations" ADD COLUMN "noticeWindowDays" integer NOT NULL DEFAULT (14)`);
    await q.query(
      `ALTER TABLE "organisations" ADD COLUMN "recordPredictabilityPay" boolean NOT NULL DEFAULT (0)`,
    );
    await q.query(
      `ALTER TABLE "organisations" ADD COLUMN "predictabilityPayHours" real NOT NULL DEFAULT (1)`,
    );
    await q.query(
      `ALTER TABLE "organisations" ADD COLUMN "predictabilityPayRule" varchar(500) NOT NULL DEFAULT ('')`,
    );
    await q.query(
      `CREATE TABLE "late_changes" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "version" integer NOT NULL, "kind" varchar(16) NOT NULL, "initiatedBy" varchar(16) NOT NULL, "staffMemberId" varchar NOT NULL, "staffName" varchar(200) NOT NULL, "date" varchar(10) NOT NULL, "shiftBefore" varchar(200), "shiftAfter" varchar(200), "daysNotice" integer NOT NULL, "noticeWindowDays" integer NOT NULL, "payHours" real, "payRule" varchar(500), "reason" varchar(500) NOT NULL, "actorName" varchar(200) NOT NULL, "at" datetime NOT NULL, CONSTRAINT "CHK_late_changes_initiated_by" CHECK ("initiatedBy" IN ('employer', 'employee')), CONSTRAINT "FK_3fec45d787a50ff93d2d9a9c8c5" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_late_changes_period" ON "late_changes" ("rosterPeriodId", "version") `);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_late_changes_period"`);
    await q.query(`DROP TABLE "late_changes"`);
    await q.query(`ALTER TABLE "organisations" DROP COLUMN "predictabilityPayRule"`);
    await q.query(`ALTER TABLE "organisations" DROP COLUMN "predictabilityPayHours"`);
    await q.query(`ALTER TABLE "organisations" DROP COLUMN "recordPredictabilityPay"`);
    await q.query(`ALTER TABLE "organisations" DROP COLUMN "noticeWindowDays"`);
  }
}
