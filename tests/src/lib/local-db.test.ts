import 'fake-indexeddb/auto';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import {
  closeLocalDb,
  enqueue,
  getLocalFlight,
  listLocalFlights,
  listOutbox,
  listUnsyncedFlights,
  localDb,
  markFlightAttemptFailed,
  markSynced,
  retryFailed,
  saveLocalFlight,
} from '../../../src/lib/local-db';
import { sampleDetail, sampleFile, sampleReport } from '../helpers/flight-fixture';

const id = (n: number) => `00000000-0000-4000-8000-00000000000${n}`;

beforeEach(async () => {
  await localDb().delete();
  await closeLocalDb();
});
afterEach(closeLocalDb);

describe('local flights', () => {
  it('keeps a dropped log with its analysis and gives it back by id', async () => {
    await saveLocalFlight({
      id: id(1),
      fileName: 'kite-0412.csv',
      file: sampleFile('time,motor1\n0,0.5\n'),
      report: sampleReport(),
      detail: sampleDetail(),
      aircraftId: id(9),
    });
    const flight = await getLocalFlight(id(1));
    expect(flight?.fileName).toBe('kite-0412.csv');
    expect(flight?.report.findings[0]?.motor).toBe(1);
    expect(flight?.aircraftId).toBe(id(9));
    expect(flight?.syncState).toBe('pending');
    expect(flight?.file.size).toBe('time,motor1\n0,0.5\n'.length);
  });

  it('lists newest first and leaves synced flights out of the unsynced list', async () => {
    const base = { file: sampleFile(), report: sampleReport(), detail: sampleDetail() };
    await saveLocalFlight({ ...base, id: id(1), fileName: 'a.csv' });
    await new Promise((r) => setTimeout(r, 5));
    await saveLocalFlight({ ...base, id: id(2), fileName: 'b.csv' });
    expect((await listLocalFlights()).map((f) => f.fileName)).toEqual(['b.csv', 'a.csv']);

    await markSynced(id(1));
    expect((await listUnsyncedFlights()).map((f) => f.id)).toEqual([id(2)]);
    expect((await getLocalFlight(id(1)))?.syncedAt).toBeGreaterThan(0);
  });

  it('keeps a refused flight on the device and queues it again on retry', async () => {
    await saveLocalFlight({
      id: id(3),
      fileName: 'c.csv',
      file: sampleFile(),
      report: sampleReport(),
      detail: sampleDetail(),
    });
    await markFlightAttemptFailed(id(3), '403: not your team', null);
    const failed = await getLocalFlight(id(3));
    expect(failed?.syncState).toBe('failed');
    expect(failed?.lastError).toBe('403: not your team');
    await retryFailed();
    expect((await getLocalFlight(id(3)))?.syncState).toBe('pending');
  });
});

describe('outbox', () => {
  it('keeps queued writes in the order they were made', async () => {
    await enqueue({ id: id(4), method: 'PUT', path: '/api/comments/4', body: { body: 'first' } });
    await enqueue({ id: id(5), method: 'PUT', path: '/api/comments/5', body: { body: 'second' } });
    await enqueue({
      id: id(4),
      method: 'PATCH',
      path: '/api/comments/4',
      body: { body: 'edited' },
    });
    const entries = await listOutbox();
    expect(entries.map((e) => [e.method, e.id])).toEqual([
      ['PUT', id(4)],
      ['PUT', id(5)],
      ['PATCH', id(4)],
    ]);
    expect(entries.every((e) => e.state === 'pending')).toBe(true);
  });

  it('survives closing and reopening the database', async () => {
    await enqueue({ id: id(6), method: 'DELETE', path: '/api/comments/6' });
    await closeLocalDb();
    expect((await listOutbox()).map((e) => e.path)).toEqual(['/api/comments/6']);
  });
});
