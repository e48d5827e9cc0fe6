import { useHealth } from '../../../api/health';

/** Whether the team server answers; the app keeps working offline either way. */
export function ServerStatus() {
  const health = useHealth();
  const online = health.data?.ok === true;
  const label = health.isPending
    ? 'Checking server…'
    : online
      ? 'Server online'
      : 'Working offline';
  return (
    <span className="flex items-center gap-2 text-xs text-ink-soft" role="status">
      <span
        aria-hidden
        className={
          'h-2 w-2 rounded-full ' +
          (online ? 'bg-ok' : health.isPending ? 'bg-ink-faint' : 'bg-accent')
        }
      />
      {label}
    </span>
  );
}
