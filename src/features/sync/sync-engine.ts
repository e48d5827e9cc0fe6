import { createSyncScheduler, type SyncScheduler } from './sync-scheduler';
import type { SyncPassResult } from './sync-runner';

let activeTeamId: string | undefined;
const passListeners = new Set<(result: SyncPassResult) => void>();

/** The one scheduler of this tab, created on first use. */
let scheduler: SyncScheduler | undefined;
export function syncEngine(): SyncScheduler {
  return (scheduler ??= createSyncScheduler(
    {
      fetch: (input, init) => fetch(input, init),
      now: () => Date.now(),
      defaultTeamId: () => activeTeamId,
    },
    { onPass: (result) => passListeners.forEach((l) => l(result)) },
  ));
}

/** Team that flights imported without one are kept in when they sync. */
export function setSyncTeam(teamId: string | undefined) {
  activeTeamId = teamId;
}

export function onSyncPass(listener: (result: SyncPassResult) => void): () => void {
  passListeners.add(listener);
  return () => passListeners.delete(listener);
}
