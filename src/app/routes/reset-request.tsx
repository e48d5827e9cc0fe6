import { Link } from 'react-router-dom';
import { AuthCard } from '../../components/ui/auth-card';
import { ResetRequestForm } from '../../features/auth/components/reset-request-form';

export function ResetRequestRoute() {
  return (
    <AuthCard
      title="Reset your password"
      lead="We e-mail a link that lets you choose a new one."
      footer={
        <p>
          <Link className="text-accent-ink underline" to="/sign-in">
            Back to sign-in
          </Link>
        </p>
      }
    >
      <ResetRequestForm />
    </AuthCard>
  );
}
