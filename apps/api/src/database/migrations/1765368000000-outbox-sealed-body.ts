import { type MigrationInterface, type QueryRunner } from 'typeorm';

const KEPT = `"id", "to", "subject", "status", "attempts", "nextAttemptAt", "lastError", "createdAt", "sentAt"`;
const CHECK = `CONSTRAINT "CHK_outbox_messages_status" CHECK (("status" IN ('pending', 'sending', 'sent', 'failed')))`;
const HEAD = `"id" varchar PRIMARY KEY NOT NULL, "to" varchar(320) NOT NULL, "subject" varchar(1000) NOT NULL`;
const TAIL = `"status" varchar(16) NOT NULL DEFAULT ('pending'), "attempts" integer NOT NULL DEFAULT (0), "nextAttemptAt" datetime, "lastError" text, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "sentAt" datetime`;

/**
 * The outbox keeps one `body` (text and HTML as JSON, encrypted by MailBodyCipher, cleared once
 * sent) instead of `text` and `html` in clear. Sent messages lose their bodies here; unsent ones
 * keep them as JSON, which the outbox encrypts at start (a migration has no key). Table rebuild as
 * TypeORM's schema diff writes it.
 */
export class OutboxSealedBody1765368000000 implements MigrationInterface {
  name = 'OutboxSealedBody1765368000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_outbox_messages_status_next"`);
    await q.query(`CREATE TABLE "temporary_outbox_messages" (${HEAD}, ${TAIL}, "body" text, ${CHECK})`);
    await q.query(
      `INSERT INTO "temporary_outbox_messages"(${KEPT}, "body") SELECT ${KEPT}, ` +
        `CASE WHEN "status" = 'sent' THEN NULL ELSE json_object('text', "text", 'html', "html") END FROM "outbox_messages"`,
    );
    await q.query(`DROP TABLE "outbox_messages"`);
    await q.query(`ALTER TABLE "temporary_outbox_messages" RENAME TO "outbox_messages"`);
    await q.query(
      `CREATE INDEX "IDX_outbox_messages_status_next" ON "outbox_messages" ("status", "nextAttemptAt") `,
    );
  }

  /** Encrypted bodies cannot be read back here: unsent messages with one are marked failed. */
  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_outbox_messages_status_next"`);
    await q.query(`ALTER TABLE "outbox_messages" RENAME TO "temporary_outbox_messages"`);
    await q.query(
      `CREATE TABLE "outbox_messages" (${HEAD}, "text" text NOT NULL, "html" text NOT NULL, ${TAIL}, ${CHECK})`,
    );
    const plain = (part: string) =>
      `COALESCE(CASE WHEN "body" LIKE '{%' THEN json_extract("body", '$.${part}') END, '')`;
    await q.query(
      `INSERT INTO "outbox_messages"(${KEPT}, "text", "html") SELECT "id", "to", "subject", ` +
        `CASE WHEN "body" LIKE 'sealed:%' AND "status" IN ('pending', 'sending') THEN 'failed' ELSE "status" END, ` +
        `"attempts", "nextAttemptAt", "lastError", "createdAt", "sentAt", ${plain('text')}, ${plain('html')} ` +
        `FROM "temporary_outbox_messages"`,
    );
    await q.query(`DROP TABLE "temporary_outbox_messages"`);
    await q.query(
      `CREATE INDEX "IDX_outbox_messages_status_next" ON "outbox_messages" ("status", "nextAttemptAt") `,
    );
  }
}
