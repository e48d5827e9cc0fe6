import { ErrorNote } from './alert';
import { Empty, Loading } from './panel';

/**
 * What stands where a list has no data yet. A list fetched before is shown as it was even when
 * asking again fails (lists are kept across reloads, src/app/query-persistence.ts), so this is
 * only for one never fetched: waiting for the network, the error, or loading.
 */
export function NoDataYet({
  query,
  what,
}: {
  query: { isError: boolean; error: unknown; fetchStatus: string };
  what: string;
}) {
  if (query.isError) return <ErrorNote error={query.error} />;
  if (query.fetchStatus === 'paused')
    return <Empty>Offline: the {what} open when the network is back.</Empty>;
  return <Loading what={what} />;
}
