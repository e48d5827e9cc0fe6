import { PageHeader } from '../../components/ui/page-header';

export function FleetRoute() {
  return (
    <>
      <PageHeader
        title="Fleet"
        lead="Every aircraft of your team with its last verdict and the flights waiting for review."
      />
      <p className="rounded border border-dashed border-line bg-paper-raised p-6 text-sm text-ink-soft">
        The fleet list arrives with team sign-in. Until then, import a log to read its verdict.
      </p>
    </>
  );
}
