import { useServerAnswer } from '../../../api/health';
import { headerStatus, toneDot } from '../../../lib/header-status';
import { useOnline } from '../../../lib/use-online';

/**
 * Whether our server answers, read with the network through the header's one status model
 * (src/lib/header-status.ts): with no network it is out of reach whatever it last said.
 * The app keeps working offline either way.
 */
export function ServerStatus() {
  const { server } = headerStatus(useOnline(), useServerAnswer(), undefined);
  return (
    <span className="flex items-center gap-2 text-xs text-ink-soft" role="status">
      <span aria-hidden className={'h-2 w-2 rounded-full ' + toneDot[server.tone]} />
      {server.label}
    </span>
  );
}
