import { Link } from 'react-router-dom';
import { ErrorNote } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Empty, Loading, Panel } from '../../components/ui/panel';
import { useTeamAircraft } from '../../api/aircraft';
import { AircraftCards } from '../../features/aircraft/components/aircraft-cards';
import { useAwaitingReview, useFlightList } from '../../api/flight-list';
import { FlightFilters } from '../../features/flight-list/components/flight-filters';
import { useFilterParams } from '../../features/flight-list/model/use-filter-params';
import { FlightTable } from '../../features/flight-list/components/flight-table';
import { useActiveTeam } from '../../features/session/active-team';
import { RequireSession } from '../../features/session/components/require-session';
import { useMembers } from '../../api/members';
import { LocalFlightsPanel } from '../../features/sync/components/local-flights-panel';
import { can } from '../../../shared/auth/permissions';
import { NoTeam } from './no-team';

/**
 * What the fleet says for a team list it has never fetched, while there is no network. A list
 * fetched before (kept across reloads, src/app/query-persistence.ts) is shown as it was, also
 * when asking again fails: the header says the server is out of reach.
 */
const offlineNote =
  'Offline: the team’s list opens when the network is back. Flights on this device are listed under “On this device”.';

export function FleetRoute() {
  return (
    <RequireSession>
      <Fleet />
    </RequireSession>
  );
}

function Fleet() {
  const { team } = useActiveTeam();
  if (!team) return <NoTeam title="Fleet" />;
  return <TeamFleet teamId={team.id} teamName={team.name} role={team.role} />;
}

function TeamFleet({
  teamId,
  teamName,
  role,
}: {
  teamId: string;
  teamName: string;
  role: Parameters<typeof can>[0];
}) {
  const aircraft = useTeamAircraft(teamId);
  const awaiting = useAwaitingReview(teamId);
  const [filter, setFilter] = useFilterParams();
  const flights = useFlightList(teamId, filter);
  const members = useMembers(teamId);
  const aircraftOptions = (aircraft.data?.aircraft ?? []).map((a) => ({ id: a.id, name: a.name }));
  const pilotOptions = (members.data?.members ?? []).map((m) => ({ id: m.userId, name: m.name }));
  const rows = flights.data?.pages.flatMap((p) => p.flights) ?? [];

  return (
    <>
      <PageHeader
        title="Fleet"
        lead={`${teamName}: every aircraft with its last verdict, the flights waiting for review, and what this device has not synced yet.`}
        actions={
          can(role, 'aircraft.create') ? (
            <Link
              to="/aircraft/new"
              className="rounded bg-slate-brand px-3 py-1.5 text-sm font-medium text-paper hover:bg-ink"
            >
              Add aircraft
            </Link>
          ) : undefined
        }
      />
      <div className="space-y-6">
        {!aircraft.data && aircraft.fetchStatus === 'paused' ? (
          <Empty>{offlineNote}</Empty>
        ) : !aircraft.data && aircraft.isError ? (
          <ErrorNote error={aircraft.error} />
        ) : !aircraft.data ? (
          <Loading what="aircraft" />
        ) : aircraft.data.aircraft.length === 0 ? (
          <Empty>
            No aircraft yet.{' '}
            {can(role, 'aircraft.create') ? (
              <Link to="/aircraft/new" className="text-accent-ink underline">
                Add the first one from a layout preset.
              </Link>
            ) : (
              'A tuner or the owner adds them.'
            )}
          </Empty>
        ) : (
          <AircraftCards aircraft={aircraft.data.aircraft} />
        )}

        <div className="grid grid-cols-[minmax(0,1fr)] gap-4 md:grid-cols-2">
          <Panel title="Awaiting review">
            {!awaiting.data && awaiting.fetchStatus === 'paused' ? (
              <p className="text-sm text-ink-soft">{offlineNote}</p>
            ) : !awaiting.data && awaiting.isError ? (
              <ErrorNote error={awaiting.error} />
            ) : !awaiting.data ? (
              <Loading what="flights awaiting review" />
            ) : awaiting.data.flights.length === 0 ? (
              <p className="text-sm text-ink-soft">Nobody has asked for a review.</p>
            ) : (
              <ul className="divide-y divide-line/70 text-sm">
                {awaiting.data.flights.map((f) => (
                  <li key={f.id} className="flex items-center gap-3 py-1.5">
                    <Link to={`/flights/${f.id}`} className="text-slate-brand hover:underline">
                      {f.aircraftName}
                    </Link>
                    <span className="text-xs text-ink-soft">by {f.pilot.name}</span>
                    <span className="num ml-auto text-xs text-ink-faint">
                      {new Date(f.recordedAt).toLocaleDateString()}
                    </span>
                  </li>
                ))}
              </ul>
            )}
          </Panel>
          <Panel title="On this device">
            <LocalFlightsPanel
              teamId={teamId}
              aircraft={aircraftOptions}
              canUpload={can(role, 'flights.upload')}
            />
          </Panel>
        </div>

        <Panel title="Flights">
          <div className="space-y-4">
            <FlightFilters
              filter={filter}
              aircraft={aircraftOptions}
              pilots={pilotOptions}
              onChange={setFilter}
            />
            {!flights.data && flights.fetchStatus === 'paused' ? (
              <Empty>{offlineNote}</Empty>
            ) : !flights.data && flights.isError ? (
              <ErrorNote error={flights.error} />
            ) : !flights.data ? (
              <Loading what="flights" />
            ) : rows.length === 0 ? (
              <Empty>
                No flights match.{' '}
                <Link to="/import" className="text-accent-ink underline">
                  Import a log
                </Link>{' '}
                to add one.
              </Empty>
            ) : (
              <>
                <FlightTable flights={rows} />
                {flights.hasNextPage && (
                  <Button
                    onClick={() => void flights.fetchNextPage()}
                    disabled={flights.isFetchingNextPage}
                  >
                    {flights.isFetchingNextPage ? 'Loading…' : 'Show older flights'}
                  </Button>
                )}
              </>
            )}
          </div>
        </Panel>
      </div>
    </>
  );
}
