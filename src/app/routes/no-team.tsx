import { Link } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { Empty } from '../../components/ui/panel';

/** Signed in but in no team yet. */
export function NoTeam({ title }: { title: string }) {
  return (
    <>
      <PageHeader title={title} />
      <Empty>
        You are not in a team yet.{' '}
        <Link to="/teams/new" className="text-accent-ink underline">
          Start one
        </Link>
        , or open the invitation link a team owner sent you.
      </Empty>
    </>
  );
}
