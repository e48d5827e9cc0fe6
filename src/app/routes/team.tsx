import { PageHeader } from '../../components/ui/page-header';

export function TeamRoute() {
  return (
    <>
      <PageHeader title="Team" lead="Members and their roles, invitations, import presets and thresholds." />
      <p className="rounded border border-dashed border-line bg-paper-raised p-6 text-sm text-ink-soft">
        Team management arrives with sign-in.
      </p>
    </>
  );
}
