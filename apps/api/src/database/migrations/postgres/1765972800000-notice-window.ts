import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * PostgreSQL's twin of NoticeWindow1765972800000 (the organisation's notice window and predictability
 * pay, and the late_changes table), written by TypeORM's schema diff (generate-postgres-migration.ts).
 */
export class NoticeWindow1765972800000 implements MigrationInterface {
  name = 'NoticeWindow1765972800000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "late_changes" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "version" integer NOT NULL, "kind" character varying(16) NOT NULL, "initiatedBy" character varying(16) NOT NULL, "staffMemberId" character varying NOT NULL, "staffName" character varying(200) NOT NULL, "date" character varying(10) NOT NULL, "shiftBefore" character varying(200), "shiftAfter" character varying(200), "daysNotice" integer NOT NULL, "noticeWindowDays" integer NOT NULL, "payHours" real, "payRule" character varying(500), "reason" character varying(500) NOT NULL, "actorName" character varying(200) NOT NULL, "at" TIMESTAMP WITH TIME ZONE NOT NULL, CONSTRAINT "CHK_late_changes_initiated_by" CHECK ("initiatedBy" IN ('employer', 'employee')), CONSTRAINT "PK_b73724cfa1fc0d5d8041ffd9cb4" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_late_changes_period" ON "late_changes"  ("rosterPeriodId", "version") `,
    );
    await queryRunner.query(
      `ALTER TABLE "organisations" ADD "noticeWindowDays" integer NOT NULL DEFAULT '14'`,
    );
    await queryRunner.query(
      `ALTER TABLE "organisations" ADD "recordPredictabilityPay" boolean NOT NULL DEFAULT false`,
    );
    await queryRunner.query(
      `ALTER TABLE "organisations" ADD "predictabilityPayHours" real NOT NULL DEFAULT '1'`,
    );
    await queryRunner.query(
      `ALTER TABLE "organisations" ADD "predictabilityPayRule" character varying(500) NOT NULL DEFAULT ''`,
    );
    await queryRunner.query(
      `ALTER TABLE "late_changes" ADD CONSTRAINT "FK_3fec45d787a50ff93d2d9a9c8c5" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "late_changes" DROP CONSTRAINT "FK_3fec45d787a50ff93d2d9a9c8c5"`);
    await queryRunner.query(`ALTER TABLE "organisations" DROP COLUMN "predictabilityPayRule"`);
    await queryRunner.query(`ALTER TABLE "organisations" DROP COLUMN "predictabilityPayHours"`);
    await queryRunner.query(`ALTER TABLE "organisations" DROP COLUMN "recordPredictabilityPay"`);
    await queryRunner.query(`ALTER TABLE "organisations" DROP COLUMN "noticeWindowDays"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_late_changes_period"`);
    await queryRunner.query(`DROP TABLE "late_changes"`);
  }
}
