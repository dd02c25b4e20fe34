import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Units keep a publish lead time: the days before a period starts by which its roster should be
 * published (default 42, the 6 weeks many hospitals aim for before a roster starts; Drake, J Adv
 * Nurs 2018;74(8):1831-38, as in publishing/publish-check.ts). A plain added column with a constant
 * default, as TypeORM's schema diff writes it for SQLite.
 */
export class UnitPublishLead1765713600000 implements MigrationInterface {
  name = 'UnitPublishLead1765713600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "units" ADD COLUMN "publishLeadDays" integer NOT NULL DEFAULT (42)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "units" DROP COLUMN "publishLeadDays"`);
  }
}
