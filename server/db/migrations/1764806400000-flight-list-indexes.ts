import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Indexes for every filter of the flight list, each ending in (recordedAt, id) so a page is a
 * seek to the cursor and a walk in list order, never a scan of the team's flights or a sort.
 * The rare subsets a triage view asks for (open threads, watch or act verdicts) get partial
 * indexes that hold only those flights; the list query spells the same conditions literally.
 */
export class FlightListIndexes1764806400000 implements MigrationInterface {
  name = 'FlightListIndexes1764806400000';

  async up(q: QueryRunner): Promise<void> {
    // The pilot index gains the id, so the cursor's tie-break needs no sort.
    await q.query('DROP INDEX "idx_flights_team_pilot_recorded"');
    await q.query(
      'CREATE INDEX "idx_flights_team_pilot_recorded" ON "flights" ("teamId", "pilotId", "recordedAt", "id")',
    );
    await q.query(
      'CREATE INDEX "idx_flights_team_aircraft_recorded" ON "flights" ("teamId", "aircraftId", "recordedAt", "id")',
    );
    await q.query(
      'CREATE INDEX "idx_flights_team_review_recorded" ON "flights" ("teamId", "reviewState", "recordedAt", "id")',
    );
    await q.query(
      'CREATE INDEX "idx_flights_team_open_recorded" ON "flights" ("teamId", "recordedAt", "id") WHERE "openComments" > 0',
    );
    await q.query(
      'CREATE INDEX "idx_flights_team_watch_recorded" ON "flights" ("teamId", "recordedAt", "id") WHERE "worstSeverity" >= 2',
    );
    await q.query(
      'CREATE INDEX "idx_flights_team_act_recorded" ON "flights" ("teamId", "recordedAt", "id") WHERE "worstSeverity" >= 3',
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP INDEX "idx_flights_team_act_recorded"');
    await q.query('DROP INDEX "idx_flights_team_watch_recorded"');
    await q.query('DROP INDEX "idx_flights_team_open_recorded"');
    await q.query('DROP INDEX "idx_flights_team_review_recorded"');
    await q.query('DROP INDEX "idx_flights_team_aircraft_recorded"');
    await q.query('DROP INDEX "idx_flights_team_pilot_recorded"');
    await q.query(
      'CREATE INDEX "idx_flights_team_pilot_recorded" ON "flights" ("teamId", "pilotId", "recordedAt")',
    );
  }
}
