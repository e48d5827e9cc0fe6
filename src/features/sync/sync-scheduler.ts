import { runSyncPass, type SyncDeps, type SyncPassResult } from './sync-runner';

/** How long to wait before trying an unreachable server again, ms. */
export const OFFLINE_RETRY_MS = 30_000;

export interface SyncSchedulerState {
  running: boolean;
  lastResult: SyncPassResult | null;
  lastRunAt: number | null;
  lastError: string | null;
}

export interface SyncScheduler {
  /** Run a pass now, or right after the one in progress. */
  kick(): void;
  /** Whether passes may run at all (online and signed in). */
  setEnabled(enabled: boolean): void;
  getState(): SyncSchedulerState;
  subscribe(listener: () => void): () => void;
  stop(): void;
}

/**
 * Runs sync passes one at a time: when kicked (a new flight, a queued write, back online) and
 * again when the earliest back-off is due. Never two passes at once, so a flight is not sent
 * twice in parallel.
 */
export function createSyncScheduler(
  deps: SyncDeps,
  options: {
    run?: (deps: SyncDeps) => Promise<SyncPassResult>;
    onPass?: (result: SyncPassResult) => void;
  } = {},
): SyncScheduler {
  const run = options.run ?? runSyncPass;
  let enabled = false;
  let again = false;
  let stopped = false;
  let timer: ReturnType<typeof setTimeout> | undefined;
  let state: SyncSchedulerState = {
    running: false,
    lastResult: null,
    lastRunAt: null,
    lastError: null,
  };
  const listeners = new Set<() => void>();
  const set = (patch: Partial<SyncSchedulerState>) => {
    state = { ...state, ...patch };
    listeners.forEach((l) => l());
  };

  const schedule = (at: number | null) => {
    if (timer) clearTimeout(timer);
    timer = undefined;
    if (at === null || stopped) return;
    timer = setTimeout(kick, Math.max(0, at - deps.now()));
  };

  async function loop() {
    set({ running: true });
    do {
      again = false;
      try {
        const result = await run(deps);
        set({ lastResult: result, lastRunAt: deps.now(), lastError: null });
        options.onPass?.(result);
        // Unreachable server while the browser says online: look again in a while. Signed out:
        // wait for the session to come back (setEnabled).
        schedule(
          result.stoppedBy === 'offline'
            ? deps.now() + OFFLINE_RETRY_MS
            : result.stoppedBy === 'signed-out'
              ? null
              : result.nextRetryAt,
        );
      } catch (error) {
        // IndexedDB trouble or a bug: report it and try again later rather than spin.
        set({
          lastError: error instanceof Error ? error.message : String(error),
          lastRunAt: deps.now(),
        });
        schedule(deps.now() + 30_000);
      }
    } while (again && enabled && !stopped);
    set({ running: false });
  }

  function kick() {
    if (!enabled || stopped) return;
    if (state.running) {
      again = true;
      return;
    }
    void loop();
  }

  return {
    kick,
    setEnabled(next) {
      const was = enabled;
      enabled = next;
      if (!next) schedule(null);
      if (next && !was) kick();
    },
    getState: () => state,
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    stop() {
      stopped = true;
      schedule(null);
    },
  };
}
