import { useNavigate, useParams } from 'react-router-dom';
import { AuthCard } from '../../components/ui/auth-card';
import { InviteAcceptance } from '../../features/auth/components/invite-acceptance';
import { setActiveTeamId } from '../../features/session/active-team';
import { useMe, useSetMe } from '../../api/session';

export function InviteRoute() {
  const { token = '' } = useParams();
  const me = useMe();
  const setMe = useSetMe();
  const navigate = useNavigate();
  return (
    <AuthCard title="Join a team">
      <InviteAcceptance
        token={token}
        me={me.data}
        onJoined={(teamId) => {
          setActiveTeamId(teamId);
          void setMe(me.data ?? null);
          navigate('/', { replace: true });
        }}
        onSignedUp={(fresh) => {
          const joined = fresh.teams.at(-1);
          if (joined) setActiveTeamId(joined.id);
          void setMe(fresh);
          navigate('/', { replace: true });
        }}
      />
    </AuthCard>
  );
}
