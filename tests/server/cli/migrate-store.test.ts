import { execFile } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { promisify } from 'node:util';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseConfig } from '../../../server/config';
import { openDatabase } from '../../../server/db/data-source';
import { createS3Client, S3RawStore } from '../../../server/flights/s3-raw-store';
import { createMemoryMailer } from '../../../server/mail/mailer';
import { createServices } from '../../../server/services';
import { engine, freshStores, storedRaw, type Stores } from '../helpers/engine';
import { csvLog, flightBody, kite, sha256 } from '../helpers/fixtures';
import { tempDir } from '../helpers/temp-dir';

const run = promisify(execFile);

/** A small SQLite install made through the services: two members, a flight with its raw log, a thread. */
async function sqliteInstall(dir: string) {
  const config = parseConfig({ NODE_ENV: 'test', DATA_DIR: dir });
  const { dataSource } = await openDatabase(config);
  const s = createServices(dataSource, config, createMemoryMailer());
  const owner = await s.auth.signUp({
    email: 'mara@crew.example',
    password: 'correct horse battery',
    name: 'Mara',
  });
  const coach = await s.auth.signUp({
    email: 'wren@crew.example',
    password: 'correct horse battery',
    name: 'Wren',
  });
  const team = await s.teams.create(owner, 'Tern crew');
  const aircraft = await s.aircraft.create(owner, team.id, kite);
  const csv = csvLog('to migrate');
  const flightId = randomUUID();
  await s.flights.put(owner, flightId, {
    ...flightBody(team.id, aircraft.id),
    sha256: sha256(csv),
    sizeBytes: csv.length,
  });
  const staged = join(s.rawLogs.rawStore.stagingDir, 'upload.part');
  await mkdir(s.rawLogs.rawStore.stagingDir, { recursive: true });
  await writeFile(staged, csv);
  await s.rawLogs.attach(owner, flightId, {
    path: staged,
    size: csv.length,
    sha256: sha256(csv),
    gzip: false,
    originalName: 'kite.csv',
  });
  const root = randomUUID();
  await s.comments.put(owner, root, { flightId, tS: 3, body: 'Watch motor 3 here' });
  await s.comments.put(owner, randomUUID(), {
    flightId,
    tS: 3,
    body: 'Swapped it',
    parentId: root,
  });
  await s.rateLimits.close();
  await dataSource.destroy();
  return { csv, coach };
}

/** Only in the PostgreSQL leg, where PostgreSQL and the bucket run. */
describe.runIf(engine === 'postgres')('npm run migrate-store', () => {
  const tmp = tempDir();
  let stores: Stores;
  let csv = '';

  beforeAll(async () => {
    ({ csv } = await sqliteInstall(tmp.dir));
    stores = await freshStores();
  }, 120_000);
  afterAll(async () => {
    await stores?.cleanup();
    tmp.cleanup();
  });

  const migrate = () =>
    run(
      process.execPath,
      [
        '--import',
        'tsx',
        'server/cli/migrate-store.ts',
        '--from',
        `sqlite:${tmp.dir}`,
        '--to',
        stores.env.DATABASE_URL!,
      ],
      { env: { ...process.env, ...stores.env, DATABASE_URL: '' } },
    );

  it('copies every table and the raw log, with a line per table and a count check', async () => {
    const { stdout } = await migrate();
    expect(stdout).toMatch(/^users: 2 rows, 2 copied, 0 already there; 2 in PostgreSQL$/m);
    expect(stdout).toMatch(/^comments: 2 rows, 2 copied, 0 already there; 2 in PostgreSQL$/m);
    expect(stdout).toMatch(/^flights: 1 rows, 1 copied/m);
    expect(stdout).toMatch(/^raw logs: 1 referenced, 1 copied to s3:\/\//m);
    expect(stdout).toMatch(
      /^Count check passed: \d+ tables, \d+ rows, 1 raw logs all in place\.$/m,
    );

    const db = new pg.Client({ connectionString: stores.env.DATABASE_URL });
    await db.connect();
    try {
      const users = await db.query('SELECT email, "commentMail" FROM users ORDER BY email');
      expect(users.rows).toEqual([
        { email: 'mara@crew.example', commentMail: true },
        { email: 'wren@crew.example', commentMail: true },
      ]);
      const replies = await db.query(
        'SELECT COUNT(*)::int AS n FROM comments WHERE "parentId" IS NOT NULL',
      );
      expect(replies.rows[0]).toEqual({ n: 1 });
      // A bulk load is followed by ANALYZE (postgresql.org/docs/15/populate.html §14.4.9).
      // reltuples is -1 until a table is first analysed or vacuumed (postgresql.org/docs/15/
      // catalog-pg-class.html); one flight is far below autovacuum's thresholds.
      expect(stdout).toMatch(/^statistics updated \(ANALYZE\)$/m);
      const stats = await db.query(
        "SELECT reltuples::int AS n FROM pg_class WHERE relname = 'flights'",
      );
      expect(stats.rows[0]).toEqual({ n: 1 });
    } finally {
      await db.end();
    }
    const s3 = parseConfig(stores.env).s3!;
    const bucket = new S3RawStore(createS3Client(s3), s3.bucket);
    // The key is the hash (with the team in front where logs are stored per team).
    const key = (await storedRaw(parseConfig(stores.env))).find((k) => k.includes(sha256(csv)));
    const { stream } = await bucket.open(key!);
    const chunks: Buffer[] = [];
    for await (const chunk of stream as AsyncIterable<Buffer>) chunks.push(chunk);
    expect(Buffer.concat(chunks).toString()).toBe(csv);
  }, 120_000);

  it('copies nothing twice when run again', async () => {
    const { stdout } = await migrate();
    expect(stdout).toMatch(/^users: 2 rows, 0 copied, 2 already there; 2 in PostgreSQL$/m);
    expect(stdout).toMatch(/^comments: 2 rows, 0 copied, 2 already there; 2 in PostgreSQL$/m);
    expect(stdout).toMatch(/^raw logs: 1 referenced, 0 copied to s3:\/\/\S+, 1 already there$/m);
    expect(stdout).not.toMatch(/ANALYZE/);
    expect(stdout).toMatch(/^Count check passed/m);
  }, 120_000);
});
