import { type MigrationInterface, type QueryRunner } from 'typeorm';

/** PostgreSQL's twin of Demand1765800000000, written by TypeORM's schema diff (generate-postgres-migration.ts). */
export class Demand1765800000000 implements MigrationInterface {
  name = 'Demand1765800000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "unit_demands" ("unitId" uuid NOT NULL, "contactCentre" text, "ward" text, "updatedAt" TIMESTAMP WITH TIME ZONE NOT NULL, "updatedById" uuid, CONSTRAINT "PK_ee3cd7b65015756cc804ff99faa" PRIMARY KEY ("unitId"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "demand_acceptances" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "rosterPeriodId" uuid NOT NULL, "actorUserId" uuid, "actorName" character varying(200) NOT NULL, "at" TIMESTAMP WITH TIME ZONE NOT NULL, "written" integer NOT NULL, "summary" character varying(1000) NOT NULL, "before" text, "after" text, CONSTRAINT "PK_0998f1258e715c78f9b87162cbc" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE INDEX "IDX_demand_acceptances_period_at" ON "demand_acceptances"  ("rosterPeriodId", "at") `,
    );
    await queryRunner.query(
      `ALTER TABLE "unit_demands" ADD CONSTRAINT "FK_ee3cd7b65015756cc804ff99faa" FOREIGN KEY ("unitId") REFERENCES "units"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "unit_demands" ADD CONSTRAINT "FK_ef29949d30c5cdef5e0c72ecff1" FOREIGN KEY ("updatedById") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "demand_acceptances" ADD CONSTRAINT "FK_ba547c28d3f066a6ca94abb8f1b" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "demand_acceptances" ADD CONSTRAINT "FK_32189b02789b40928904c535e86" FOREIGN KEY ("actorUserId") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `ALTER TABLE "demand_acceptances" DROP CONSTRAINT "FK_32189b02789b40928904c535e86"`,
    );
    await queryRunner.query(
      `ALTER TABLE "demand_acceptances" DROP CONSTRAINT "FK_ba547c28d3f066a6ca94abb8f1b"`,
    );
    await queryRunner.query(`ALTER TABLE "unit_demands" DROP CONSTRAINT "FK_ef29949d30c5cdef5e0c72ecff1"`);
    await queryRunner.query(`ALTER TABLE "unit_demands" DROP CONSTRAINT "FK_ee3cd7b65015756cc804ff99faa"`);
    await queryRunner.query(`DROP INDEX "public"."IDX_demand_acceptances_period_at"`);
    await queryRunner.query(`DROP TABLE "demand_acceptances"`);
    await queryRunner.query(`DROP TABLE "unit_demands"`);
  }
}
