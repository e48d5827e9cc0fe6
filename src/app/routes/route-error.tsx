import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';

/** Last line of defence: shows what went wrong instead of a blank page. */
export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <div role="alert" className="mx-auto max-w-xl py-16">
      <h1 className="text-xl font-semibold text-sev-act">Something went wrong</h1>
      <p className="mt-2 font-mono text-sm text-ink-soft">{message}</p>
      <Link className="mt-4 inline-block text-accent-ink underline" to="/">
        Back to the fleet
      </Link>
    </div>
  );
}
