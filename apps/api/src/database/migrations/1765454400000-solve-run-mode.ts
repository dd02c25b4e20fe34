import { type MigrationInterface, type QueryRunner } from 'typeorm';

const COLUMNS = `"id", "rosterPeriodId", "status", "requestedById", "timeLimitSeconds", "weights", "progress", "result", "errorMessage", "createdAt", "startedAt", "finishedAt"`;
const TABLE = `"id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "status" varchar(16) NOT NULL DEFAULT ('queued'), "requestedById" varchar, "timeLimitSeconds" integer NOT NULL, "weights" text NOT NULL, "progress" text, "result" text, "errorMessage" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "startedAt" datetime, "finishedAt" datetime`;
const STATUS = `CONSTRAINT "CHK_solve_runs_status" CHECK (("status" IN ('queued', 'running', 'finished', 'failed', 'cancelled')))`;
const KEYS = `CONSTRAINT "FK_e601d9d06f753ca12dd7fa476ac" FOREIGN KEY ("requestedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION, CONSTRAINT "FK_c1363b197dce6c9feefc2712249" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION`;

/**
 * Solve runs keep their mode (`generate` a draft or `repair` a published roster) instead of the
 * server holding it in memory. Existing runs started after their period was first published were
 * repairs (only a draft can be generated). Table rebuild as TypeORM's schema diff writes it.
 */
export class SolveRunMode1765454400000 implements MigrationInterface {
  name = 'SolveRunMode1765454400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_solve_runs_period_status"`);
    await q.query(
      `CREATE TABLE "temporary_solve_runs" (${TABLE}, "mode" varchar(16) NOT NULL DEFAULT ('generate'), ${STATUS}, ` +
        `CONSTRAINT "CHK_solve_runs_mode" CHECK ("mode" IN ('generate', 'repair')), ${KEYS})`,
    );
    await q.query(
      `INSERT INTO "temporary_solve_runs"(${COLUMNS}, "mode") SELECT ${COLUMNS}, CASE WHEN EXISTS (` +
        `SELECT 1 FROM "roster_publications" p WHERE p."rosterPeriodId" = "solve_runs"."rosterPeriodId" ` +
        `AND p."kind" = 'publish' AND p."publishedAt" <= "solve_runs"."createdAt") THEN 'repair' ELSE 'generate' END ` +
        `FROM "solve_runs"`,
    );
    await q.query(`DROP TABLE "solve_runs"`);
    await q.query(`ALTER TABLE "temporary_solve_runs" RENAME TO "solve_runs"`);
    await q.query(
      `CREATE INDEX "IDX_solve_runs_period_status" ON "solve_runs" ("rosterPeriodId", "status") `,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_solve_runs_period_status"`);
    await q.query(`ALTER TABLE "solve_runs" RENAME TO "temporary_solve_runs"`);
    await q.query(`CREATE TABLE "solve_runs" (${TABLE}, ${STATUS}, ${KEYS})`);
    await q.query(`INSERT INTO "solve_runs"(${COLUMNS}) SELECT ${COLUMNS} FROM "temporary_solve_runs"`);
    await q.query(`DROP TABLE "temporary_solve_runs"`);
    await q.query(
      `CREATE INDEX "IDX_solve_runs_period_status" ON "solve_runs" ("rosterPeriodId", "status") `,
    );
  }
}
