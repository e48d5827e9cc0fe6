import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthCard } from '../../components/ui/auth-card';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { useSetMe } from '../../api/session';
import { safeNext } from './safe-next';

export function SignInRoute() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const setMe = useSetMe();
  const navigate = useNavigate();
  return (
    <AuthCard
      title="Sign in"
      lead="Your team's fleet, flights and reviews. Importing a log works without an account."
      footer={
        <>
          <p>
            New here?{' '}
            <Link
              className="text-accent-ink underline"
              to={`/sign-up${next !== '/' ? `?next=${encodeURIComponent(next)}` : ''}`}
            >
              Create an account
            </Link>
          </p>
          <p>
            <Link className="text-accent-ink underline" to="/reset">
              Forgot your password?
            </Link>
          </p>
        </>
      }
    >
      <SignInForm
        onSignedIn={(me) => {
          void setMe(me);
          navigate(next, { replace: true });
        }}
      />
    </AuthCard>
  );
}
