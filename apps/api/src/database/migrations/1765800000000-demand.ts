import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * A unit's demand (contact forecast, ward patients and ratios, as JSON documents) and the record
 * of every demand plan accepted into a period's cover needs. As TypeORM's schema diff writes it.
 */
export class Demand1765800000000 implements MigrationInterface {
  name = 'Demand1765800000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "unit_demands" ("unitId" varchar PRIMARY KEY NOT NULL, "contactCentre" text, "ward" text, "updatedAt" datetime NOT NULL, "updatedById" varchar, CONSTRAINT "FK_ee3cd7b65015756cc804ff99faa" FOREIGN KEY ("unitId") REFERENCES "units" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_ef29949d30c5cdef5e0c72ecff1" FOREIGN KEY ("updatedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE TABLE "demand_acceptances" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "actorUserId" varchar, "actorName" varchar(200) NOT NULL, "at" datetime NOT NULL, "written" integer NOT NULL, "summary" varchar(1000) NOT NULL, "before" text, "after" text, CONSTRAINT "FK_ba547c28d3f066a6ca94abb8f1b" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_32189b02789b40928904c535e86" FOREIGN KEY ("actorUserId") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE INDEX "IDX_demand_acceptances_period_at" ON "demand_acceptances" ("rosterPeriodId", "at") `,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_demand_acceptances_period_at"`);
    await q.query(`DROP TABLE "demand_acceptances"`);
    await q.query(`DROP TABLE "unit_demands"`);
  }
}
