import { type MigrationInterface, type QueryRunner } from 'typeorm';

/**
 * Skills marked registered (licensed professional skills such as registered nurse), whose shortfalls
 * are checked for the red flags of safe staffing (NICE SG1 2014). A plain added column with a
 * constant default (no table rebuild).
 */
export class RegisteredSkills1766059200000 implements MigrationInterface {
  name = 'RegisteredSkills1766059200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "skills" ADD COLUMN "registered" boolean NOT NULL DEFAULT (0)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "skills" DROP COLUMN "registered"`);
  }
}
