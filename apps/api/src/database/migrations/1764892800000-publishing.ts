import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Publishing: the e-mail outbox, the audit trail of changes to published rosters and the snapshots
 * of published rosters. SQL as TypeORM's schema diff writes it for the entities (constraint names
 * included), so migrations.spec.ts finds nothing left to change.
 */
export class Publishing1764892800000 implements MigrationInterface {
  name = 'Publishing1764892800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "outbox_messages" ("id" varchar PRIMARY KEY NOT NULL, "to" varchar(320) NOT NULL, "subject" varchar(1000) NOT NULL, "text" text NOT NULL, "html" text NOT NULL, "status" varchar(16) NOT NULL DEFAULT ('pending'), "attempts" integer NOT NULL DEFAULT (0), "nextAttemptAt" datetime, "lastError" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "sentAt" datetime, CONSTRAINT "CHK_outbox_messages_status" CHECK ("status" IN ('pending', 'sending', 'sent', 'failed')))`,
    );
    await q.query(
      `CREATE INDEX "IDX_outbox_messages_status_next" ON "outbox_messages" ("status", "nextAttemptAt") `,
    );
    await q.query(
      `CREATE TABLE "audit_entries" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "actorUserId" varchar, "actorName" varchar(200) NOT NULL, "kind" varchar(32) NOT NULL, "at" datetime NOT NULL, "summary" varchar(1000) NOT NULL, "before" text, "after" text, CONSTRAINT "CHK_audit_entries_kind" CHECK ("kind" IN ('publish', 'repair', 'swap', 'open-shift-claim', 'manual-edit')), CONSTRAINT "FK_5408f82f6a0000d792c94f64e5c" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_75131667de5de7246d2533dd507" FOREIGN KEY ("actorUserId") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_audit_entries_period_at" ON "audit_entries" ("rosterPeriodId", "at") `);
    await q.query(
      `CREATE TABLE "roster_publications" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "kind" varchar(16) NOT NULL, "publishedAt" datetime NOT NULL, "publishedById" varchar, "cells" text NOT NULL, CONSTRAINT "FK_6e1e3da3e411dc64567fe676db8" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_9ea96192a059b89c7ed0114e93b" FOREIGN KEY ("publishedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE INDEX "IDX_roster_publications_period_at" ON "roster_publications" ("rosterPeriodId", "publishedAt") `,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_roster_publications_period_at"`);
    await q.query(`DROP TABLE "roster_publications"`);
    await q.query(`DROP INDEX "IDX_audit_entries_period_at"`);
    await q.query(`DROP TABLE "audit_entries"`);
    await q.query(`DROP INDEX "IDX_outbox_messages_status_next"`);
    await q.query(`DROP TABLE "outbox_messages"`);
  }
}
