import { useNavigate, useParams } from 'react-router-dom';
import { AuthCard } from '../../components/ui/auth-card';
import { ResetConfirmForm } from '../../features/auth/components/reset-confirm-form';
import { useSetMe } from '../../api/session';

export function ResetConfirmRoute() {
  const { token = '' } = useParams();
  const setMe = useSetMe();
  const navigate = useNavigate();
  return (
    <AuthCard title="Choose a new password">
      <ResetConfirmForm
        token={token}
        onDone={(me) => {
          void setMe(me);
          navigate('/', { replace: true });
        }}
      />
    </AuthCard>
  );
}
