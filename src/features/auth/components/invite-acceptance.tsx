import { Link } from 'react-router-dom';
import type { Me } from '../../../../shared/schemas/auth';
import { Alert, describeError } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/panel';
import { roleDescriptions, roleLabels } from '../../../lib/role-labels';
import { useAcceptInvite, useInvitePreview } from '../../../api/invites';
import { SignUpForm } from './sign-up-form';

/** What an invite link opens: who invites you to which team as what, and the way in. */
export function InviteAcceptance({
  token,
  me,
  onJoined,
  onSignedUp,
}: {
  token: string;
  me: Me | null | undefined;
  onJoined: (teamId: string) => void;
  onSignedUp: (me: Me) => void;
}) {
  const preview = useInvitePreview(token);
  const accept = useAcceptInvite();
  if (preview.isPending) return <Loading what="the invitation" />;
  if (preview.isError)
    return (
      <Alert tone="error">
        {describeError(preview.error)} Ask the team owner for a new invitation.
      </Alert>
    );
  const invite = preview.data;
  const next = encodeURIComponent(`/invite/${token}`);
  return (
    <div className="space-y-5">
      <div className="rounded border border-line bg-paper-sunk px-4 py-3 text-sm">
        <p>
          <strong>{invite.invitedBy}</strong> invites{' '}
          <span className="font-mono">{invite.email}</span> to <strong>{invite.teamName}</strong> as{' '}
          <strong>{roleLabels[invite.role]}</strong>.
        </p>
        <p className="mt-1 text-xs text-ink-soft">{roleDescriptions[invite.role]}</p>
        <p className="mt-1 text-xs text-ink-faint">
          Expires <span className="num">{new Date(invite.expiresAt).toLocaleString()}</span>
        </p>
      </div>
      {accept.isError && <Alert tone="error">{describeError(accept.error)}</Alert>}
      {me ? (
        <div className="space-y-2">
          <p className="text-sm text-ink-soft">
            Signed in as <strong>{me.email}</strong>.
          </p>
          <Button
            tone="primary"
            className="w-full"
            disabled={accept.isPending}
            onClick={() =>
              accept.mutate(token, { onSuccess: (answer) => onJoined(answer.team.id) })
            }
          >
            Join {invite.teamName}
          </Button>
        </div>
      ) : (
        <>
          <p className="text-sm text-ink-soft">
            Have an account?{' '}
            <Link to={`/sign-in?next=${next}`} className="text-accent-ink underline">
              Sign in first
            </Link>
            , then come back to this link. New here? Create your account:
          </p>
          <SignUpForm inviteToken={token} email={invite.email} onSignedUp={onSignedUp} />
        </>
      )}
    </div>
  );
}
