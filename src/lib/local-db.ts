import Dexie, { type EntityTable } from 'dexie';
import type { FlightReport } from '../../shared/schemas/report';
import type { ReviewDetail } from '../../shared/analysis/review-detail';
import type { ColumnMap } from '../../shared/log/column-map';
import { driftSample } from '../../shared/analysis/drift';
import type { DriftSample } from '../../shared/schemas/baseline';
import { storeProblemText } from './store-problem-text';

/**
 * The device's own store: every log read on this device is kept here before any network is
 * involved, and every write made while offline waits in the outbox. Sync (src/features/sync)
 * drains both; nothing is deleted until the server has acknowledged it.
 */

export type LocalSyncState = 'pending' | 'synced' | 'failed';

export interface LocalFlight {
  /** Client-generated UUID; the server keys the flight by it, so retries are idempotent. */
  id: string;
  fileName: string;
  /** The raw log exactly as dropped (CSV or gzip). */
  file: Blob;
  /** The column map the log was read with, when its headers needed one (to read it again). */
  columnMap?: ColumnMap;
  /** Motor pole count the log's eRPM columns were read with. */
  poles?: number;
  report: FlightReport;
  detail: ReviewDetail;
  teamId?: string;
  aircraftId?: string;
  /** ISO 8601 time the flight was recorded, when the log or the pilot says so. */
  recordedAt?: string;
  /** ms since epoch when it was stored on this device. */
  savedAt: number;
  syncState: LocalSyncState;
  /** ms since epoch when the server acknowledged both the flight and its raw log. */
  syncedAt?: number;
  /** The report/detail PUT was acknowledged; only the raw file is still to send. */
  summarySynced?: boolean;
  attempts: number;
  /** ms since epoch before which the runner will not try again (back-off). */
  nextAttemptAt: number;
  lastError?: string;
  /** Hex SHA-256 of `file`, computed once when the flight is first sent. */
  sha256?: string;
  /** The server already held the same raw log as another flight; this is that flight's id. */
  duplicateOf?: string;
}

export type OutboxMethod = 'PUT' | 'PATCH' | 'POST' | 'DELETE';

export interface OutboxEntry {
  /** Auto-incremented; the outbox is flushed in this order. */
  seq?: number;
  /** Client UUID of the thing written (a comment id, say), for display and de-duplication. */
  id: string;
  method: OutboxMethod;
  path: string;
  body?: unknown;
  /** The version the edit started from, sent as If-Match so a newer one is not overwritten. */
  version?: number;
  /** What the write was, in words, for the sync list ("Edit of your comment at 7.50 s"). */
  label?: string;
  createdAt: number;
  /** 'conflict': someone else saved first (412); it waits for the pilot to choose. */
  state: 'pending' | 'failed' | 'conflict';
  attempts: number;
  nextAttemptAt: number;
  lastError?: string;
  /** With 'conflict': the version the server holds now. */
  currentVersion?: number;
}

/**
 * A column map confirmed on this device for a flight stored by the team, so its raw log can be
 * read again (the filter bench) when no team preset covers its headers.
 */
export interface RereadMap {
  flightId: string;
  columnMap: ColumnMap;
  /** ms since epoch. */
  savedAt: number;
}

/**
 * What drift needs of a stored flight, kept beside it: the offline baseline reads these few
 * numbers instead of whole records with their traces and raw logs.
 */
export interface LocalDriftSample {
  flightId: string;
  aircraftId?: string;
  /** ISO 8601: when it was recorded, or else when it was stored on this device. */
  recordedAt: string;
  sample: DriftSample;
}

/** The drift sample of a flight record (on save, and once for flights stored before v3). */
function driftSampleOf(
  f: Pick<LocalFlight, 'id' | 'aircraftId' | 'recordedAt' | 'savedAt' | 'report'>,
): LocalDriftSample {
  return {
    flightId: f.id,
    aircraftId: f.aircraftId,
    recordedAt: f.recordedAt ?? new Date(f.savedAt).toISOString(),
    sample: driftSample(f.report),
  };
}

