import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Swaps: staff change requests on published rosters (swaps, offers, open-shift claims) and their
 * single-use e-mailed decision links (token hashes only). SQL as TypeORM's schema diff writes it for
 * the entities (constraint names included), so migrations.spec.ts finds nothing left to change.
 */
export class Swaps1765152000000 implements MigrationInterface {
  name = 'Swaps1765152000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE TABLE "swap_requests" ("id" varchar PRIMARY KEY NOT NULL, "rosterPeriodId" varchar NOT NULL, "unitId" varchar NOT NULL, "kind" varchar(8) NOT NULL, "status" varchar(12) NOT NULL, "proposerStaffMemberId" varchar NOT NULL, "colleagueStaffMemberId" varchar, "skillId" varchar, "changes" text NOT NULL, "note" varchar(500), "outcome" varchar(1000), "decidedById" varchar, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), "updatedAt" datetime NOT NULL DEFAULT (datetime('now')), "version" integer NOT NULL, CONSTRAINT "CHK_swap_requests_status" CHECK ("status" IN ('proposed', 'accepted', 'declined', 'approved', 'refused', 'cancelled', 'expired')), CONSTRAINT "CHK_swap_requests_kind" CHECK ("kind" IN ('swap', 'offer', 'claim')), CONSTRAINT "FK_0592a33a325fc65894cc2b9d281" FOREIGN KEY ("rosterPeriodId") REFERENCES "roster_periods" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_5a0b930373a1fe13df2bf05c197" FOREIGN KEY ("proposerStaffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_2e249e6b99e15ab03fdc971fe31" FOREIGN KEY ("colleagueStaffMemberId") REFERENCES "staff_members" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_8e2a958b2394aa35212a9b3f7da" FOREIGN KEY ("decidedById") REFERENCES "users" ("id") ON DELETE SET NULL ON UPDATE NO ACTION)`,
    );
    await q.query(
      `CREATE INDEX "IDX_swap_requests_period_status" ON "swap_requests" ("rosterPeriodId", "status") `,
    );
    await q.query(
      `CREATE TABLE "swap_link_tokens" ("id" varchar PRIMARY KEY NOT NULL, "swapRequestId" varchar NOT NULL, "userId" varchar NOT NULL, "role" varchar(12) NOT NULL, "tokenHash" varchar(64) NOT NULL, "expiresAt" datetime NOT NULL, "usedAt" datetime, "createdAt" datetime NOT NULL DEFAULT (datetime('now')), CONSTRAINT "UQ_a88f0ebed59b089b34e5ab2263f" UNIQUE ("tokenHash"), CONSTRAINT "CHK_swap_link_tokens_role" CHECK ("role" IN ('colleague', 'manager')), CONSTRAINT "FK_e829dcfff63bece268ca8cd5b9f" FOREIGN KEY ("swapRequestId") REFERENCES "swap_requests" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_aad823b7dd8985b25ab8dff723c" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)`,
    );
    await q.query(`CREATE INDEX "IDX_swap_link_tokens_request" ON "swap_link_tokens" ("swapRequestId") `);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "IDX_swap_link_tokens_request"`);
    await q.query(`DROP TABLE "swap_link_tokens"`);
    await q.query(`DROP INDEX "IDX_swap_requests_period_status"`);
    await q.query(`DROP TABLE "swap_requests"`);
  }
}
