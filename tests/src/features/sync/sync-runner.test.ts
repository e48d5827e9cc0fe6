import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import {
  assignLocalFlight,
  closeLocalDb,
  enqueue,
  getLocalFlight,
  listOutbox,
  localDb,
  saveLocalFlight,
} from '../../../../src/lib/local-db';
import {
  backoffDelayMs,
  runSyncPass,
  type SyncDeps,
} from '../../../../src/features/sync/sync-runner';
import { sampleDetail, sampleFile, sampleReport } from '../../helpers/flight-fixture';

const TEAM = '11111111-1111-4111-8111-111111111111';
const FLIGHT = '22222222-2222-4222-8222-222222222222';
const AIRCRAFT = '33333333-3333-4333-8333-333333333333';

interface Call {
  method: string;
  url: string;
  body: unknown;
}

/** A fake server: answers by a list of rules, records every request. */
function fakeServer(answer: (call: Call) => Response | 'network-down') {
  const calls: Call[] = [];
  const fetchStub = async (input: RequestInfo | URL, init?: RequestInit) => {
    const body =
      typeof init?.body === 'string'
        ? JSON.parse(init.body)
        : init?.body instanceof FormData
          ? 'form'
          : undefined;
    const call = { method: init?.method ?? 'GET', url: String(input), body };
    calls.push(call);
    const res = answer(call);
    if (res === 'network-down') throw new TypeError('Failed to fetch');
    return res;
  };
  return { calls, fetch: fetchStub as typeof fetch };
}

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

function deps(server: ReturnType<typeof fakeServer>, now = 1_000_000): SyncDeps {
  return { fetch: server.fetch, now: () => now, defaultTeamId: () => TEAM };
}

async function saveFlight(aircraftId: string | null = AIRCRAFT) {
  await saveLocalFlight({
    id: FLIGHT,
    fileName: 'heron-hover.csv',
    file: sampleFile('abc'),
    report: sampleReport(),
    detail: sampleDetail(),
    ...(aircraftId ? { aircraftId } : {}),
    recordedAt: '2026-04-12T09:30:00.000Z',
  });
}

beforeEach(async () => {
  await localDb().delete();
  await closeLocalDb();
});
afterEach(closeLocalDb);

