import { NavLink, useNavigate, useParams } from 'react-router-dom';
import { Alert, ErrorNote, describeError } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { Loading } from '../../components/ui/panel';
import { useDeleteAircraft, useReloadAircraft, useUpdateAircraft } from '../../api/aircraft';
import { unlessConflict, VersionConflict } from '../../components/ui/version-conflict';
import { useAircraft } from '../../api/aircraft';
import { AirframeEditor } from '../../features/aircraft/components/airframe-editor';
import { BenchRunsPanel } from '../../features/aircraft/components/bench-runs-panel';
import { PartsEditor } from '../../features/aircraft/components/parts-editor';
import { ServiceLogPanel } from '../../features/aircraft/components/service-log-panel';
import { TrendsPanel } from '../../features/aircraft/components/trends-panel';
import { useMe } from '../../api/session';
import { RequireSession } from '../../features/session/components/require-session';
import { can } from '../../../shared/auth/permissions';
import type { Aircraft } from '../../../shared/schemas/aircraft';
import type { Role } from '../../../shared/schemas/common';
import { NotFoundRoute } from './not-found';

const sections = [
  { id: 'trends', label: 'Trends' },
  { id: 'airframe', label: 'Airframe' },
  { id: 'parts', label: 'Parts' },
  { id: 'service', label: 'Service log' },
  { id: 'bench', label: 'Bench runs' },
] as const;
type Section = (typeof sections)[number]['id'];

export function AircraftRoute() {
  return (
    <RequireSession>
      <AircraftPage />
    </RequireSession>
  );
}

function AircraftPage() {
  const { aircraftId = '', section = 'trends' } = useParams();
  const aircraft = useAircraft(aircraftId);
  const me = useMe().data;
  if (!sections.some((s) => s.id === section)) return <NotFoundRoute />;
  if (aircraft.isPending) return <Loading what="the aircraft" />;
  if (aircraft.isError) return <ErrorNote error={aircraft.error} />;
  const role = me?.teams.find((t) => t.id === aircraft.data.teamId)?.role;
  return <AircraftView aircraft={aircraft.data} section={section as Section} role={role} />;
}

function AircraftView({
  aircraft,
  section,
  role,
}: {
  aircraft: Aircraft;
  section: Section;
  role: Role | undefined;
}) {
  const update = useUpdateAircraft(aircraft.id);
  const reload = useReloadAircraft(aircraft.id);
  const remove = useDeleteAircraft(aircraft.id);
  const navigate = useNavigate();
  const canEdit = can(role, 'aircraft.update');
  const a = aircraft.airframe;
  return (
    <>
      <PageHeader
        title={aircraft.name}
        lead={
          <span className="num">
            {a.name} · {a.motors.length} motors · {a.massG} g · {a.prop.diameterIn}×{a.prop.pitchIn}
            ″ {a.prop.blades}
            -blade{a.cells ? ` · ${a.cells}S` : ''}
            {a.escMaxA ? ` · ESC ${a.escMaxA} A` : ''} · {aircraft.flightCount} flight
            {aircraft.flightCount === 1 ? '' : 's'}
          </span>
        }
        actions={
          can(role, 'aircraft.delete') ? (
            <Button
              tone="danger"
              size="sm"
              disabled={remove.isPending}
              onClick={() => {
                if (window.confirm(`Delete ${aircraft.name} with its service log and bench runs?`))
                  remove.mutate(undefined, { onSuccess: () => navigate('/') });
              }}
            >
              Delete aircraft
            </Button>
          ) : undefined
        }
      />
      {remove.isError && <ErrorNote error={remove.error} />}
      <nav aria-label="Aircraft sections" className="mb-5 flex gap-1 border-b border-line text-sm">
        {sections.map((s) => (
          <NavLink
            key={s.id}
            to={`/aircraft/${aircraft.id}/${s.id}`}
            className={() =>
              '-mb-px border-b-2 px-3 py-1.5 ' +
              (s.id === section
                ? 'border-slate-brand text-slate-brand'
                : 'border-transparent text-ink-soft hover:text-ink')
            }
          >
            {s.label}
          </NavLink>
        ))}
      </nav>
      {section === 'trends' && <TrendsPanel aircraftId={aircraft.id} />}
      {section === 'airframe' && (
        <>
          {!canEdit && <Alert tone="info">Read only: your role cannot change aircraft.</Alert>}
          {update.isSuccess && !update.isPending && <Alert tone="ok">Airframe saved.</Alert>}
          <VersionConflict
            error={update.error}
            what="this aircraft"
            busy={update.isPending}
            onReload={() => void reload().then(() => update.reset())}
            onOverwrite={(version) =>
              update.variables && update.mutate({ ...update.variables, version })
            }
          />
          <AirframeEditor
            key={aircraft.updatedAt}
            initial={{ name: aircraft.name, airframe: aircraft.airframe }}
            readOnly={!canEdit}
            submitting={update.isPending}
            serverError={unlessConflict(update.error) ? describeError(update.error) : null}
            onSubmit={(value) =>
              update.mutate({
                patch: { name: value.name, airframe: value.airframe },
                // The form is remounted whenever the aircraft changes, so this is its start.
                version: aircraft.version,
              })
            }
          />
        </>
      )}
      {section === 'parts' && (
        <PartsEditor
          aircraftId={aircraft.id}
          version={aircraft.version}
          initial={{ components: aircraft.components, notes: aircraft.notes }}
          readOnly={!canEdit}
        />
      )}
      {section === 'service' && (
        <ServiceLogPanel
          aircraftId={aircraft.id}
          motorCount={a.motors.length}
          canAdd={can(role, 'serviceLog.create')}
        />
      )}
      {section === 'bench' && (
        <BenchRunsPanel aircraftId={aircraft.id} canAdd={can(role, 'benchRuns.create')} />
      )}
    </>
  );
}
