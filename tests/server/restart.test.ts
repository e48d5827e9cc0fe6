import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CommentList } from '../../shared/schemas/comments';
import { freshStores, type Stores } from './helpers/engine';
import { flightBody, kite } from './helpers/fixtures';
import { portClosed, spawnServer, type SpawnedServer } from './helpers/spawn-server';
import { tempDir } from './helpers/temp-dir';

/** Talks to a spawned server like a browser: JSON in and out, the session cookie kept. */
function client(base: string, cookie = '') {
  return {
    get cookie() {
      return cookie;
    },
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
  // Starts, including one still under way when a timeout ends the test: afterAll waits for it
  // and stops it, so no server outlives the suite.
  const starting: Promise<SpawnedServer>[] = [];
  const start = () => {
    const s = spawnServer(env);
    starting.push(s);
    return s;
  };
  let over = false;
  beforeAll(async () => {
    stores = await freshStores();
    env = { ...env, ...stores.env };
  });
  afterAll(async () => {
    over = true;
    for (const s of await Promise.allSettled(starting)) {
      if (s.status === 'fulfilled') await s.value.stop('SIGKILL');
    }
    await stores?.cleanup();
    tmp.cleanup();
  });

  it('keeps every comment acknowledged before the process is killed mid-write', async () => {
    const first = await start();
    const c = client(first.url);
    expect(
      (
        await c.call('POST', '/api/auth/sign-up', {
          email: 'mara@crew.example',
          password: 'correct horse battery',
          name: 'Mara',
        })
      ).status,
    ).toBe(201);
    const team = (await c.call('POST', '/api/teams', { name: 'Tern Field Flyers' })).body as {
      id: string;
    };
    const aircraft = (await c.call('POST', `/api/teams/${team.id}/aircraft`, kite)).body as {
      id: string;
    };
    const flightId = randomUUID();
    expect(
      (await c.call('PUT', `/api/flights/${flightId}`, flightBody(team.id, aircraft.id))).status,
    ).toBe(201);

    // Four clients keep writing until the server dies under them.
    const acknowledged: string[] = [];
    let killed = false;
    const writer = async (w: number) => {
      const me = client(first.url, c.cookie);
      for (let i = 0; !killed && !over; i++) {
        const id = randomUUID();
        const res = await me
          .call('PUT', `/api/comments/${id}`, { flightId, tS: i, body: `writer ${w}, ${i}` })
          .catch(() => null);
        if (res?.status === 201) acknowledged.push(id);
        else if (killed) return;
      }
    };
    const writers = Array.from({ length: 4 }, (_, w) => writer(w));
    while (acknowledged.length < 40 && !over) await new Promise((r) => setTimeout(r, 10));
    first.child.kill('SIGKILL');
    killed = true;
    expect(await first.exited).toBeNull();
    expect(first.child.signalCode).toBe('SIGKILL');
    await Promise.all(writers);
    // The process is gone, not just one of its wrappers: nothing answers on its port.
    expect(await portClosed(first.url)).toBe(true);

    if (over) return;
    const second = await start();
    c.setBase(second.url);
    // The session survived too: the cookie still works.
    const list = await c.call('GET', `/api/flights/${flightId}/comments`);
    expect(list.status).toBe(200);
    const ids = new Set(CommentList.parse(list.body).comments.map((x) => x.id));
    expect(acknowledged.filter((id) => !ids.has(id))).toEqual([]);
    await second.stop();
    // Two server starts and a kill: room for a loaded machine (the cluster test allows the same).
  }, 120_000);
});