export class LocalDatabase extends Dexie {
  flights!: EntityTable<LocalFlight, 'id'>;
  outbox!: EntityTable<OutboxEntry, 'seq'>;
  rereadMaps!: EntityTable<RereadMap, 'flightId'>;
  driftSamples!: EntityTable<LocalDriftSample, 'flightId'>;

  constructor(name = 'hoverprint') {
    super(name);
    this.version(1).stores({
      flights: 'id, savedAt, syncState, teamId, aircraftId',
      outbox: '++seq, id, state',
    });
    // v2: flights keep the column map and pole count they were read with (plain fields, not
    // indexed; a flight from v1 has none, as it was read without), and maps confirmed for
    // team flights get their own table.
    this.version(2).stores({
      flights: 'id, savedAt, syncState, teamId, aircraftId',
      outbox: '++seq, id, state',
      rereadMaps: 'flightId',
    });
    // v3: each flight's drift sample in a table of its own, filled once from the flights
    // already kept (one record at a time, so no more than one log is in memory).
    this.version(3)
      .stores({
        flights: 'id, savedAt, syncState, teamId, aircraftId',
        outbox: '++seq, id, state',
        rereadMaps: 'flightId',
        driftSamples: 'flightId, aircraftId',
      })
      .upgrade(async (tx) => {
        const samples: LocalDriftSample[] = [];
        await tx
          .table<LocalFlight, string>('flights')
          .each((f) => void samples.push(driftSampleOf(f)));
        await tx.table<LocalDriftSample, string>('driftSamples').bulkPut(samples);
      });
  }
}

let database: LocalDatabase | undefined;

/** The one database of this page, opened on first use. */
export function localDb(): LocalDatabase {
  return (database ??= new LocalDatabase());
}

/** For tests: forget the open handle so the next call opens a fresh database. */
export async function closeLocalDb(): Promise<void> {
  database?.close();
  database = undefined;
}

export interface SaveLocalFlightInput {
  id: string;
  fileName: string;
  file: Blob;
  columnMap?: ColumnMap;
  poles?: number;
  report: FlightReport;
  detail: ReviewDetail;
  teamId?: string;
  aircraftId?: string;
  recordedAt?: string;
}

/**
 * Keep a flight on this device and mark it for sync. Saving the same id again replaces the
 * analysis (a re-run with another airframe) and sends it again.
 */
export async function saveLocalFlight(input: SaveLocalFlightInput): Promise<LocalFlight> {
  const record: LocalFlight = {
    ...input,
    savedAt: Date.now(),
    syncState: 'pending',
    summarySynced: false,
    attempts: 0,
    nextAttemptAt: 0,
  };
  const db = localDb();
  await db.transaction('rw', db.flights, db.driftSamples, async () => {
    await db.flights.put(record);
    await db.driftSamples.put(driftSampleOf(record));
  });
  return record;
}

export function getLocalFlight(id: string): Promise<LocalFlight | undefined> {
  return localDb().flights.get(id);
}

/** Newest first. */
export async function listLocalFlights(): Promise<LocalFlight[]> {
  return (await localDb().flights.orderBy('savedAt').reverse().toArray()) as LocalFlight[];
}

/** Flights the server has not yet acknowledged (pending or failed), oldest first. */
export async function listUnsyncedFlights(): Promise<LocalFlight[]> {
  const all = await localDb().flights.orderBy('savedAt').toArray();
  return all.filter((f) => f.syncState !== 'synced');
}

/** Give an imported flight its team and aircraft (before or after a failed sync). */
export async function assignLocalFlight(
  id: string,
  target: { teamId: string; aircraftId?: string },
): Promise<void> {
  const db = localDb();
  await db.transaction('rw', db.flights, db.driftSamples, async () => {
    await db.flights.update(id, {
      teamId: target.teamId,
      aircraftId: target.aircraftId,
      syncState: 'pending',
      summarySynced: false,
      nextAttemptAt: 0,
      lastError: undefined,
    });
    await db.driftSamples.update(id, { aircraftId: target.aircraftId });
  });
}

export async function setLocalFlightHash(id: string, sha256: string): Promise<void> {
  await localDb().flights.update(id, { sha256 });
}

export async function markSummarySynced(id: string): Promise<void> {
  await localDb().flights.update(id, { summarySynced: true });
}

