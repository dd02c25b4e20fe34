import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Every change of a period's cells raises its version and leaves a row here (kind, cells, who), so
 * a publish with a stale version can say what changed. As TypeORM's schema diff writes it.
 */
export class RosterPeriodChanges1765540800000 implements MigrationInterface {
  name = 'RosterPeriodChanges1765540800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "roster_period_changes" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "version" integer NOT NULL, "kind" varchar(16) NOT NULL, "cells" integer NOT NULL, "actorUserId" varchar, "actorName" varchar(200) NOT NULL, "at" datetime NOT NULL, CONSTRAINT "CHK_roster_period_changes_kind" CHECK ("kind" IN ('edit', 'pin', 'unpin', 'generate', 'repair', 'swap', 'open-shift-claim')), CONSTRAINT "FK_cb28dd3054c16360d56dd858cbf" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_b6bb7ca6ea34fb010d3a597f9f1" FOREIGN KEY ("actorUserId") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE INDEX "IDX_roster_period_changes_period_version" ON "roster_period_changes" ("rosterPeriodId", "version") `,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_roster_period_changes_period_version"`);
    await q.query(`DROP TABLE "roster_period_changes"`);
  }
}
