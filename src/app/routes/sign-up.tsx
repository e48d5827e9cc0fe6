import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthCard } from '../../components/ui/auth-card';
import { SignUpForm } from '../../features/auth/components/sign-up-form';
import { useSetMe } from '../../api/session';
import { safeNext } from './safe-next';

export function SignUpRoute() {
  const [params] = useSearchParams();
  const setMe = useSetMe();
  const navigate = useNavigate();
  return (
    <AuthCard
      title="Create an account"
      lead="Then start a team, or join one through an invitation link."
      footer={
        <p>
          Have an account?{' '}
          <Link className="text-accent-ink underline" to="/sign-in">
            Sign in
          </Link>
        </p>
      }
    >
      <SignUpForm
        onSignedUp={(me) => {
          void setMe(me);
          navigate(me.teams.length === 0 ? '/teams/new' : safeNext(params.get('next')), {
            replace: true,
          });
        }}
      />
    </AuthCard>
  );
}
