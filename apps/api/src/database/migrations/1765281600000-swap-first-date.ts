import { type MigrationInterface, type QueryRunner } from 'typeorm';

const COLUMNS = `"id", "rosterPeriodId", "unitId", "kind", "status", "proposerStaffMemberId", "colleagueStaffMemberId", "skillId", "changes", "note", "outcome", "decidedById", "createdAt", "updatedAt", "version"`;
const CONSTRAINTS = `CONSTRAINT "CHK_swap_requests_status" CHECK (("status" IN ('proposed', 'accepted', 'declined', 'approved', 'refused', 'cancelled', 'expired'))), CONSTRAINT "CHK_swap_requests_kind" CHECK (("kind" IN ('swap', 'offer', 'claim'))), CONSTRAINT "FK_8e2a958b2394aa35212a9b3f7da" FOREIGN KEY ("decidedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION, CONSTRAINT "FK_2e249e6b99e15ab03fdc971fe31" FOREIGN KEY ("colleagueStaffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_5a0b930373a1fe13df2bf05c197" FOREIGN KEY ("proposerStaffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_0592a33a325fc65894cc2b9d281" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION`;
const TABLE = `"id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "unitId" varchar NOT NULL, "kind" varchar(8) NOT NULL, "status" varchar(12) NOT NULL, "proposerStaffMemberId" varchar NOT NULL, "colleagueStaffMemberId" varchar, "skillId" varchar, "changes" text NOT NULL, "note" varchar(500), "outcome" varchar(1000), "decidedById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "version" integer NOT NULL`;

/**
 * Swap requests keep the first day they change (`firstDate`), indexed with the status, so the
 * scheduled expiry finds overdue requests in one statement. Existing rows get it from their
 * `changes` JSON. Table rebuild as TypeORM's schema diff writes it (SQLite cannot add a NOT NULL
 * column without a default); TypeORM turns foreign keys off while migrations run, so dropping the
 * old table cascades to nothing.
 */
export class SwapFirstDate1765281600000 implements MigrationInterface {
  name = 'SwapFirstDate1765281600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_swap_requests_period_status"`);
    await q.query(
      `CREATE TABLE "temporary_swap_requests" (${TABLE}, "firstDate" varchar(10) NOT NULL, ${CONSTRAINTS})`,
    );
    await q.query(
      `INSERT INTO "temporary_swap_requests"(${COLUMNS}, "firstDate") SELECT ${COLUMNS}, ` +
        `(SELECT MIN(json_extract(c.value, '$.date')) FROM json_each("changes") c) FROM "swap_requests"`,
    );
    await q.query(`DROP TABLE "swap_requests"`);
    await q.query(`ALTER TABLE "temporary_swap_requests" RENAME TO "swap_requests"`);
    await q.query(
      `CREATE INDEX "IDX_swap_requests_period_status" ON "swap_requests" ("rosterPeriodId", "status") `,
    );
    await q.query(
      `CREATE INDEX "IDX_swap_requests_status_first_date" ON "swap_requests" ("status", "firstDate") `,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_swap_requests_status_first_date"`);
    await q.query(`DROP INDEX "IDX_swap_requests_period_status"`);
    await q.query(`ALTER TABLE "swap_requests" RENAME TO "temporary_swap_requests"`);
    await q.query(`CREATE TABLE "swap_requests" (${TABLE}, ${CONSTRAINTS})`);
    await q.query(`INSERT INTO "swap_requests"(${COLUMNS}) SELECT ${COLUMNS} FROM "temporary_swap_requests"`);
    await q.query(`DROP TABLE "temporary_swap_requests"`);
    await q.query(
      `CREATE INDEX "IDX_swap_requests_period_status" ON "swap_requests" ("rosterPeriodId", "status") `,
    );
  }
}
