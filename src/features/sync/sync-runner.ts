import {
  getLocalFlight,
  listOutbox,
  listUnsyncedFlights,
  markFlightAttemptFailed,
  markOutboxAttemptFailed,
  markOutboxConflict,
  markSummarySynced,
  markSynced,
  removeOutboxEntry,
  assignLocalFlight,
  setLocalFlightHash,
  type LocalFlight,
} from '../../lib/local-db';
import type { FlightPutInput } from '../../../shared/schemas/flights';
import { flightPath, flightRawPath } from '../../api/flights';
import { ifMatch, versionFromEtag } from '../../lib/api-fetch';

/**
 * One pass over what this device still owes the server: first the flights (summary, then raw
 * log), then the outbox in the order it was written. Every request is idempotent because ids
 * are client UUIDs, so a pass cut off half-way is simply run again.
 */

export interface SyncDeps {
  fetch: typeof fetch;
  now: () => number;
  /** Team for flights imported before a team was chosen (signed out, or no team yet). */
  defaultTeamId: () => string | undefined;
}

export type StopReason = 'offline' | 'signed-out' | null;

export interface SyncPassResult {
  flightsSynced: number;
  writesSent: number;
  /** Items refused for good this pass; they stay on the device, marked failed. */
  refused: number;
  /** Edits someone else overtook (412); they wait for the pilot to overwrite or drop them. */
  conflicts: number;
  /** Items that will be tried again later. */
  deferred: number;
  /** Flights that cannot go until someone picks their team and aircraft. */
  waiting: number;
  stoppedBy: StopReason;
  /** Earliest time a deferred item is due, ms since epoch; null when nothing waits. */
  nextRetryAt: number | null;
}

const BASE_DELAY_MS = 2_000;
const MAX_DELAY_MS = 5 * 60_000;

/** Exponential back-off: 2 s, 4 s, 8 s … capped at 5 min. `attempts` counts earlier failures. */
export function backoffDelayMs(attempts: number): number {
  return Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** Math.max(0, attempts));
}

type Outcome =
  | { kind: 'ok'; body?: unknown }
  | { kind: 'offline'; message: string }
  | { kind: 'signed-out' }
  | { kind: 'transient'; message: string }
  | { kind: 'conflict'; message: string; currentVersion: number }
  | { kind: 'refused'; message: string };

async function send(deps: SyncDeps, path: string, init: RequestInit): Promise<Outcome> {
  let response: Response;
  try {
    response = await deps.fetch(path, { credentials: 'same-origin', ...init });
  } catch (error) {
    return { kind: 'offline', message: error instanceof Error ? error.message : String(error) };
  }
  if (response.ok) return { kind: 'ok', body: await response.json().catch(() => undefined) };
  if (response.status === 401) return { kind: 'signed-out' };
  const { message, currentVersion } = await errorOf(response);
  if (response.status === 412 && currentVersion !== undefined)
    return { kind: 'conflict', message, currentVersion };
  // Time-outs, rate limits and server faults pass; other 4xx answers will not change by asking again.
  if (response.status === 408 || response.status === 429 || response.status >= 500)
    return { kind: 'transient', message };
  return { kind: 'refused', message };
}

async function errorOf(response: Response): Promise<{ message: string; currentVersion?: number }> {
  const currentVersion = versionFromEtag(response.headers.get('etag'));
  try {
    const body: unknown = await response.json();
    const error = (body as { error?: { message?: unknown; currentVersion?: unknown } })?.error;
    if (typeof error?.message === 'string')
      return {
        message: `${response.status}: ${error.message}`,
        currentVersion:
          typeof error.currentVersion === 'number' ? error.currentVersion : currentVersion,
      };
  } catch {
    // not JSON; fall through to the status line
  }
  return {
    message: `${response.status}: ${response.statusText || 'request failed'}`,
    currentVersion,
  };
}

/** Hex SHA-256 of the raw log as dropped; the server uses it to spot the same file twice. */
export async function sha256Hex(blob: Blob): Promise<string> {
  const digest = await crypto.subtle.digest('SHA-256', await blob.arrayBuffer());
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('');
}

function flightBody(
  flight: LocalFlight,
  target: { teamId: string; aircraftId: string },
  sha256: string,
): FlightPutInput {
  return {
    ...target,
    // A log without a recorded time is dated when it was read on this device.
    recordedAt: flight.recordedAt ?? new Date(flight.savedAt).toISOString(),
    fileName: flight.fileName,
    sha256,
    sizeBytes: flight.file.size,
    report: flight.report,
    detail: flight.detail,
  };
}

type FlightOutcome = Outcome | { kind: 'duplicate'; of: string };

