import { useNavigate } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { Alert, describeError } from '../../components/ui/alert';
import { useCreateAircraft } from '../../api/aircraft';
import { AirframeEditor } from '../../features/aircraft/components/airframe-editor';
import { newAirframeForm } from '../../features/aircraft/model/airframe-form';
import { useActiveTeam } from '../../features/session/active-team';
import { RequireSession } from '../../features/session/components/require-session';
import { can } from '../../../shared/auth/permissions';
import { NoTeam } from './no-team';

export function NewAircraftRoute() {
  return (
    <RequireSession>
      <NewAircraft />
    </RequireSession>
  );
}

function NewAircraft() {
  const { team } = useActiveTeam();
  if (!team) return <NoTeam title="Add aircraft" />;
  return (
    <NewAircraftForTeam
      teamId={team.id}
      teamName={team.name}
      allowed={can(team.role, 'aircraft.create')}
    />
  );
}

function NewAircraftForTeam({
  teamId,
  teamName,
  allowed,
}: {
  teamId: string;
  teamName: string;
  allowed: boolean;
}) {
  const create = useCreateAircraft(teamId);
  const navigate = useNavigate();
  return (
    <>
      <PageHeader
        title="Add aircraft"
        lead={`To ${teamName}. Start from a layout preset, then correct the motor table to the real build: motor N here is the log's motorN column.`}
      />
      {!allowed ? (
        <Alert tone="info">
          Your role in this team cannot add aircraft; ask a tuner or the owner.
        </Alert>
      ) : (
        <AirframeEditor
          initial={newAirframeForm()}
          submitLabel="Add aircraft"
          submitting={create.isPending}
          serverError={create.isError ? describeError(create.error) : null}
          onSubmit={(value) =>
            create.mutate(
              { name: value.name, airframe: value.airframe },
              { onSuccess: (aircraft) => navigate(`/aircraft/${aircraft.id}`) },
            )
          }
        />
      )}
    </>
  );
}
