import { useNavigate } from 'react-router-dom';
import { AuthCard } from '../../components/ui/auth-card';
import { setActiveTeamId } from '../../features/session/active-team';
import { RequireSession } from '../../features/session/components/require-session';
import { CreateTeamForm } from '../../features/team/components/create-team-form';

export function NewTeamRoute() {
  const navigate = useNavigate();
  return (
    <RequireSession>
      <AuthCard
        title="Start a team"
        lead="You will be its owner and can invite pilots, tuners, coaches and viewers."
      >
        <CreateTeamForm
          onCreated={(team) => {
            setActiveTeamId(team.id);
            navigate('/', { replace: true });
          }}
        />
      </AuthCard>
    </RequireSession>
  );
}
