import type { MigrationInterface, QueryRunner } from 'typeorm';

/** PostgreSQL twin of the SQLite migration of the same name. */
export class Versions1764892800000 implements MigrationInterface {
  name = 'Versions1764892800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE "comments" ADD COLUMN "version" integer NOT NULL DEFAULT 1');
    await q.query('ALTER TABLE "aircraft" ADD COLUMN "version" integer NOT NULL DEFAULT 1');
    await q.query('ALTER TABLE "import_presets" ADD COLUMN "version" integer NOT NULL DEFAULT 1');
    await q.query('ALTER TABLE "teams" ADD COLUMN "thresholdsVersion" integer NOT NULL DEFAULT 1');
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE "teams" DROP COLUMN "thresholdsVersion"');
    await q.query('ALTER TABLE "import_presets" DROP COLUMN "version"');
    await q.query('ALTER TABLE "aircraft" DROP COLUMN "version"');
    await q.query('ALTER TABLE "comments" DROP COLUMN "version"');
  }
}