async function pushFlight(
  deps: SyncDeps,
  flight: LocalFlight,
  target: { teamId: string; aircraftId: string },
): Promise<FlightOutcome> {
  if (!flight.summarySynced) {
    const sha256 = flight.sha256 ?? (await sha256Hex(flight.file));
    if (!flight.sha256) await setLocalFlightHash(flight.id, sha256);
    const outcome = await send(deps, flightPath(flight.id), {
      method: 'PUT',
      headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
      body: JSON.stringify(flightBody(flight, target, sha256)),
    });
    if (outcome.kind !== 'ok') return outcome;
    const answer = outcome.body as { outcome?: string; flight?: { id?: string } } | undefined;
    // The same bytes are stored already as another flight: nothing more to send.
    if (answer?.outcome === 'duplicate' && answer.flight?.id && answer.flight.id !== flight.id)
      return { kind: 'duplicate', of: answer.flight.id };
    await markSummarySynced(flight.id);
  }
  const form = new FormData();
  form.append('file', flight.file, flight.fileName);
  return send(deps, flightRawPath(flight.id), { method: 'PUT', body: form });
}

export async function runSyncPass(deps: SyncDeps): Promise<SyncPassResult> {
  const result: SyncPassResult = {
    flightsSynced: 0,
    writesSent: 0,
    refused: 0,
    conflicts: 0,
    deferred: 0,
    waiting: 0,
    stoppedBy: null,
    nextRetryAt: null,
  };
  const due = (at: number) => {
    result.deferred += 1;
    result.nextRetryAt = result.nextRetryAt === null ? at : Math.min(result.nextRetryAt, at);
  };

  for (const flight of await listUnsyncedFlights()) {
    if (flight.syncState === 'failed') continue;
    if (flight.nextAttemptAt > deps.now()) {
      due(flight.nextAttemptAt);
      continue;
    }
    const teamId = flight.teamId ?? deps.defaultTeamId();
    // The server files every flight under an aircraft; an "unknown quad" waits for the pilot.
    if (!teamId || !flight.aircraftId) {
      result.waiting += 1;
      continue;
    }
    if (!flight.teamId)
      await assignLocalFlight(flight.id, { teamId, aircraftId: flight.aircraftId });

    const outcome = await pushFlight(deps, flight, { teamId, aircraftId: flight.aircraftId });
    if (outcome.kind === 'ok' || outcome.kind === 'duplicate') {
      await markSynced(flight.id, outcome.kind === 'duplicate' ? { duplicateOf: outcome.of } : {});
      result.flightsSynced += 1;
    } else if (outcome.kind === 'offline' || outcome.kind === 'signed-out') {
      result.stoppedBy = outcome.kind === 'offline' ? 'offline' : 'signed-out';
      return result;
    } else if (outcome.kind === 'transient') {
      const at = deps.now() + backoffDelayMs(flight.attempts);
      await markFlightAttemptFailed(flight.id, outcome.message, at);
      due(at);
    } else {
      await markFlightAttemptFailed(flight.id, outcome.message, null);
      result.refused += 1;
    }
  }

  for (const entry of await listOutbox()) {
    if (entry.state !== 'pending' || entry.seq === undefined) continue;
    // A comment on a flight still only on this device waits for that flight, and so does
    // everything queued after it.
    const flightId = (entry.body as { flightId?: unknown } | undefined)?.flightId;
    if (typeof flightId === 'string') {
      const local = await getLocalFlight(flightId);
      if (local && local.syncState !== 'synced') {
        result.waiting += 1;
        break;
      }
    }
    if (entry.nextAttemptAt > deps.now()) {
      // Later writes may depend on this one (a reply on a comment), so keep the order.
      due(entry.nextAttemptAt);
      break;
    }
    const outcome = await send(deps, entry.path, {
      method: entry.method,
      headers: {
        'Content-Type': 'application/json',
        Accept: 'application/json',
        // An edit made offline names the version it started from: a newer one is not overwritten.
        ...(entry.version !== undefined ? ifMatch(entry.version) : {}),
      },
      body: entry.body === undefined ? undefined : JSON.stringify(entry.body),
    });
    if (outcome.kind === 'ok') {
      await removeOutboxEntry(entry.seq);
      result.writesSent += 1;
    } else if (outcome.kind === 'offline' || outcome.kind === 'signed-out') {
      result.stoppedBy = outcome.kind === 'offline' ? 'offline' : 'signed-out';
      return result;
    } else if (outcome.kind === 'transient') {
      const at = deps.now() + backoffDelayMs(entry.attempts);
      await markOutboxAttemptFailed(entry.seq, outcome.message, at);
      due(at);
      break;
    } else if (outcome.kind === 'conflict') {
      await markOutboxConflict(entry.seq, outcome.currentVersion, outcome.message);
      result.conflicts += 1;
    } else {
      await markOutboxAttemptFailed(entry.seq, outcome.message, null);
      result.refused += 1;
    }
  }
  return result;
}
