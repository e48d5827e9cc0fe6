import type { ReactNode } from 'react';
import { Link, Navigate, useLocation } from 'react-router-dom';
import { Alert, describeError } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/panel';
import { useMe } from '../../../api/session';

/**
 * Team pages need a signed-in user; import and review do not, so they are never wrapped in this.
 */
export function RequireSession({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.data) return <>{children}</>;
  if (me.data === null) {
    const next = location.pathname + location.search;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  if (me.isError)
    return (
      <div className="mx-auto max-w-lg py-10">
        <Alert tone="error">
          {describeError(me.error)} Team pages need the server;{' '}
          <Link to="/import" className="underline">
            importing and reading a log
          </Link>{' '}
          works without it.
        </Alert>
      </div>
    );
  return <Loading what="your account" />;
}
