import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * PostgreSQL's twin of UnitPublishLead1765713600000, written by TypeORM's schema diff
 * (generate-postgres-migration.ts, run for Demand1765800000000 and split by table). Default 42 days:
 * the 6 weeks many hospitals aim for (Drake, J Adv Nurs 2018;74(8):1831-38).
 */
export class UnitPublishLead1765713600000 implements MigrationInterface {
  name = 'UnitPublishLead1765713600000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "units" ADD "publishLeadDays" integer NOT NULL DEFAULT '42'`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "units" DROP COLUMN "publishLeadDays"`);
  }
}
