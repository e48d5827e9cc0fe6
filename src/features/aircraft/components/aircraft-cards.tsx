import { Link } from 'react-router-dom';
import type { Aircraft } from '../../../../shared/schemas/aircraft';
import { SeverityBadge } from '../../../components/ui/severity-badge';
import { AirframeTopView } from '../../../components/airframe/airframe-top-view';

function when(iso: string) {
  const d = new Date(iso);
  return d.toLocaleDateString(undefined, { month: 'short', day: 'numeric', year: 'numeric' });
}

/** One card per aircraft: its shape, build figures and how its last flight read. */
export function AircraftCards({ aircraft }: { aircraft: Aircraft[] }) {
  return (
    <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3" aria-label="Aircraft">
      {aircraft.map((a) => (
        <li key={a.id} className="flex gap-3 rounded-md border border-line bg-paper-raised p-3">
          <AirframeTopView
            motors={a.airframe.motors}
            propDiameterIn={a.airframe.prop.diameterIn}
            className="h-24 w-24 shrink-0 rounded"
          />
          <div className="min-w-0 flex-1 text-sm">
            <Link
              to={`/aircraft/${a.id}`}
              className="font-semibold text-slate-brand hover:underline"
            >
              {a.name}
            </Link>
            {a.airframe.name !== a.name && (
              <p className="truncate text-xs text-ink-soft">{a.airframe.name}</p>
            )}
            <p className="num mt-1 text-xs text-ink-soft">
              {a.airframe.motors.length} motors · {a.airframe.massG} g ·{' '}
              {a.airframe.prop.diameterIn}″{a.airframe.cells ? ` · ${a.airframe.cells}S` : ''}
            </p>
            <div className="mt-2 flex flex-wrap items-center gap-2 text-xs">
              {a.lastFlight ? (
                <>
                  <SeverityBadge severity={a.lastFlight.worstSeverity} />
                  <Link
                    to={`/flights/${a.lastFlight.id}`}
                    className="text-ink-soft underline-offset-2 hover:underline"
                  >
                    last flight {when(a.lastFlight.recordedAt)}
                  </Link>
                </>
              ) : (
                <span className="text-ink-faint">no flights yet</span>
              )}
            </div>
            <p className="num mt-1 text-xs text-ink-faint">
              {a.flightCount} flight{a.flightCount === 1 ? '' : 's'}
              {a.awaitingReview > 0 && (
                <span className="text-accent-ink"> · {a.awaitingReview} awaiting review</span>
              )}
            </p>
          </div>
        </li>
      ))}
    </ul>
  );
}
