import { Link, useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { useSignOut } from '../../../api/session';
import { useMe } from '../../../api/session';

/** Who is signed in, with sign-out; or the way in. */
export function AccountMenu() {
  const me = useMe().data;
  const signOut = useSignOut();
  const navigate = useNavigate();
  if (!me)
    return (
      <Link
        to="/sign-in"
        className="rounded px-2 py-1 text-sm text-slate-brand hover:bg-paper-sunk"
      >
        Sign in
      </Link>
    );
  return (
    <div className="flex items-center gap-2 text-xs">
      <Link to="/account" className="text-ink-soft hover:text-ink hover:underline" title={me.email}>
        {me.name}
      </Link>
      <Button
        tone="quiet"
        size="sm"
        disabled={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in') })}
      >
        Sign out
      </Button>
    </div>
  );
}
