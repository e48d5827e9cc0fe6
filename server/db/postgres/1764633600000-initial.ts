import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * PostgreSQL twin of the SQLite migration of the same name: unix-ms times are bigint (integer is
 * 32-bit here), reals are double precision (real is 4 bytes here), booleans are true/false.
 * Users, sessions, teams and roles, fleet, flights and their payloads, comments, import presets.
 */
export class Initial1764633600000 implements MigrationInterface {
  name = 'Initial1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      'CREATE TABLE "users" ("id" text PRIMARY KEY, "email" text NOT NULL, "name" text NOT NULL, "passwordHash" text NOT NULL, "commentMail" boolean NOT NULL DEFAULT true, "createdAt" bigint NOT NULL)',
    );
    await q.query('CREATE UNIQUE INDEX "IDX_97672ac88f789774dd47f7c8be" ON "users" ("email")');
    await q.query(
      'CREATE TABLE "teams" ("id" text PRIMARY KEY, "name" text NOT NULL, "thresholds" text, "thresholdsUpdatedAt" bigint, "createdAt" bigint NOT NULL)',
    );
    await q.query(
      'CREATE TABLE "password_resets" ("id" text PRIMARY KEY, "userId" text NOT NULL, "tokenHash" text NOT NULL, "expiresAt" bigint NOT NULL, "usedAt" bigint, "createdAt" bigint NOT NULL, CONSTRAINT "FK_d95569f623f28a0bf034a55099e" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)',
    );
    await q.query('CREATE INDEX "IDX_d95569f623f28a0bf034a55099" ON "password_resets" ("userId")');
    await q.query(
      'CREATE UNIQUE INDEX "IDX_7f6aae0fcc807c9e7194ca5cc4" ON "password_resets" ("tokenHash")',
    );
    await q.query(
      'CREATE TABLE "sessions" ("id" text PRIMARY KEY, "userId" text NOT NULL, "expiresAt" bigint NOT NULL, CONSTRAINT "FK_57de40bc620f456c7311aa3a1e6" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)',
    );
    await q.query('CREATE INDEX "IDX_57de40bc620f456c7311aa3a1e" ON "sessions" ("userId")');
    await q.query(
      'CREATE TABLE "memberships" ("teamId" text NOT NULL, "userId" text NOT NULL, "role" text NOT NULL, "joinedAt" bigint NOT NULL, CONSTRAINT "FK_f348d359485ec8cf7737253f3d5" FOREIGN KEY ("teamId") REFERENCES "teams" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_187d573e43b2c2aa3960df20b78" FOREIGN KEY ("userId") REFERENCES "users" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, PRIMARY KEY ("teamId", "userId"))',
    );
    await q.query('CREATE INDEX "idx_memberships_user" ON "memberships" ("userId")');
    await q.query(
      'CREATE TABLE "invites" ("id" text PRIMARY KEY, "teamId" text NOT NULL, "email" text NOT NULL, "role" text NOT NULL, "tokenHash" text NOT NULL, "invitedById" text NOT NULL, "expiresAt" bigint NOT NULL, "acceptedAt" bigint, "acceptedById" text, "createdAt" bigint NOT NULL, CONSTRAINT "FK_8576fa329df0a8634fae38e04dd" FOREIGN KEY ("teamId") REFERENCES "teams" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)',
    );
    await q.query('CREATE INDEX "IDX_8576fa329df0a8634fae38e04d" ON "invites" ("teamId")');
    await q.query(
      'CREATE UNIQUE INDEX "IDX_521aa0cf9f7e7ded862840ffa5" ON "invites" ("tokenHash")',
    );
    await q.query(
      'CREATE TABLE "aircraft" ("id" text PRIMARY KEY, "teamId" text NOT NULL, "name" text NOT NULL, "airframe" text NOT NULL, "components" text NOT NULL, "notes" text NOT NULL DEFAULT \'\', "createdAt" bigint NOT NULL, "updatedAt" bigint NOT NULL, CONSTRAINT "FK_734f81a41848174b37338d21199" FOREIGN KEY ("teamId") REFERENCES "teams" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)',
    );
    await q.query('CREATE INDEX "IDX_734f81a41848174b37338d2119" ON "aircraft" ("teamId")');
    await q.query(
      'CREATE TABLE "service_entries" ("id" text PRIMARY KEY, "aircraftId" text NOT NULL, "date" text NOT NULL, "kind" text NOT NULL, "motor" integer, "note" text NOT NULL, "byId" text NOT NULL, "createdAt" bigint NOT NULL, CONSTRAINT "FK_2969921a97e4200d7b3a5a2da6b" FOREIGN KEY ("aircraftId") REFERENCES "aircraft" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_2aa10cc68eeef05154145d62972" FOREIGN KEY ("byId") REFERENCES "users" ("id") ON DELETE NO ACTION ON UPDATE NO ACTION)',
    );
    await q.query(
      'CREATE INDEX "idx_service_entries_aircraft_date" ON "service_entries" ("aircraftId", "date")',
    );
    await q.query(
      'CREATE TABLE "bench_runs" ("id" text PRIMARY KEY, "aircraftId" text NOT NULL, "date" text NOT NULL, "motor" text NOT NULL, "prop" text NOT NULL, "note" text NOT NULL DEFAULT \'\', "rows" text NOT NULL, "byId" text NOT NULL, "createdAt" bigint NOT NULL, CONSTRAINT "FK_f12c8433f0f648d0cb40b83b4c5" FOREIGN KEY ("aircraftId") REFERENCES "aircraft" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_3304fb32922197882a002625b29" FOREIGN KEY ("byId") REFERENCES "users" ("id") ON DELETE NO ACTION ON UPDATE NO ACTION)',
    );
    await q.query(
      'CREATE INDEX "idx_bench_runs_aircraft_date" ON "bench_runs" ("aircraftId", "date")',
    );
    await q.query(
      'CREATE TABLE "flights" ("id" text PRIMARY KEY, "teamId" text NOT NULL, "aircraftId" text NOT NULL, "pilotId" text NOT NULL, "recordedAt" bigint NOT NULL, "durationS" double precision NOT NULL, "sampleRateHz" double precision NOT NULL, "fileName" text NOT NULL, "sha256" text NOT NULL, "sizeBytes" bigint, "rawKey" text, "rawGzip" boolean NOT NULL DEFAULT false, "reportVersion" integer NOT NULL, "trend" text NOT NULL, "worstSeverity" integer NOT NULL, "noteCount" integer NOT NULL, "watchCount" integer NOT NULL, "actCount" integer NOT NULL, "commentCount" integer NOT NULL DEFAULT 0, "openComments" integer NOT NULL DEFAULT 0, "reviewState" text NOT NULL DEFAULT \'none\', "note" text NOT NULL DEFAULT \'\', "createdAt" bigint NOT NULL, "updatedAt" bigint NOT NULL, CONSTRAINT "FK_9023a76bf37704da30cd33ccb2b" FOREIGN KEY ("teamId") REFERENCES "teams" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_522d54330c3bf3b013b1fe99793" FOREIGN KEY ("aircraftId") REFERENCES "aircraft" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_03c1db6060bd75d067b8485cd74" FOREIGN KEY ("pilotId") REFERENCES "users" ("id") ON DELETE NO ACTION ON UPDATE NO ACTION)',
    );
    await q.query('CREATE INDEX "idx_flights_team_sha256" ON "flights" ("teamId", "sha256")');
    await q.query(
      'CREATE INDEX "idx_flights_team_pilot_recorded" ON "flights" ("teamId", "pilotId", "recordedAt")',
    );
    await q.query(
      'CREATE INDEX "idx_flights_aircraft_recorded" ON "flights" ("aircraftId", "recordedAt", "id")',
    );
    await q.query(
      'CREATE INDEX "idx_flights_team_recorded" ON "flights" ("teamId", "recordedAt", "id")',
    );
    await q.query(
      'CREATE TABLE "flight_payloads" ("flightId" text PRIMARY KEY, "report" text NOT NULL, "detail" text, CONSTRAINT "FK_4881b718f90d42147096fa6da0f" FOREIGN KEY ("flightId") REFERENCES "flights" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)',
    );
    await q.query(
      'CREATE TABLE "comments" ("id" text PRIMARY KEY, "flightId" text NOT NULL, "authorId" text NOT NULL, "parentId" text, "tS" double precision NOT NULL, "channel" text, "body" text NOT NULL, "mentions" text NOT NULL, "resolvedAt" bigint, "resolvedById" text, "editedAt" bigint, "deletedAt" bigint, "createdAt" bigint NOT NULL, CONSTRAINT "FK_0f870158d916ebff140b4cd24d4" FOREIGN KEY ("flightId") REFERENCES "flights" ("id") ON DELETE CASCADE ON UPDATE NO ACTION, CONSTRAINT "FK_4548cc4a409b8651ec75f70e280" FOREIGN KEY ("authorId") REFERENCES "users" ("id") ON DELETE NO ACTION ON UPDATE NO ACTION, CONSTRAINT "FK_8770bd9030a3d13c5f79a7d2e81" FOREIGN KEY ("parentId") REFERENCES "comments" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)',
    );
    await q.query('CREATE INDEX "IDX_8770bd9030a3d13c5f79a7d2e8" ON "comments" ("parentId")');
    await q.query('CREATE INDEX "idx_comments_flight_t" ON "comments" ("flightId", "tS")');
    await q.query(
      'CREATE TABLE "import_presets" ("id" text PRIMARY KEY, "teamId" text NOT NULL, "name" text NOT NULL, "columnMap" text NOT NULL, "createdById" text NOT NULL, "createdAt" bigint NOT NULL, "updatedAt" bigint NOT NULL, CONSTRAINT "FK_450f7c404ff6a0d6d2f9166cbce" FOREIGN KEY ("teamId") REFERENCES "teams" ("id") ON DELETE CASCADE ON UPDATE NO ACTION)',
    );
    await q.query(
      'CREATE UNIQUE INDEX "idx_import_presets_team_name" ON "import_presets" ("teamId", "name")',
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE "import_presets"');
    await q.query('DROP TABLE "comments"');
    await q.query('DROP TABLE "flight_payloads"');
    await q.query('DROP TABLE "flights"');
    await q.query('DROP TABLE "bench_runs"');
    await q.query('DROP TABLE "service_entries"');
    await q.query('DROP TABLE "aircraft"');
    await q.query('DROP TABLE "invites"');
    await q.query('DROP TABLE "memberships"');
    await q.query('DROP TABLE "sessions"');
    await q.query('DROP TABLE "password_resets"');
    await q.query('DROP TABLE "teams"');
    await q.query('DROP TABLE "users"');
  }
}
