import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Solving: solve runs of a roster period and the period's assignments (the roster's cells). SQL as
 * TypeORM's schema diff writes it for the entities (constraint names included), so
 * migrations.spec.ts finds nothing left to change.
 */
export class Solving1764806400000 implements MigrationInterface {
  name = 'Solving1764806400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "solve_runs" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "status" varchar(16) NOT NULL DEFAULT ('queued'), "requestedById" varchar, "timeLimitSeconds" integer NOT NULL, "weights" text NOT NULL, "progress" text, "result" text, "errorMessage" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "startedAt" datetime, "finishedAt" datetime, CONSTRAINT "CHK_solve_runs_status" CHECK ("status" IN ('queued', 'running', 'finished', 'failed', 'cancelled')), CONSTRAINT "FK_c1363b197dce6c9feefc2712249" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_e601d9d06f753ca12dd7fa476ac" FOREIGN KEY ("requestedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_solve_runs_period_status" ON "solve_runs" ("rosterPeriodId", "status")`);
    await q.query(
      `CREATE TABLE "assignments" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "staffMemberId" varchar NOT NULL, "date" varchar(10) NOT NULL, "shiftTypeId" varchar, "pinned" boolean NOT NULL DEFAULT (0), CONSTRAINT "FK_32dfc79dbc98d77b679f2cf2684" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_c4aa59e5adea97412b2ac84ccc8" FOREIGN KEY ("staffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_7655a1fb4138cd055502351d1cf" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE UNIQUE INDEX "UQ_assignments_period_staff_date" ON "assignments" ("rosterPeriodId", "staffMemberId", "date")`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "UQ_assignments_period_staff_date"`);
    await q.query(`DROP TABLE "assignments"`);
    await q.query(`DROP INDEX "IDX_solve_runs_period_status"`);
    await q.query(`DROP TABLE "solve_runs"`);
  }
}