export async function markSynced(
  id: string,
  options: { duplicateOf?: string } = {},
): Promise<void> {
  await localDb().flights.update(id, {
    ...options,
    syncState: 'synced',
    summarySynced: true,
    syncedAt: Date.now(),
    lastError: undefined,
    nextAttemptAt: 0,
  });
}

/**
 * Record a failed attempt. `retryAt` null means the server refused for good (a 4xx that asking
 * again will not fix): the flight stays on the device, shown as failed, until retried by hand.
 */
export async function markFlightAttemptFailed(
  id: string,
  error: string,
  retryAt: number | null,
): Promise<void> {
  const flight = await localDb().flights.get(id);
  if (!flight) return;
  await localDb().flights.update(id, {
    attempts: flight.attempts + 1,
    lastError: error,
    syncState: retryAt === null ? 'failed' : 'pending',
    nextAttemptAt: retryAt ?? 0,
  });
}

/** Keep the column map confirmed for a team flight's raw log, replacing an earlier one. */
export async function saveRereadMap(flightId: string, columnMap: ColumnMap): Promise<void> {
  await localDb().rereadMaps.put({ flightId, columnMap, savedAt: Date.now() });
}

export async function getRereadMap(flightId: string): Promise<ColumnMap | undefined> {
  return (await localDb().rereadMaps.get(flightId))?.columnMap;
}

export interface EnqueueInput {
  id: string;
  method: OutboxMethod;
  path: string;
  body?: unknown;
  version?: number;
  label?: string;
}

/** Queue a write for the server; it is sent in order when online and signed in. */
export async function enqueue(input: EnqueueInput): Promise<OutboxEntry> {
  const entry: OutboxEntry = {
    ...input,
    createdAt: Date.now(),
    state: 'pending',
    attempts: 0,
    nextAttemptAt: 0,
  };
  try {
    const seq = await localDb().outbox.add(entry);
    return { ...entry, seq };
  } catch (error) {
    throw new Error(`offline, and it can’t be kept on this device: ${storeProblemText(error)}`, {
      cause: error,
    });
  }
}

/** Everything still waiting (pending and failed), in the order it was written. */
export async function listOutbox(): Promise<OutboxEntry[]> {
  return (await localDb().outbox.orderBy('seq').toArray()) as OutboxEntry[];
}

export async function removeOutboxEntry(seq: number): Promise<void> {
  await localDb().outbox.delete(seq);
}

export async function markOutboxAttemptFailed(
  seq: number,
  error: string,
  retryAt: number | null,
): Promise<void> {
  const entry = await localDb().outbox.get(seq);
  if (!entry) return;
  await localDb().outbox.update(seq, {
    attempts: entry.attempts + 1,
    lastError: error,
    state: retryAt === null ? 'failed' : 'pending',
    nextAttemptAt: retryAt ?? 0,
  });
}

/** The server holds a newer version than the write was based on: keep it for the pilot to decide. */
export async function markOutboxConflict(seq: number, currentVersion: number, error: string) {
  await localDb().outbox.update(seq, { state: 'conflict', currentVersion, lastError: error });
}

/** Overwrite: send the write again against the version the server holds now. */
export async function overwriteOutboxConflict(seq: number): Promise<void> {
  const entry = await localDb().outbox.get(seq);
  if (!entry || entry.state !== 'conflict') return;
  await localDb().outbox.update(seq, {
    state: 'pending',
    version: entry.currentVersion,
    currentVersion: undefined,
    lastError: undefined,
    nextAttemptAt: 0,
  });
}

/** Put failed flights and writes back in the queue so the next run tries them at once. */
export async function retryFailed(): Promise<void> {
  const db = localDb();
  await db.transaction('rw', db.flights, db.outbox, async () => {
    await db.flights
      .where('syncState')
      .equals('failed')
      .modify({ syncState: 'pending', nextAttemptAt: 0 });
    await db.outbox.where('state').equals('failed').modify({ state: 'pending', nextAttemptAt: 0 });
    await db.flights.where('syncState').equals('pending').modify({ nextAttemptAt: 0 });
    await db.outbox.where('state').equals('pending').modify({ nextAttemptAt: 0 });
  });
}
