import 'fake-indexeddb/auto';
import Dexie from 'dexie';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { ColumnMap } from '../../../shared/log/column-map';
import {
  closeLocalDb,
  enqueue,
  getLocalFlight,
  getRereadMap,
  listLocalFlights,
  listOutbox,
  listUnsyncedFlights,
  localDb,
  markFlightAttemptFailed,
  markSynced,
  retryFailed,
  saveLocalFlight,
  saveRereadMap,
} from '../../../src/lib/local-db';
import { deviceBaselineFlights } from '../../../src/lib/local-baseline';
import { driftSample } from '../../../shared/analysis/drift';
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

describe('reading a kept log again', () => {
  const kiteMap: ColumnMap = {
    columns: {
      'Timestamp (s)': { channel: 'time', unit: 's' },
      Out0: { channel: 'motor1', unit: 'frac' },
    },
  };

  it('keeps the column map and pole count a flight was read with', async () => {
    await saveLocalFlight({
      id: id(7),
      fileName: 'kite-export.csv',
      file: sampleFile('Timestamp (s),Out0\n0,0.5\n'),
      columnMap: kiteMap,
      poles: 14,
      report: sampleReport(),
      detail: sampleDetail(),
    });
    const flight = await getLocalFlight(id(7));
    expect(flight?.columnMap).toEqual(kiteMap);
    expect(flight?.poles).toBe(14);
  });

  it('keeps a map confirmed for a team flight, the latest one winning', async () => {
    expect(await getRereadMap(id(8))).toBeUndefined();
    await saveRereadMap(id(8), kiteMap);
    const other: ColumnMap = {
      columns: { ...kiteMap.columns, Out1: { channel: 'motor2', unit: 'frac' } },
    };
    await saveRereadMap(id(8), other);
    await closeLocalDb();
    expect(await getRereadMap(id(8))).toEqual(other);
  });

  it('opens a database written by the first version with its flights, outbox and drift intact', async () => {
    await localDb().delete();
    await closeLocalDb();
    const v1 = new Dexie('hoverprint');
    v1.version(1).stores({
      flights: 'id, savedAt, syncState, teamId, aircraftId',
      outbox: '++seq, id, state',
    });
    await v1.table('flights').put({
      id: id(9),
      fileName: 'old.csv',
      file: sampleFile(),
      report: sampleReport(),
      detail: sampleDetail(),
      aircraftId: id(5),
      savedAt: 1,
      syncState: 'pending',
      attempts: 0,
      nextAttemptAt: 0,
    });
    await v1.table('outbox').add({
      id: id(9),
      method: 'DELETE',
      path: '/api/comments/9',
      createdAt: 1,
      state: 'pending',
      attempts: 0,
      nextAttemptAt: 0,
    });
    v1.close();

    expect(localDb().verno).toBe(3);
    const old = await getLocalFlight(id(9));
    expect(old?.fileName).toBe('old.csv');
    expect(old?.columnMap).toBeUndefined();
    expect((await listOutbox()).map((e) => e.path)).toEqual(['/api/comments/9']);
    await saveRereadMap(id(9), kiteMap);
    expect(await getRereadMap(id(9))).toEqual(kiteMap);
    // v3 kept each flight's drift sample beside it, filled from the flights already stored.
    expect(await deviceBaselineFlights(id(5))).toEqual([
      {
        flightId: id(9),
        recordedAt: new Date(1).toISOString(),
        sample: driftSample(sampleReport()),
      },
    ]);
  });
});
