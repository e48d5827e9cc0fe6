import { Link } from 'react-router-dom';
import {
  assignLocalFlight,
  listLocalFlights,
  retryFailed,
  type LocalFlight,
} from '../../../lib/local-db';
import { useLocalLiveQuery, useLocalStoreProblem } from '../../../lib/local-store-status';
import { Button } from '../../../components/ui/button';
import { syncEngine } from '../sync-engine';
import { useSyncSummary } from '../use-sync';
import { OutboxList } from './outbox-list';

const stateText = (f: Pick<LocalFlight, 'syncState' | 'aircraftId' | 'lastError'>) =>
  f.syncState === 'failed'
    ? 'refused'
    : !f.aircraftId
      ? 'needs an aircraft'
      : f.lastError
        ? 'retrying'
        : 'waiting';

/**
 * Flights read on this device that the server does not have yet: what each is waiting for,
 * the server's reason when it refused one, and a way to file an "unknown quad" under an aircraft.
 */
export function LocalFlightsPanel({
  teamId,
  aircraft,
  canUpload,
}: {
  teamId: string;
  aircraft: { id: string; name: string }[];
  canUpload: boolean;
}) {
  const summary = useSyncSummary();
  const storeProblem = useLocalStoreProblem();
  const flights = useLocalLiveQuery(
    async () =>
      (await listLocalFlights())
        .filter((f) => f.syncState !== 'synced')
        .map(({ file: _file, detail: _detail, ...rest }) => rest),
    [],
    [],
  );
  // Nothing is kept here, so nothing waits here either; the header note says why.
  if (storeProblem !== null)
    return <p className="text-sm text-ink-soft">Nothing is kept on this device.</p>;
  const writes = summary ? summary.pendingWrites + summary.failedWrites + summary.conflicts : 0;
  if (!flights || flights.length === 0) {
    if (writes > 0)
      return (
        <div className="space-y-2">
          <p className="text-sm text-ink-soft">
            <span className="num">{writes}</span> change{writes === 1 ? '' : 's'} made offline{' '}
            {writes === 1 ? 'is' : 'are'} queued for the server.
          </p>
          <OutboxList />
        </div>
      );
    return (
      <p className="text-sm text-ink-soft">Every flight read on this device is on the server.</p>
    );
  }
  return (
    <div className="space-y-2">
      <ul className="divide-y divide-line/70 text-sm" aria-label="Flights on this device">
        {flights.map((f) => (
          <li key={f.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-1.5">
            <Link
              to={`/flights/${f.id}`}
              className="font-mono text-xs text-slate-brand hover:underline"
            >
              {f.fileName}
            </Link>
            <span className="text-xs text-ink-faint">{f.report.airframe.name}</span>
            <span
              className={
                'text-xs ' + (f.syncState === 'failed' ? 'text-sev-act' : 'text-accent-ink')
              }
            >
              {stateText(f)}
            </span>
            {f.lastError && <span className="text-xs text-ink-soft">{f.lastError}</span>}
            {!f.aircraftId && canUpload && aircraft.length > 0 && (
              <select
                aria-label={`Aircraft for ${f.fileName}`}
                className="ml-auto rounded border border-line-strong bg-paper-raised px-2 py-0.5 text-xs"
                defaultValue=""
                onChange={(e) => {
                  if (e.target.value)
                    void assignLocalFlight(f.id, { teamId, aircraftId: e.target.value }).then(() =>
                      syncEngine().kick(),
                    );
                }}
              >
                <option value="" disabled>
                  File under…
                </option>
                {aircraft.map((a) => (
                  <option key={a.id} value={a.id}>
                    {a.name}
                  </option>
                ))}
              </select>
            )}
          </li>
        ))}
      </ul>
      <OutboxList />
      <Button
        size="sm"
        onClick={() => {
          void retryFailed().then(() => syncEngine().kick());
        }}
      >
        Try again now
      </Button>
    </div>
  );
}
