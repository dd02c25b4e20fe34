import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Organisation, units, users and their units, refresh tokens, one-time tokens and the mail
 * catcher's messages. Constraint names are the ones TypeORM derives from the entities, so the
 * schema check in migrations.spec.ts finds nothing to change after this migration.
 */
export class InitialSchema1764633600000 implements MigrationInterface {
  name = 'InitialSchema1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "organisations" ("id" varchar PRIMARY KEY NOT NULL, "name" varchar(200) NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')))`,
    );
    await q.query(
      `CREATE TABLE "units" ("id" varchar PRIMARY KEY NOT NULL, "organisationId" varchar NOT NULL, "name" varchar(200) NOT NULL, "timeZone" varchar(64) NOT NULL, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "FK_07d5402da0666b138ff0aa88154" FOREIGN KEY ("organisationId") REFERENCES "organisations" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE UNIQUE INDEX "UQ_units_organisation_name" ON "units" ("organisationId", "name")`);
    await q.query(
      `CREATE TABLE "users" ("id" varchar PRIMARY KEY NOT NULL, "organisationId" varchar NOT NULL, "email" varchar(254) NOT NULL, "displayName" varchar(200) NOT NULL, "passwordHash" varchar, "role" varchar(16) NOT NULL, "active" boolean NOT NULL DEFAULT (1), "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "UQ_97672ac88f789774dd47f7c8be3" UNIQUE ("email"), CONSTRAINT "CHK_users_role" CHECK ("role" IN ('admin', 'manager', 'staff')), CONSTRAINT "FK_4bba96961e0142c06aa921ce27f" FOREIGN KEY ("organisationId") REFERENCES "organisations" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE TABLE "user_units" ("userId" varchar NOT NULL, "unitId" varchar NOT NULL, CONSTRAINT "FK_b31c5490ab8f851d1a5e56eed3a" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE CASCADE, CONSTRAINT "FK_eb5a24b37234fad2ed645d97b5e" FOREIGN KEY ("unitId") REFERENCES "units" ("id") ON DELETE CASCADE ON UPDATE CASCADE, PRIMARY KEY ("userId", "unitId"))`,
    );
    await q.query(`CREATE INDEX "IDX_b31c5490ab8f851d1a5e56eed3" ON "user_units" ("userId")`);
    await q.query(`CREATE INDEX "IDX_eb5a24b37234fad2ed645d97b5" ON "user_units" ("unitId")`);
    await q.query(
      `CREATE TABLE "refresh_tokens" ("id" varchar PRIMARY KEY NOT NULL, "userId" varchar NOT NULL, "familyId" varchar NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "replacedAt" datetime, "revokedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "UQ_c25bc63d248ca90e8dcc1d92d06" UNIQUE ("tokenHash"), CONSTRAINT "FK_610102b60fea1455310ccd299de" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_refresh_tokens_user" ON "refresh_tokens" ("userId")`);
    await q.query(`CREATE INDEX "IDX_refresh_tokens_family" ON "refresh_tokens" ("familyId")`);
    await q.query(
      `CREATE TABLE "one_time_tokens" ("id" varchar PRIMARY KEY NOT NULL, "userId" varchar NOT NULL, "purpose" varchar(20) NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "usedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "UQ_3cd7ae667bfe489f39288fe9964" UNIQUE ("tokenHash"), CONSTRAINT "CHK_one_time_tokens_purpose" CHECK ("purpose" IN ('invitation', 'password-reset')), CONSTRAINT "FK_c050f9d5e8a16e1a30a98c7257f" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_one_time_tokens_user" ON "one_time_tokens" ("userId")`);
    await q.query(
      `CREATE TABLE "mail_messages" ("id" varchar PRIMARY KEY NOT NULL, "messageId" varchar, "from" varchar(500) NOT NULL, "to" text NOT NULL, "subject" varchar(1000) NOT NULL, "text" text NOT NULL, "html" text, "receivedAt" datetime NOT NULL)`,
    );
    await q.query(`CREATE INDEX "IDX_mail_messages_received" ON "mail_messages" ("receivedAt")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "mail_messages"`);
    await q.query(`DROP TABLE "one_time_tokens"`);
    await q.query(`DROP TABLE "refresh_tokens"`);
    await q.query(`DROP TABLE "user_units"`);
    await q.query(`DROP TABLE "users"`);
    await q.query(`DROP TABLE "units"`);
    await q.query(`DROP TABLE "organisations"`);
  }
}
