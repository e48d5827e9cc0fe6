import { useOnline } from '../../../lib/use-online';
import { useSyncSummary } from '../use-sync';

/** Header line: is this device online, and does it still hold flights or writes the server lacks? */
export function SyncIndicator() {
  const online = useOnline();
  const summary = useSyncSummary();
  const waiting = (summary?.pendingFlights ?? 0) + (summary?.failedFlights ?? 0);
  const writes = (summary?.pendingWrites ?? 0) + (summary?.failedWrites ?? 0);
  const conflicts = summary?.conflicts ?? 0;
  const failed = (summary?.failedFlights ?? 0) + (summary?.failedWrites ?? 0) + conflicts;
  const parts: string[] = [];
  if (waiting > 0) parts.push(`${waiting} flight${waiting === 1 ? '' : 's'} not synced`);
  if (writes > 0) parts.push(`${writes} change${writes === 1 ? '' : 's'} queued`);
  if (conflicts > 0) parts.push(`${conflicts} conflict${conflicts === 1 ? '' : 's'} to resolve`);
  const text = !online
    ? `Offline${parts.length ? ' · ' + parts.join(' · ') : ''}`
    : summary?.running
      ? 'Syncing…'
      : parts.length
        ? parts.join(' · ')
        : 'All synced';
  return (
    <span
      aria-label="Sync"
      aria-live="polite"
      className="flex items-center gap-1.5 text-xs text-ink-soft"
    >
      <span
        aria-hidden
        className={
          'inline-block h-2 w-2 rounded-sm ' +
          (!online
            ? 'bg-ink-faint'
            : failed > 0
              ? 'bg-sev-act'
              : parts.length
                ? 'bg-accent'
                : 'bg-ok')
        }
      />
      <span data-testid="sync-state">{text}</span>
    </span>
  );
}
