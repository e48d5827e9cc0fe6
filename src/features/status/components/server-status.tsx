import { useHealth } from '../../../api/health';
import { useOnline } from '../../../lib/use-online';

/**
 * Whether our server answers, read together with the network: with no network the server is
 * out of reach whatever it last said, so the header never says "Offline" beside "Server online".
 * The app keeps working offline either way.
 */
export function ServerStatus() {
  const network = useOnline();
  const health = useHealth();
  const answering = network && health.data?.ok === true && !health.isError;
  const label = !network
    ? 'Server out of reach'
    : health.isPending
      ? 'Checking server…'
      : answering
        ? 'Server online'
        : 'Server not answering';
  return (
    <span className="flex items-center gap-2 text-xs text-ink-soft" role="status">
      <span
        aria-hidden
        className={
          'h-2 w-2 rounded-full ' +
          (answering ? 'bg-ok' : !network || health.isPending ? 'bg-ink-faint' : 'bg-accent')
        }
      />
      {label}
    </span>
  );
}
