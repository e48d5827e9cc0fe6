import { useEffect, useSyncExternalStore } from 'react';
import { localDb } from '../../lib/local-db';
import { useLocalLiveQuery, useLocalStoreProblem } from '../../lib/local-store-status';
import { useOnline } from '../../lib/use-online';
import { onSyncPass, setSyncTeam, syncEngine } from './sync-engine';
import type { SyncPassResult } from './sync-runner';

/**
 * Keeps the sync engine running while the app is open: enabled when the browser is online and
 * someone is signed in, kicked whenever the local store changes.
 */
export function useSyncDriver(options: {
  signedIn: boolean;
  teamId: string | undefined;
  onPass?: (result: SyncPassResult) => void;
}) {
  const online = useOnline();
  // Without the store there is nothing kept to send; the app works online directly.
  const storeWorks = useLocalStoreProblem() === null;
  const { signedIn, teamId, onPass } = options;

  useEffect(() => setSyncTeam(teamId), [teamId]);

  useEffect(() => {
    const engine = syncEngine();
    const run = online && signedIn && storeWorks;
    engine.setEnabled(run);
    if (run) engine.kick();
  }, [online, signedIn, teamId, storeWorks]);

  useEffect(() => (onPass ? onSyncPass(onPass) : undefined), [onPass]);

  // A new flight or a queued write: try to send it at once. Keyed by the newest save and the
  // newest outbox entry, which only grow, so every addition is seen.
  const changeStamp = useLocalLiveQuery(
    async () => {
      const db = localDb();
      const [flight, write] = await Promise.all([
        db.flights.orderBy('savedAt').last(),
        db.outbox.orderBy('seq').last(),
      ]);
      return `${flight?.savedAt ?? 0}:${write?.seq ?? 0}`;
    },
    [],
    '0:0',
  );
  useEffect(() => {
    if (changeStamp && changeStamp !== '0:0') syncEngine().kick();
  }, [changeStamp]);
}

export interface SyncSummary {
  /** Local flights the server has not acknowledged yet. */
  pendingFlights: number;
  failedFlights: number;
  pendingWrites: number;
  failedWrites: number;
  /** Offline edits someone else overtook; they wait for the pilot to choose. */
  conflicts: number;
  running: boolean;
  lastError: string | null;
}

/** What the header and the fleet show about this device's unsent work. */
export function useSyncSummary(): SyncSummary | undefined {
  const engine = syncEngine();
  const state = useSyncExternalStore(engine.subscribe, engine.getState, engine.getState);
  const counts = useLocalLiveQuery(
    async () => {
      const db = localDb();
      // Counts through the indexes: the records themselves carry whole logs.
      const [pendingFlights, failedFlights, pendingWrites, failedWrites, conflicts] =
        await Promise.all([
          db.flights.where('syncState').equals('pending').count(),
          db.flights.where('syncState').equals('failed').count(),
          db.outbox.where('state').equals('pending').count(),
          db.outbox.where('state').equals('failed').count(),
          db.outbox.where('state').equals('conflict').count(),
        ]);
      return { pendingFlights, failedFlights, pendingWrites, failedWrites, conflicts };
    },
    [],
    undefined,
  );
  if (!counts) return undefined;
  return { ...counts, running: state.running, lastError: state.lastError };
}