describe('sync pass', () => {
  it('sends the summary, then the raw log, then the outbox in order', async () => {
    await saveFlight();
    await enqueue({ id: 'c1', method: 'PUT', path: '/api/comments/c1', body: { body: 'one' } });
    await enqueue({ id: 'c1', method: 'PATCH', path: '/api/comments/c1', body: { body: 'two' } });
    const server = fakeServer(() => json(200, { ok: true }));

    const result = await runSyncPass(deps(server));

    expect(server.calls.map((c) => `${c.method} ${c.url}`)).toEqual([
      `PUT /api/flights/${FLIGHT}`,
      `PUT /api/flights/${FLIGHT}/raw`,
      'PUT /api/comments/c1',
      'PATCH /api/comments/c1',
    ]);
    // A flight imported signed out lands in the active team.
    expect(server.calls[0]?.body).toMatchObject({
      teamId: TEAM,
      aircraftId: AIRCRAFT,
      recordedAt: '2026-04-12T09:30:00.000Z',
      fileName: 'heron-hover.csv',
      // SHA-256("abc") from the FIPS 180-2 example (appendix B.1).
      sha256: 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
      sizeBytes: 3,
    });
    expect(result).toMatchObject({ flightsSynced: 1, writesSent: 2, stoppedBy: null });
    expect((await getLocalFlight(FLIGHT))?.syncState).toBe('synced');
    expect(await listOutbox()).toEqual([]);
  });

  it('loses nothing when the network is down and stops at once', async () => {
    await saveFlight();
    await enqueue({ id: 'c1', method: 'PUT', path: '/api/comments/c1', body: { body: 'one' } });
    const server = fakeServer(() => 'network-down');

    const result = await runSyncPass(deps(server));

    expect(result.stoppedBy).toBe('offline');
    expect(server.calls).toHaveLength(1);
    expect((await getLocalFlight(FLIGHT))?.syncState).toBe('pending');
    expect((await getLocalFlight(FLIGHT))?.attempts).toBe(0);
    expect(await listOutbox()).toHaveLength(1);
  });

  it('does not send the summary again when only the raw upload failed', async () => {
    await saveFlight();
    let rawAttempts = 0;
    const server = fakeServer((c) => {
      if (c.url.endsWith('/raw') && rawAttempts++ === 0)
        return json(503, { error: { code: 'internal', message: 'disk busy' } });
      return json(200, {});
    });

    const first = await runSyncPass(deps(server, 1_000_000));
    expect(first.deferred).toBe(1);
    expect(first.nextRetryAt).toBe(1_000_000 + backoffDelayMs(0));
    const stored = await getLocalFlight(FLIGHT);
    expect(stored?.lastError).toBe('503: disk busy');
    expect(stored?.summarySynced).toBe(true);

    // Not yet due: nothing is sent.
    await runSyncPass(deps(server, 1_000_001));
    expect(server.calls).toHaveLength(2);

    await runSyncPass(deps(server, 1_000_000 + backoffDelayMs(0)));
    expect(server.calls.map((c) => c.url)).toEqual([
      `/api/flights/${FLIGHT}`,
      `/api/flights/${FLIGHT}/raw`,
      `/api/flights/${FLIGHT}/raw`,
    ]);
    expect((await getLocalFlight(FLIGHT))?.syncState).toBe('synced');
  });

  it('keeps a refused write on the device, marked failed, and carries on with the next', async () => {
    await enqueue({ id: 'c1', method: 'PUT', path: '/api/comments/c1', body: { body: '' } });
    await enqueue({ id: 'c2', method: 'PUT', path: '/api/comments/c2', body: { body: 'ok' } });
    const server = fakeServer((c) =>
      c.url.endsWith('c1')
        ? json(400, { error: { code: 'bad_request', message: 'body is empty' } })
        : json(200, {}),
    );

    const result = await runSyncPass(deps(server));

    expect(result).toMatchObject({ refused: 1, writesSent: 1 });
    const left = await listOutbox();
    expect(left.map((e) => [e.id, e.state, e.lastError])).toEqual([
      ['c1', 'failed', '400: body is empty'],
    ]);
  });

  it('holds later writes behind one that must be retried, to keep their order', async () => {
    await enqueue({ id: 'c1', method: 'PUT', path: '/api/comments/c1', body: { body: 'parent' } });
    await enqueue({ id: 'c2', method: 'PUT', path: '/api/comments/c2', body: { body: 'reply' } });
    const server = fakeServer(() =>
      json(429, { error: { code: 'rate_limited', message: 'slow down' } }),
    );

    const result = await runSyncPass(deps(server));

    expect(server.calls).toHaveLength(1);
    expect(result.deferred).toBe(1);
    expect((await listOutbox()).map((e) => e.state)).toEqual(['pending', 'pending']);
  });

  it('stops when the session has ended and keeps everything for the next sign-in', async () => {
    await saveFlight();
    const server = fakeServer(() =>
      json(401, { error: { code: 'unauthenticated', message: 'sign in' } }),
    );
    const result = await runSyncPass(deps(server));
    expect(result.stoppedBy).toBe('signed-out');
    expect((await getLocalFlight(FLIGHT))?.syncState).toBe('pending');
  });

  it('holds a comment on a flight that is still only on this device, and sends it after the flight', async () => {
    await saveFlight(null);
    await enqueue({
      id: 'c1',
      method: 'PUT',
      path: '/api/comments/c1',
      body: { flightId: FLIGHT, tS: 3, body: 'hm' },
    });
    const server = fakeServer(() => json(200, {}));
    const held = await runSyncPass(deps(server));
    expect(server.calls).toEqual([]);
    expect(held.waiting).toBe(2);
    expect((await listOutbox())[0]?.attempts).toBe(0);

    await assignLocalFlight(FLIGHT, { teamId: TEAM, aircraftId: AIRCRAFT });
    await runSyncPass(deps(server));
    expect(server.calls.map((c) => `${c.method} ${c.url}`)).toEqual([
      `PUT /api/flights/${FLIGHT}`,
      `PUT /api/flights/${FLIGHT}/raw`,
      'PUT /api/comments/c1',
    ]);
  });

  it('holds a flight with no aircraft until the pilot picks one', async () => {
    await saveFlight(null);
    const server = fakeServer(() => json(200, {}));
    const result = await runSyncPass(deps(server));
    expect(result.waiting).toBe(1);
    expect(server.calls).toEqual([]);
    expect((await getLocalFlight(FLIGHT))?.syncState).toBe('pending');
  });

  it('skips the raw upload when the server already holds the same file as another flight', async () => {
    await saveFlight();
    const other = '44444444-4444-4444-8444-444444444444';
    const server = fakeServer(() => json(200, { outcome: 'duplicate', flight: { id: other } }));
    const result = await runSyncPass(deps(server));
    expect(result.flightsSynced).toBe(1);
    expect(server.calls).toHaveLength(1);
    const stored = await getLocalFlight(FLIGHT);
    expect(stored?.syncState).toBe('synced');
    expect(stored?.duplicateOf).toBe(other);
  });

  it('backs off exponentially up to five minutes', () => {
    expect([0, 1, 2, 3].map(backoffDelayMs)).toEqual([2000, 4000, 8000, 16000]);
    expect(backoffDelayMs(30)).toBe(300_000);
  });
});
