import { randomUUID } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CommentList } from '../../shared/schemas/comments';
import { FlightPage } from '../../shared/schemas/flights';
import { parseConfig } from '../../server/config';
import { portOpen } from '../services/local-services';
import { engine, freshStores, storedRaw, type Stores } from './helpers/engine';
import { csvLog, flightBody, kite, sha256 } from './helpers/fixtures';
import { spawnServer, type SpawnedServer } from './helpers/spawn-server';
import { tempDir } from './helpers/temp-dir';

/** A browser-like client whose session cookie can be pointed at either server. */
function client() {
  let cookie = '';
  return {
    async call(base: string, method: string, path: string, body?: unknown) {
      const res = await fetch(base + path, {
        method,
        headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}) },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const set = res.headers.get('set-cookie');
      if (set) cookie = set.split(';')[0]!;
      return { status: res.status, body: (await res.json().catch(() => null)) as unknown };
    },
    async upload(base: string, path: string, bytes: Buffer, name: string) {
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(bytes)]), name);
      const res = await fetch(base + path, { method: 'PUT', headers: { cookie }, body: form });
      return res.status;
    },
    async download(base: string, path: string) {
      const res = await fetch(base + path, { headers: { cookie } });
      return { status: res.status, bytes: Buffer.from(await res.arrayBuffer()) };
    },
  };
}

const SIGN_IN_LIMIT = 6;

/**
 * Two server processes on one PostgreSQL database, one bucket and one Redis: whatever one
 * process did, the other sees, and a process killed mid-write loses nothing it acknowledged.
 * Only in the PostgreSQL leg (`npm run test:postgres`), where those services run.
 */
