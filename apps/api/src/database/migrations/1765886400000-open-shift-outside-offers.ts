import { type MigrationInterface, type QueryRunner } from 'typeorm';

const KINDS_BEFORE = `'publish', 'repair', 'swap', 'open-shift-claim', 'manual-edit'`;
const KINDS_AFTER = `${KINDS_BEFORE}, 'open-shift-outside'`;

/** audit_entries as created by Publishing1764892800000, with the kinds allowed. */
const auditTable = (name: string, kinds: string) =>
  `CREATE TABLE "${name}" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "actorUserId" varchar, "actorName" varchar(200) NOT NULL, "kind" varchar(32) NOT NULL, "at" datetime NOT NULL, "summary" varchar(1000) NOT NULL, "before" text, "after" text, CONSTRAINT "CHK_audit_entries_kind" CHECK ("kind" IN (${kinds})), CONSTRAINT "FK_5408f82f6a0000d792c94f64e5c" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_75131667de5de7246d2533dd507" FOREIGN KEY ("actorUserId") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`;
const AUDIT_COLUMNS = `"id", "rosterPeriodId", "actorUserId", "actorName", "kind", "at", "summary", "before", "after"`;

/**
 * Open shifts offered to bank or agency staff outside the roster (as TypeORM's schema diff writes
 * the table), and the audit kind 'open-shift-outside'. SQLite cannot alter a CHECK constraint, so
 * audit_entries is rebuilt the way TypeORM rebuilds a table (copy, drop, rename), rows kept.
 */
export class OpenShiftOutsideOffers1765886400000 implements MigrationInterface {
  name = 'OpenShiftOutsideOffers1765886400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "open_shift_outside_offers" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "date" varchar(10) NOT NULL, "shiftTypeId" varchar NOT NULL, "skillId" varchar, "offeredTo" varchar(200) NOT NULL, "note" varchar(500), "status" varchar(12) NOT NULL, "people" integer, "offeredById" varchar, "offeredByName" varchar(200) NOT NULL, "offeredAt" datetime NOT NULL, "updatedAt" datetime NOT NULL, CONSTRAINT "CHK_open_shift_outside_offers_status" CHECK ("status" IN ('offered', 'filled', 'withdrawn')), CONSTRAINT "FK_169457b3adb4ad1b204c012f065" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_c6558c8074fe07800f64efd9540" FOREIGN KEY ("shiftTypeId") REFERENCES "shift_types" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_b2b1bd80f8816cc2dbebea06e42" FOREIGN KEY ("offeredById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE INDEX "IDX_open_shift_outside_offers_period_date" ON "open_shift_outside_offers" ("rosterPeriodId", "date") `,
    );
    await rebuildAudit(q, KINDS_AFTER);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DELETE FROM "audit_entries" WHERE "kind" = 'open-shift-outside'`);
    await rebuildAudit(q, KINDS_BEFORE);
    await q.query(`DROP INDEX "IDX_open_shift_outside_offers_period_date"`);
    await q.query(`DROP TABLE "open_shift_outside_offers"`);
  }
}

async function rebuildAudit(q: QueryRunner, kinds: string): Promise<void> {
  await q.query(`DROP INDEX "IDX_audit_entries_period_at"`);
  await q.query(auditTable('temporary_audit_entries', kinds));
  await q.query(
    `INSERT INTO "temporary_audit_entries"(${AUDIT_COLUMNS}) SELECT ${AUDIT_COLUMNS} FROM "audit_entries"`,
  );
  await q.query(`DROP TABLE "audit_entries"`);
  await q.query(`ALTER TABLE "temporary_audit_entries" RENAME TO "audit_entries"`);
  await q.query(`CREATE INDEX "IDX_audit_entries_period_at" ON "audit_entries" ("rosterPeriodId", "at") `);
}
