import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CommentList } from '../../shared/schemas/comments';
import { freshStores, type Stores } from './helpers/engine';
import { flightBody, kite } from './helpers/fixtures';
import { spawnServer, type SpawnedServer } from './helpers/spawn-server';
import { tempDir } from './helpers/temp-dir';

/** Talks to a spawned server like a browser: JSON in and out, the session cookie kept. */
function client(base: string) {
  let cookie = '';
  return {
    setBase(url: string) {
      base = url;
    },
    async call(method: string, path: string, body?: unknown) {
      const res = await fetch(base + path, {
        method,
        headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}) },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const set = res.headers.get('set-cookie');
      if (set) cookie = set.split(';')[0]!;
      return { status: res.status, body: (await res.json().catch(() => null)) as unknown };
    },
  };
}

describe('restart durability', () => {
  const tmp = tempDir();
  let env: Record<string, string> = { DATA_DIR: tmp.dir };
  let stores: Stores | undefined;
  let server: SpawnedServer | undefined;
  beforeAll(async () => {
    stores = await freshStores();
    env = { ...env, ...stores.env };
  });
  afterAll(async () => {
    if (server && server.child.exitCode === null) {
      server.child.kill('SIGKILL');
      await server.exited;
    }
    await stores?.cleanup();
    tmp.cleanup();
  });

  it('keeps every comment acknowledged before the process is killed', async () => {
    server = await spawnServer(env);
    const c = client(server.url);
    expect(
      (
        await c.call('POST', '/api/auth/sign-up', {
          email: 'mara@crew.example',
          password: 'correct horse battery',
          name: 'Mara',
        })
      ).status,
    ).toBe(201);
    const team = (await c.call('POST', '/api/teams', { name: 'Club and filming crew' })).body as {
      id: string;
    };
    const aircraft = (await c.call('POST', `/api/teams/${team.id}/aircraft`, kite)).body as {
      id: string;
    };
    const flightId = randomUUID();
    expect(
      (await c.call('PUT', `/api/flights/${flightId}`, flightBody(team.id, aircraft.id))).status,
    ).toBe(201);

    const acknowledged: string[] = [];
    await Promise.all(
      Array.from({ length: 40 }, async (_, i) => {
        const id = randomUUID();
        const res = await c.call('PUT', `/api/comments/${id}`, {
          flightId,
          tS: i,
          body: `comment ${i}`,
        });
        if (res.status === 201) acknowledged.push(id);
      }),
    );
    expect(acknowledged).toHaveLength(40);
    server.child.kill('SIGKILL');
    expect(await server.exited).toBeNull();

    server = await spawnServer(env);
    c.setBase(server.url);
    // The session survived too: the cookie still works.
    const list = await c.call('GET', `/api/flights/${flightId}/comments`);
    expect(list.status).toBe(200);
    const ids = CommentList.parse(list.body).comments.map((x) => x.id);
    expect(ids.sort()).toEqual([...acknowledged].sort());
  });
});
