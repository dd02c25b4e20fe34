import { type MigrationInterface, type QueryRunner } from 'typeorm';

/** PostgreSQL's twin of RegisteredSkills1766059200000, written by TypeORM's schema diff (generate-postgres-migration.ts). */
export class RegisteredSkills1766059200000 implements MigrationInterface {
  name = 'RegisteredSkills1766059200000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "skills" ADD "registered" boolean NOT NULL DEFAULT false`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "skills" DROP COLUMN "registered"`);
  }
}
