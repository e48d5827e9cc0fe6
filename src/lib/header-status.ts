/**
 * The one status model of the header: the network (the browser's own word), our server
 * (answering or not; out of reach whenever there is no network, whatever it last said) and the
 * sync (what this device still owes the server). Both header lines are read from this, so they
 * never tell two stories ("Offline" beside "Server online").
 */

export type ServerAnswer = 'checking' | 'answering' | 'not-answering';

export interface SyncCounts {
  /** Flights read on this device that the server lacks (waiting or refused). */
  flights: number;
  /** Changes made offline still queued (waiting or refused). */
  changes: number;
  /** Offline edits someone else overtook, waiting for the pilot's choice. */
  conflicts: number;
  /** Refused items and conflicts: something needs a person. */
  needsAttention: number;
  running: boolean;
}

export type Tone = 'ok' | 'idle' | 'busy' | 'bad';

export interface HeaderStatus {
  network: 'online' | 'offline';
  server: { label: string; tone: Tone; answering: boolean };
  sync: { label: string; tone: Tone };
}

const plural = (n: number, one: string, many = one + 's') => `${n} ${n === 1 ? one : many}`;

export function headerStatus(
  online: boolean,
  server: ServerAnswer,
  sync: SyncCounts | undefined,
): HeaderStatus {
  const answering = online && server === 'answering';
  const serverPart = !online
    ? { label: 'Server out of reach', tone: 'idle' as const }
    : server === 'checking'
      ? { label: 'Checking server…', tone: 'idle' as const }
      : answering
        ? { label: 'Server online', tone: 'ok' as const }
        : { label: 'Server not answering', tone: 'busy' as const };

  const parts: string[] = [];
  if (sync && sync.flights > 0) parts.push(`${plural(sync.flights, 'flight')} not synced`);
  if (sync && sync.changes > 0) parts.push(`${plural(sync.changes, 'change')} queued`);
  if (sync && sync.conflicts > 0) parts.push(`${plural(sync.conflicts, 'conflict')} to resolve`);
  const waiting = parts.join(' · ');
  const syncPart = !online
    ? { label: 'Offline' + (waiting ? ` · ${waiting}` : ''), tone: 'idle' as const }
    : sync?.running && answering
      ? { label: 'Syncing…', tone: 'busy' as const }
      : waiting
        ? { label: waiting, tone: (sync?.needsAttention ? 'bad' : 'busy') as Tone }
        : { label: 'All synced', tone: 'ok' as const };

  return {
    network: online ? 'online' : 'offline',
    server: { ...serverPart, answering },
    sync: syncPart,
  };
}

/** The dot colour of a tone (Tailwind classes of our palette). */
export const toneDot: Record<Tone, string> = {
  ok: 'bg-ok',
  idle: 'bg-ink-faint',
  busy: 'bg-accent',
  bad: 'bg-sev-act',
};
