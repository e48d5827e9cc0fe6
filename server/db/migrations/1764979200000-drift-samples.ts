import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Each flight's trend JSON gains what drift reads of it as a baseline flight: seconds of hover
 * and lag per axis (shared/schemas/baseline.ts, DriftSample), copied from the stored report of
 * flights stored before the write path kept them. The baseline walk stays on the
 * (aircraftId, recordedAt, id) index and never parses a whole report.
 */
export class DriftSamples1764979200000 implements MigrationInterface {
  name = 'DriftSamples1764979200000';

  async up(q: QueryRunner): Promise<void> {
    // json(): a subquery drops SQLite's JSON subtype, so the object is parsed back, not quoted.
    await q.query(`
      UPDATE "flights" SET "trend" = json_set("trend",
        '$.hoverS', (SELECT json_extract(p."report", '$.segments.hoverS')
                     FROM "flight_payloads" p WHERE p."flightId" = "flights"."id"),
        '$.lagMs', json((SELECT CASE WHEN json_type(p."report", '$.tracking') = 'object'
                       THEN json_object(
                         'roll', json_extract(p."report", '$.tracking.roll.lagMs'),
                         'pitch', json_extract(p."report", '$.tracking.pitch.lagMs'),
                         'yaw', json_extract(p."report", '$.tracking.yaw.lagMs'))
                       ELSE 'null' END
                     FROM "flight_payloads" p WHERE p."flightId" = "flights"."id")))
      WHERE json_type("trend", '$.hoverS') IS NULL
        AND EXISTS (SELECT 1 FROM "flight_payloads" p WHERE p."flightId" = "flights"."id")`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`UPDATE "flights" SET "trend" = json_remove("trend", '$.hoverS', '$.lagMs')`);
  }
}
