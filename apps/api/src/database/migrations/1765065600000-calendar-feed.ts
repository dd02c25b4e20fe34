import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Calendar feeds: each user's secret feed (only a hash of its token) and what the feed last said per
 * event (UID, sequence, content hash, cancelled). SQL as TypeORM's schema diff writes it for the
 * entities (constraint names included), so migrations.spec.ts finds nothing left to change.
 */
export class CalendarFeed1765065600000 implements MigrationInterface {
  name = 'CalendarFeed1765065600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "calendar_feeds" ("id" varchar PRIMARY KEY NOT NULL, "userId" varchar NOT NULL, "nonce" varchar(64) NOT NULL, "tokenHash" varchar(64) NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_cf31466b7789c6df501598bed0f" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE UNIQUE INDEX "UQ_calendar_feeds_user" ON "calendar_feeds" ("userId")`);
    await q.query(`CREATE UNIQUE INDEX "UQ_calendar_feeds_token_hash" ON "calendar_feeds" ("tokenHash")`);
    await q.query(
      `CREATE TABLE "calendar_feed_events" ("id" varchar PRIMARY KEY NOT NULL, "userId" varchar NOT NULL, "uid" varchar(200) NOT NULL, "sequence" integer NOT NULL DEFAULT (0), "contentHash" varchar(64) NOT NULL, "cancelled" boolean NOT NULL DEFAULT (0), "content" text NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "changedAt" datetime NOT NULL, CONSTRAINT "FK_f92bc705543ec3e3f3052e869f3" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE UNIQUE INDEX "UQ_calendar_feed_events_user_uid" ON "calendar_feed_events" ("userId", "uid")`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "UQ_calendar_feed_events_user_uid"`);
    await q.query(`DROP TABLE "calendar_feed_events"`);
    await q.query(`DROP INDEX "UQ_calendar_feeds_token_hash"`);
    await q.query(`DROP INDEX "UQ_calendar_feeds_user"`);
    await q.query(`DROP TABLE "calendar_feeds"`);
  }
}
