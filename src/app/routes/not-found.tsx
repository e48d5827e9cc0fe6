import { Link } from 'react-router-dom';

export function NotFoundRoute() {
  return (
    <div className="py-16 text-center">
      <h1 className="text-xl font-semibold text-slate-brand">Nothing here</h1>
      <p className="mt-2 text-sm text-ink-soft">
        That page does not exist.{' '}
        <Link className="text-accent-ink underline" to="/">
          Back to the fleet
        </Link>
      </p>
    </div>
  );
}
