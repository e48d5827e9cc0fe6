import { useServerAnswer } from '../../../api/health';
import { headerStatus, toneDot } from '../../../lib/header-status';
import { useOnline } from '../../../lib/use-online';
import { useSyncSummary } from '../use-sync';

/**
 * Header line: does this device still hold flights or writes the server lacks? Read through the
 * header's one status model (src/lib/header-status.ts) with the network and the server.
 */
export function SyncIndicator() {
  const summary = useSyncSummary();
  const { sync } = headerStatus(
    useOnline(),
    useServerAnswer(),
    summary && {
      flights: summary.pendingFlights + summary.failedFlights,
      changes: summary.pendingWrites + summary.failedWrites,
      conflicts: summary.conflicts,
      needsAttention: summary.failedFlights + summary.failedWrites + summary.conflicts,
      running: summary.running,
    },
  );
  return (
    <span
      aria-label="Sync"
      aria-live="polite"
      className="flex items-center gap-1.5 text-xs text-ink-soft"
    >
      <span aria-hidden className={'inline-block h-2 w-2 rounded-sm ' + toneDot[sync.tone]} />
      <span data-testid="sync-state">{sync.label}</span>
    </span>
  );
}
