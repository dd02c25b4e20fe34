import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * PostgreSQL's twin of OpenShiftOutsideOffers1765886400000, written by TypeORM's schema diff
 * (generate-postgres-migration.ts), with the audit kind 'open-shift-outside' added to
 * CHK_audit_entries_kind by hand (the diff does not compare CHECK constraints).
 */
export class OpenShiftOutsideOffers1765886400000 implements MigrationInterface {
  name = 'OpenShiftOutsideOffers1765886400000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "open_shift_outside_offers" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "date" character varying(10) NOT NULL, "shiftTypeId" uuid NOT NULL, "skillId" uuid, "offeredTo" character varying(200) NOT NULL, "note" character varying(500), "status" character varying(12) NOT NULL, "people" integer, "offeredById" uuid, "offeredByName" character varying(200) NOT NULL, "offeredAt" TIMESTAMP WITH TIME ZONE NOT NULL, "updatedAt" TIMESTAMP WITH TIME ZONE NOT NULL, CONSTRAINT "CHK_open_shift_outside_offers_status" CHECK ("status" IN ('offered', 'filled', 'withdrawn')), CONSTRAINT "PK_cf1422983fcde72896edbd79770" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_open_shift_outside_offers_period_date" ON "open_shift_outside_offers"  ("rosterPeriodId", "date") `,
    );
    await queryRunner.query(
      `ALTER TABLE "open_shift_outside_offers" ADD CONSTRAINT "FK_169457b3adb4ad1b204c012f065" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "open_shift_outside_offers" ADD CONSTRAINT "FK_c6558c8074fe07800f64efd9540" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "open_shift_outside_offers" ADD CONSTRAINT "FK_b2b1bd80f8816cc2dbebea06e42" FOREIGN KEY ("offeredById") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(`ALTER TABLE "audit_entries" DROP CONSTRAINT "CHK_audit_entries_kind"`);
    await queryRunner.query(
      `ALTER TABLE "audit_entries" ADD CONSTRAINT "CHK_audit_entries_kind" CHECK ("kind" IN ('publish', 'repair', 'swap', 'open-shift-claim', 'manual-edit', 'open-shift-outside'))`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DELETE FROM "audit_entries" WHERE "kind" = 'open-shift-outside'`);
    await queryRunner.query(`ALTER TABLE "audit_entries" DROP CONSTRAINT "CHK_audit_entries_kind"`);
    await queryRunner.query(
      `ALTER TABLE "audit_entries" ADD CONSTRAINT "CHK_audit_entries_kind" CHECK ("kind" IN ('publish', 'repair', 'swap', 'open-shift-claim', 'manual-edit'))`,
    );
    await queryRunner.query(
      `ALTER TABLE "open_shift_outside_offers" DROP CONSTRAINT "FK_b2b1bd80f8816cc2dbebea06e42"`,
    );
    await queryRunner.query(
      `ALTER TABLE "open_shift_outside_offers" DROP CONSTRAINT "FK_c6558c8074fe07800f64efd9540"`,
    );
    await queryRunner.query(
      `ALTER TABLE "open_shift_outside_offers" DROP CONSTRAINT "FK_169457b3adb4ad1b204c012f065"`,
    );
    await queryRunner.query(`DROP INDEX "public"."IDX_open_shift_outside_offers_period_date"`);
    await queryRunner.query(`DROP TABLE "open_shift_outside_offers"`);
  }
}
