import type { MigrationInterface, QueryRunner } from 'typeorm';

/** PostgreSQL twin of the SQLite migration of the same name. */
export class DriftSamples1764979200000 implements MigrationInterface {
  name = 'DriftSamples1764979200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      UPDATE "flights" f SET "trend" = (f."trend"::jsonb || jsonb_build_object(
        'hoverS', p."report"::jsonb #> '{segments,hoverS}',
        'lagMs', CASE WHEN jsonb_typeof(p."report"::jsonb -> 'tracking') = 'object'
          THEN jsonb_build_object(
            'roll', p."report"::jsonb #> '{tracking,roll,lagMs}',
            'pitch', p."report"::jsonb #> '{tracking,pitch,lagMs}',
            'yaw', p."report"::jsonb #> '{tracking,yaw,lagMs}')
          ELSE 'null'::jsonb END))::text
      FROM "flight_payloads" p
      WHERE p."flightId" = f."id" AND (f."trend"::jsonb -> 'hoverS') IS NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`UPDATE "flights" SET "trend" = ("trend"::jsonb - 'hoverS' - 'lagMs')::text`);
  }
}
