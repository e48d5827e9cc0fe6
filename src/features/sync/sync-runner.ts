import {
  listOutbox,
  listUnsyncedFlights,
  markFlightAttemptFailed,
  markOutboxAttemptFailed,
  markSummarySynced,
  markSynced,
  removeOutboxEntry,
  assignLocalFlight,
  type LocalFlight,
} from '../../lib/local-db';
import { flightPath, flightRawPath } from './sync-paths';

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
  /** Items that will be tried again later. */
  deferred: number;
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
  | { kind: 'ok' }
  | { kind: 'offline'; message: string }
  | { kind: 'signed-out' }
  | { kind: 'transient'; message: string }
  | { kind: 'refused'; message: string };

async function send(deps: SyncDeps, path: string, init: RequestInit): Promise<Outcome> {
  let response: Response;
  try {
    response = await deps.fetch(path, { credentials: 'same-origin', ...init });
  } catch (error) {
    return { kind: 'offline', message: error instanceof Error ? error.message : String(error) };
  }
  if (response.ok) return { kind: 'ok' };
  if (response.status === 401) return { kind: 'signed-out' };
  const message = await errorMessage(response);
  // Time-outs, rate limits and server faults pass; other 4xx answers will not change by asking again.
  if (response.status === 408 || response.status === 429 || response.status >= 500)
    return { kind: 'transient', message };
  return { kind: 'refused', message };
}

async function errorMessage(response: Response): Promise<string> {
  try {
    const body: unknown = await response.json();
    const message = (body as { error?: { message?: unknown } })?.error?.message;
    if (typeof message === 'string') return `${response.status}: ${message}`;
  } catch {
    // not JSON; fall through to the status line
  }
  return `${response.status}: ${response.statusText || 'request failed'}`;
}

function flightBody(flight: LocalFlight, teamId: string) {
  return {
    teamId,
    aircraftId: flight.aircraftId ?? null,
    fileName: flight.fileName,
    recordedAt: flight.recordedAt ?? null,
    report: flight.report,
    detail: flight.detail,
  };
}

async function pushFlight(deps: SyncDeps, flight: LocalFlight, teamId: string): Promise<Outcome> {
  if (!flight.summarySynced) {
    const outcome = await send(deps, flightPath(flight.id), {
      method: 'PUT',
      headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
      body: JSON.stringify(flightBody(flight, teamId)),
    });
    if (outcome.kind !== 'ok') return outcome;
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
    deferred: 0,
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
    if (!teamId) continue; // waits until the user belongs to a team
    if (!flight.teamId)
      await assignLocalFlight(flight.id, { teamId, aircraftId: flight.aircraftId });

    const outcome = await pushFlight(deps, flight, teamId);
    if (outcome.kind === 'ok') {
      await markSynced(flight.id);
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
    if (entry.state === 'failed' || entry.seq === undefined) continue;
    if (entry.nextAttemptAt > deps.now()) {
      // Later writes may depend on this one (a reply on a comment), so keep the order.
      due(entry.nextAttemptAt);
      break;
    }
    const outcome = await send(deps, entry.path, {
      method: entry.method,
      headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
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
    } else {
      await markOutboxAttemptFailed(entry.seq, outcome.message, null);
      result.refused += 1;
    }
  }
  return result;
}
