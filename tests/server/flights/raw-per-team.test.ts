import { randomUUID } from 'node:crypto';
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { csvLog, flightBody, sha256 } from '../helpers/fixtures';
import { crew, type Agent } from '../helpers/crew';
import { storedRaw } from '../helpers/engine';
import { startTestApp, type TestApp } from '../helpers/test-app';

/** Every stored raw log (file or S3 object) whose name holds this hash. */
async function storedCopies(t: TestApp, hash: string): Promise<string[]> {
  return (await storedRaw(t.config)).filter((name) => name.includes(hash));
}

/** A team's raw logs are its own: stored, de-duplicated and removed within the team. */
describe('raw logs stay inside the team', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  async function flightWithRaw(agent: Agent, teamId: string, aircraftId: string, csv: string) {
    const id = randomUUID();
    await agent.agent
      .put(`/api/flights/${id}`)
      .send(flightBody(teamId, aircraftId, { sha256: sha256(csv) }))
      .expect(201);
    const up = await agent.agent
      .put(`/api/flights/${id}/raw`)
      .attach('file', Buffer.from(csv), 'kite.csv');
    return { id, up };
  }

  it('does not tell a team that another team holds the same bytes, and deletes per team', async () => {
    const a = await crew(t, []);
    const b = await crew(t, []);
    const csv = csvLog('shared-bytes');
    const first = await flightWithRaw(a.owner, a.teamId, a.aircraftId, csv);
    expect(first.up.status).toBe(201);
    const second = await flightWithRaw(b.owner, b.teamId, b.aircraftId, csv);
    // Same answer as for bytes nobody has sent before.
    expect(second.up.status).toBe(201);
    expect(second.up.body.stored).toBe(true);
    expect(await storedCopies(t, sha256(csv))).toHaveLength(2);

    await a.owner.agent.delete(`/api/flights/${first.id}`).expect(204);
    expect(await storedCopies(t, sha256(csv))).toHaveLength(1);
    await b.owner.agent.get(`/api/flights/${second.id}/raw`).expect(200);
  });

  it('deleting an aircraft deletes the raw logs of its flights', async () => {
    const c = await crew(t, []);
    const csv = csvLog('aircraft-goes');
    await flightWithRaw(c.owner, c.teamId, c.aircraftId, csv);
    expect(await storedCopies(t, sha256(csv))).toHaveLength(1);
    await c.owner.agent.delete(`/api/aircraft/${c.aircraftId}`).expect(204);
    expect(await storedCopies(t, sha256(csv))).toHaveLength(0);
  });

  // The sweep of S3 objects is checked in s3-raw-store.test.ts; here the files on disk.
  it.skipIf(Boolean(process.env.DATABASE_URL && process.env.S3_BUCKET))(
    'the startup sweep removes files no flight refers to and keeps the rest',
    async () => {
      const c = await crew(t, []);
      const kept = csvLog('kept');
      await flightWithRaw(c.owner, c.teamId, c.aircraftId, kept);
      const orphanHash = sha256('nobody refers to me');
      const orphanDir = join(t.dir, 'raw', c.teamId, orphanHash.slice(0, 2));
      mkdirSync(orphanDir, { recursive: true });
      writeFileSync(join(orphanDir, `${orphanHash}.csv`), 'time\n0\n');
      const legacyDir = join(t.dir, 'raw', orphanHash.slice(0, 2));
      mkdirSync(legacyDir, { recursive: true });
      writeFileSync(join(legacyDir, `${orphanHash}.csv.gz`), 'x');
      writeFileSync(join(t.dir, 'raw', 'staging', 'crashed.part'), 'half an upload');

      expect(await t.services.rawLogs.sweep()).toBe(2);
      expect(await storedCopies(t, orphanHash)).toHaveLength(0);
      expect(await storedCopies(t, sha256(kept))).toHaveLength(1);
      expect(readdirSync(join(t.dir, 'raw', 'staging'))).toEqual([]);
    },
  );
});