describe.runIf(engine === 'postgres')('two servers on shared PostgreSQL, S3 and Redis', () => {
  const dirs = [tempDir(), tempDir()];
  let stores: Stores;
  let a: SpawnedServer;
  let b: SpawnedServer;
  const c = client();
  let teamId = '';
  let aircraftId = '';
  let flightId = '';

  beforeAll(async () => {
    stores = await freshStores();
    const env = (i: number) => ({
      ...stores.env,
      DATA_DIR: dirs[i]!.dir,
      AUTH_RATE_LIMIT: String(SIGN_IN_LIMIT),
    });
    // Started together: one migrates under the advisory lock, the other waits.
    [a, b] = await Promise.all([spawnServer(env(0)), spawnServer(env(1))]);
  }, 120_000);

  afterAll(async () => {
    for (const s of [a, b]) {
      if (s && s.child.exitCode === null && s.child.signalCode === null) {
        s.child.kill('SIGTERM');
        await s.exited;
      }
    }
    for (const s of [a, b]) if (s) expect(await portOpen(Number(new URL(s.url).port))).toBe(false);
    await stores?.cleanup();
    for (const d of dirs) d.cleanup();
  }, 60_000);

  it('accepts on one server the session made on the other', async () => {
    const up = await c.call(a.url, 'POST', '/api/auth/sign-up', {
      email: 'mara@crew.example',
      password: 'correct horse battery',
      name: 'Mara',
    });
    expect(up.status).toBe(201);
    const me = await c.call(b.url, 'GET', '/api/auth/me');
    expect(me.status).toBe(200);
    expect((me.body as { user: { email: string } }).user.email).toBe('mara@crew.example');
  });

  it('stores one flight when a PUT is retried on the other server', async () => {
    teamId = (
      (await c.call(a.url, 'POST', '/api/teams', { name: 'Tern crew' })).body as {
        id: string;
      }
    ).id;
    aircraftId = (
      (await c.call(b.url, 'POST', `/api/teams/${teamId}/aircraft`, kite)).body as {
        id: string;
      }
    ).id;
    flightId = randomUUID();
    const body = flightBody(teamId, aircraftId, {
      sha256: sha256(csvLog('cluster')),
      sizeBytes: csvLog('cluster').length,
    });
    expect((await c.call(a.url, 'PUT', `/api/flights/${flightId}`, body)).status).toBe(201);
    expect((await c.call(b.url, 'PUT', `/api/flights/${flightId}`, body)).status).toBe(200);
    for (const base of [a.url, b.url]) {
      const page = FlightPage.parse(
        (await c.call(base, 'GET', `/api/teams/${teamId}/flights`)).body,
      );
      expect(page.flights.map((f) => f.id)).toEqual([flightId]);
    }
  });

  it('serves through one server, byte for byte, the raw log uploaded through the other', async () => {
    const bytes = Buffer.from(csvLog('cluster'));
    expect(await c.upload(a.url, `/api/flights/${flightId}/raw`, bytes, 'kite.csv')).toBe(201);
    const got = await c.download(b.url, `/api/flights/${flightId}/raw`);
    expect(got.status).toBe(200);
    expect(got.bytes.equals(bytes)).toBe(true);
    // The log sits in the bucket, and neither server keeps a database file or raw bytes.
    const keys = await storedRaw(parseConfig({ ...stores.env, DATA_DIR: dirs[0]!.dir }));
    expect(keys.some((k) => k.includes(sha256(csvLog('cluster'))))).toBe(true);
    for (const d of dirs) {
      const files = existsSync(d.dir) ? readdirSync(d.dir, { recursive: true }) : [];
      expect(files.map(String).filter((f) => /sqlite|\.csv/.test(f))).toEqual([]);
    }
  });

  it('lists on one server the comment written on the other', async () => {
    const id = randomUUID();
    const put = await c.call(a.url, 'PUT', `/api/comments/${id}`, {
      flightId,
      tS: 12.5,
      body: 'Motor 3 runs hot from here on',
    });
    expect(put.status).toBe(201);
    const list = CommentList.parse(
      (await c.call(b.url, 'GET', `/api/flights/${flightId}/comments`)).body,
    );
    expect(list.comments.map((x) => x.id)).toContain(id);
  });

  it('counts failed sign-ins on both servers against one shared limit', async () => {
    const stranger = client();
    const statuses: number[] = [];
    for (let i = 0; i <= SIGN_IN_LIMIT; i++) {
      const base = i % 2 === 0 ? a.url : b.url;
      const res = await stranger.call(base, 'POST', '/api/auth/sign-in', {
        email: 'mara@crew.example',
        password: `wrong guess ${i}`,
      });
      statuses.push(res.status);
    }
    // Each process alone has seen about half the attempts; only a shared count refuses the last.
    expect(statuses.slice(0, SIGN_IN_LIMIT).every((s) => s === 401)).toBe(true);
    expect(statuses[SIGN_IN_LIMIT]).toBe(429);
  });

  it('loses no acknowledged comment when one server is killed mid-writes', async () => {
    const acknowledged: string[] = [];
    let killed = false;
    const writes = Array.from({ length: 60 }, async (_, i) => {
      const id = randomUUID();
      const res = await c
        .call(a.url, 'PUT', `/api/comments/${id}`, { flightId, tS: i, body: `note ${i}` })
        .catch(() => null);
      if (res?.status === 201) {
        acknowledged.push(id);
        if (acknowledged.length === 15 && !killed) {
          killed = true;
          a.child.kill('SIGKILL');
        }
      }
    });
    await Promise.all(writes);
    expect(killed).toBe(true);
    expect(await a.exited).toBeNull();
    expect(a.child.signalCode).toBe('SIGKILL');
    expect(await portOpen(Number(new URL(a.url).port))).toBe(false);
    const list = CommentList.parse(
      (await c.call(b.url, 'GET', `/api/flights/${flightId}/comments`)).body,
    );
    const stored = new Set(list.comments.map((x) => x.id));
    expect(acknowledged.filter((id) => !stored.has(id))).toEqual([]);
  });
});
